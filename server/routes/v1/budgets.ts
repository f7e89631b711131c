import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { computeBudget } from '../../../src/budget-request/index.js';
import type { SightlineResponse } from '../../../src/sightline/index.js';
import type { ServerConfig } from '../../config.js';
import { budgetReply, budgetRequest } from '../../schemas/budget.js';
import { errorBody } from '../../schemas/primitives.js';
import { checkDrawLimit } from './sightlines/draw-limit.js';

/** POST /v1/budgets: the burst's whole DM budget, optionally with the foreground term of a sightline. */
export const budgetRoutes: FastifyPluginAsyncZod<{ config: ServerConfig }> = async (app, { config }) => {
  app.post(
    '/v1/budgets',
    {
      config: { access: 'read' },
      schema: {
        tags: ['budgets'],
        summary:
          'DM budget of a burst: Galactic, cosmic, foreground-halo and host terms with Monte Carlo uncertainties',
        description:
          'DM_obs = DM_MW,ISM + DM_MW,halo + DM_cosmic + DM_haloes + DM_host,rest/(1 + z_s). With `z_source` the ' +
          'reply carries the host rest-frame posterior (`host_rest`, `p_negative_host`); without it, ' +
          '`redshift_limit` and `redshift_posterior` instead. `sightline` runs the sightline engine and uses its ' +
          'per-draw foreground-halo totals; `halos` takes a pipeline’s own term. forehalo ships no Galactic ' +
          'electron-density model: `dm_ism` is the caller’s value. Every number is model-dependent (Macquart ' +
          'relation and its PDF, f_d or f_igm, F, Milky Way priors, halo models); read `conventions`, ' +
          '`warnings` and `cautions`.',
        body: budgetRequest,
        response: { 200: budgetReply, 400: errorBody, 401: errorBody, 404: errorBody, 413: errorBody },
      },
    },
    async (request) => {
      const body = request.body;
      checkDrawLimit(body.budget_model?.draws, config.maxDraws, 'body.budget_model.draws');
      checkDrawLimit(body.sightline?.model?.draws, config.maxDraws, 'body.sightline.model.draws');
      const runSightline = async (r: unknown) => (await app.services.sightlines.run(r)) as SightlineResponse;
      return computeBudget({ runSightline }, body);
    },
  );
};
