import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { liftHoldSchema, plantCreateSchema, plantListQuerySchema, plantUpdateSchema, retireSchema } from '../../../shared/schemas/register.js';
import { actorOf, requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { createPlant, editPlant, liftHold, listForActor, plantDetail, retirePlant } from './mother-plants.service.js';

const idParams = z.object({ id: uuidParam });

export function motherPlantsRouter(ctx: AppContext): Router {
  const r = Router();
  r.use(requireActive(ctx));

  r.get(
    '/',
    route({ query: plantListQuerySchema }, ({ query }, req) => listForActor(ctx.db, actorOf(req), query), { cacheIn: ctx.db }),
  );
  r.post(
    '/',
    route({ body: plantCreateSchema }, async ({ body }, req) => {
      const row = await createPlant(ctx.db, actorOf(req), body);
      return plantDetail(ctx.db, actorOf(req), row.id);
    }, { status: 201 }),
  );
  r.get(
    '/:id',
    route({ params: idParams }, ({ params }, req) => plantDetail(ctx.db, actorOf(req), params.id), { cacheIn: ctx.db }),
  );
  r.patch(
    '/:id',
    route({ params: idParams, body: plantUpdateSchema }, async ({ params, body }, req) => {
      await editPlant(ctx.db, actorOf(req), params.id, body);
      return plantDetail(ctx.db, actorOf(req), params.id);
    }),
  );
  r.post(
    '/:id/retire',
    route({ params: idParams, body: retireSchema }, async ({ params, body }, req) => {
      await retirePlant(ctx.db, actorOf(req), params.id, body.reason);
      return plantDetail(ctx.db, actorOf(req), params.id);
    }),
  );
  r.post(
    '/:id/lift-hold',
    route({ params: idParams, body: liftHoldSchema }, async ({ params, body }, req) => {
      await liftHold(ctx.db, actorOf(req), params.id, body.to, body.reason);
      return plantDetail(ctx.db, actorOf(req), params.id);
    }),
  );
  return r;
}
