import type { FastifyPluginAsync } from 'fastify';
import type { ServerConfig } from '../../config.js';
import { budgetRoutes } from './budgets.js';
import { catalogRoutes } from './catalogs/index.js';
import { healthRoutes } from './health.js';
import { sightlineRoutes } from './sightlines/index.js';

/** Every route under /v1. */
export const v1Routes: FastifyPluginAsync<{ config: ServerConfig }> = async (app, { config }) => {
  await app.register(healthRoutes);
  await app.register(catalogRoutes, { config });
  await app.register(sightlineRoutes, { config });
  await app.register(budgetRoutes, { config });
};
