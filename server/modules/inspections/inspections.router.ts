import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { inspectionCreateSchema } from '../../../shared/schemas/health.js';
import { actorOf, requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { recordInspection } from './inspections.service.js';

export function inspectionsRouter(ctx: AppContext): Router {
  const r = Router();
  r.post(
    '/mother-plants/:id/inspections',
    requireActive(ctx),
    route({ params: z.object({ id: uuidParam }), body: inspectionCreateSchema }, ({ params, body }, req) =>
      recordInspection(ctx.db, actorOf(req), params.id, body),
    { status: 201 }),
  );
  return r;
}
