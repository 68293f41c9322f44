import { and, eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';
import { collectionSchema } from '../../../shared/schemas/allocation.js';
import { uuidParam } from '../../../shared/schemas/common.js';
import { actorOf, farmRoleOf, requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { allocationRounds, bundles } from '../../db/schema/index.js';
import { conflict, forbidden, notFound } from '../../lib/http-error.js';
import { route } from '../../lib/route.js';
import { writeAudit } from '../audit/audit.repo.js';
import { isCoordinator } from '../mother-plants/plant-access.js';
import { farmCollections, pickupSlip } from './pickup-slip.js';

/** Pickups for growers, collections for farms. Mounted at /api. */
export function bundlesRouter(ctx: AppContext): Router {
  const r = Router();
  const active = requireActive(ctx);
  r.get(
    '/seasons/:seasonId/my-pickups',
    active,
    route({ params: z.object({ seasonId: uuidParam }) }, async ({ params }, req) => ({ slip: await pickupSlip(ctx.db, actorOf(req).id, params.seasonId) }), { cacheIn: ctx.db }),
  );
  r.get(
    '/seasons/:seasonId/farms/:farmId/collections',
    active,
    route({ params: z.object({ seasonId: uuidParam, farmId: uuidParam }) }, async ({ params }, req) => {
      const a = actorOf(req);
      if (!isCoordinator(a) && !farmRoleOf(a, params.farmId)) throw forbidden('Only the people of that farm, or a coordinator, see its collections.');
      const items = await farmCollections(ctx.db, params.farmId, params.seasonId);
      return { items, total: items.length };
    }, { cacheIn: ctx.db }),
  );
  r.post(
    '/bundles/:bundleId/collection',
    active,
    route({ params: z.object({ bundleId: uuidParam }), body: collectionSchema }, async ({ params, body }, req) => {
      const a = actorOf(req);
      return ctx.db.transaction(async (tx) => {
        const [b] = await tx
          .select({ b: bundles, roundStatus: allocationRounds.status })
          .from(bundles)
          .innerJoin(allocationRounds, eq(allocationRounds.id, bundles.roundId))
          .where(eq(bundles.id, params.bundleId))
          .for('update');
        if (!b) throw notFound('That bundle');
        if (!isCoordinator(a) && !farmRoleOf(a, b.b.farmId)) throw forbidden("Only the farm's people, or a coordinator, mark collections.");
        if (b.roundStatus !== 'approved' && b.roundStatus !== 'notified') throw conflict('The bundle is not approved yet.');
        if (b.b.status === 'cancelled') throw conflict('The bundle was cancelled.');
        const [row] = await tx
          .update(bundles)
          .set(body.collected ? { status: 'collected', collectedAt: new Date() } : { status: 'reserved', collectedAt: null })
          .where(and(eq(bundles.id, params.bundleId)))
          .returning();
        await writeAudit(tx, { actorId: a.id, entity: 'bundle', entityId: row.id, action: body.collected ? 'collected' : 'not_collected', before: { status: b.b.status }, after: { status: row.status } });
        return row;
      });
    }),
  );
  return r;
}
