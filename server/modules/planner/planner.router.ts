// POST /api/planner/estimate: how many cuttings a planting needs and how well they will fill
// it. HTTP and validation only; the rules are in planner.service.ts.
import { Router } from 'express';
import { plannerEstimateSchema } from '../../../shared/schemas/planner.js';
import { requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { estimatePlanting } from './planner.service.js';

/** Mounted at /api/planner. Admitted members and coordinators. */
export function plannerRouter(ctx: AppContext): Router {
  const r = Router();
  r.post(
    '/estimate',
    requireActive(ctx),
    route({ body: plannerEstimateSchema }, ({ body }) => estimatePlanting(ctx.db, body)),
  );
  return r;
}
