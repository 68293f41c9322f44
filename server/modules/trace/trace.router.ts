// Trace, exposure and health notices. HTTP and validation only; the rules are in
// trace.service.ts. Mounted at /api, each route with its own guard.
import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { exposureQuerySchema, noticeSchema } from '../../../shared/schemas/trace.js';
import { actorOf, requireActive, requireCoordinator } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { exposureOf, sendNotices, traceOf } from './trace.service.js';

const idParams = z.object({ id: uuidParam });

export function traceRouter(ctx: AppContext): Router {
  const r = Router();
  r.get(
    '/mother-plants/:id/trace',
    requireActive(ctx),
    route({ params: idParams }, ({ params }, req) => traceOf(ctx.db, actorOf(req), params.id), { cacheIn: ctx.db }),
  );
  r.get(
    '/mother-plants/:id/exposure',
    requireCoordinator(ctx),
    route({ params: idParams, query: exposureQuerySchema }, ({ params, query }) => exposureOf(ctx.db, params.id, query.findingId), { cacheIn: ctx.db }),
  );
  r.post(
    '/mother-plants/:id/notices',
    requireCoordinator(ctx),
    route({ params: idParams, body: noticeSchema }, ({ params, body }, req) => sendNotices(ctx, actorOf(req), params.id, body)),
  );
  return r;
}
