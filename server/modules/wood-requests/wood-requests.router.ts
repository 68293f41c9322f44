import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { woodRequestSchema } from '../../../shared/schemas/seasons.js';
import { actorOf, requireActive, requireCoordinator } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { myRequest, saveRequest, seasonRequests, withdrawRequest, woodBoard } from './wood-requests.service.js';

const seasonParams = z.object({ seasonId: uuidParam });

export function woodRequestsRouter(ctx: AppContext): Router {
  const r = Router();
  const active = requireActive(ctx);
  r.get('/seasons/:seasonId/my-request', active, route({ params: seasonParams }, async ({ params }, req) => ({ request: await myRequest(ctx.db, actorOf(req), params.seasonId) }), { cacheIn: ctx.db }));
  r.put(
    '/seasons/:seasonId/my-request',
    active,
    route({ params: seasonParams, body: woodRequestSchema }, async ({ params, body }, req) => ({ request: await saveRequest(ctx.db, actorOf(req), params.seasonId, body) })),
  );
  r.post(
    '/seasons/:seasonId/my-request/withdraw',
    active,
    route({ params: seasonParams }, async ({ params }, req) => ({ request: await withdrawRequest(ctx.db, actorOf(req), params.seasonId) })),
  );
  r.get(
    '/seasons/:seasonId/requests',
    requireCoordinator(ctx),
    route({ params: seasonParams }, async ({ params }) => {
      const items = await seasonRequests(ctx.db, params.seasonId);
      return { items, total: items.length };
    }, { cacheIn: ctx.db }),
  );
  r.get(
    '/seasons/:seasonId/board',
    active,
    route(
      {
        params: seasonParams,
        query: z
          .object({ lat: z.coerce.number().min(-90).max(90).optional(), lon: z.coerce.number().min(-180).max(180).optional() })
          .refine((v) => (v.lat == null) === (v.lon == null), { message: 'Give both lat and lon, or neither', path: ['lat'] }),
      },
      async ({ params, query }) => {
        const items = await woodBoard(ctx.db, params.seasonId, query.lat != null && query.lon != null ? { lat: query.lat, lon: query.lon } : null);
        return { items, total: items.length };
      },
      { cacheIn: ctx.db },
    ),
  );
  return r;
}
