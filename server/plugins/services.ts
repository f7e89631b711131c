import type { FastifyInstance } from 'fastify';
import fp from 'fastify-plugin';
import type { AppServices } from '../services/types.js';

declare module 'fastify' {
  interface FastifyInstance {
    services: AppServices;
  }
}

/** Makes the store and engines available to routes as `app.services`; closes the store on shutdown. */
export const servicesPlugin = fp<{ services: AppServices }>(
  async (app: FastifyInstance, options) => {
    app.decorate('services', options.services);
    app.addHook('onClose', async () => {
      await options.services.store.close();
    });
  },
  { name: 'forehalo-services' },
);
