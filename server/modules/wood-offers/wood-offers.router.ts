import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { offerInputSchema, pickupWindowSchema } from '../../../shared/schemas/seasons.js';
import { actorOf, requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { addWindow, deleteWindow, farmOffers, listWindows, setOffer, withdrawOffer } from './wood-offers.service.js';

export function woodOffersRouter(ctx: AppContext): Router {
  const r = Router();
  // Mounted at /api: guard each route, not the whole router, so unknown paths still 404.
  const active = requireActive(ctx);
  r.get(
    '/seasons/:seasonId/farms/:farmId/offers',
    active,
    route({ params: z.object({ seasonId: uuidParam, farmId: uuidParam }) }, async ({ params }, req) => {
      const items = await farmOffers(ctx.db, actorOf(req), params.seasonId, params.farmId);
      return { items, total: items.length };
    }, { cacheIn: ctx.db }),
  );
  r.put(
    '/seasons/:seasonId/offers/:plantId',
    active,
    route({ params: z.object({ seasonId: uuidParam, plantId: uuidParam }), body: offerInputSchema }, ({ params, body }, req) =>
      setOffer(ctx.db, actorOf(req), params.seasonId, params.plantId, body),
    ),
  );
  r.delete(
    '/seasons/:seasonId/offers/:plantId',
    active,
    route({ params: z.object({ seasonId: uuidParam, plantId: uuidParam }) }, async ({ params }, req) => {
      await withdrawOffer(ctx.db, actorOf(req), params.seasonId, params.plantId);
    }),
  );
  r.get(
    '/seasons/:seasonId/windows',
    active,
    route({ params: z.object({ seasonId: uuidParam }), query: z.object({ farmId: uuidParam.optional() }) }, async ({ params, query }) => {
      const items = await listWindows(ctx.db, params.seasonId, query.farmId);
      return { items, total: items.length };
    }, { cacheIn: ctx.db }),
  );
  r.post(
    '/seasons/:seasonId/farms/:farmId/windows',
    active,
    route({ params: z.object({ seasonId: uuidParam, farmId: uuidParam }), body: pickupWindowSchema }, ({ params, body }, req) =>
      addWindow(ctx.db, actorOf(req), params.seasonId, params.farmId, body),
    { status: 201 }),
  );
  r.delete(
    '/windows/:windowId',
    active,
    route({ params: z.object({ windowId: uuidParam }) }, async ({ params }, req) => {
      await deleteWindow(ctx.db, actorOf(req), params.windowId);
    }),
  );
  return r;
}
