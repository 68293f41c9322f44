import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { farmMembershipSchema } from '../../../shared/schemas/members.js';
import { actorOf, requireActive, requireCoordinator } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { listFarms } from './farms.repo.js';
import { removeFromFarm, setFarmRole } from './farms.service.js';

const membershipParams = z.object({ farmId: uuidParam, userId: z.string().min(1) });

export function farmsRouter(ctx: AppContext): Router {
  const r = Router();
  r.get(
    '/',
    requireActive(ctx),
    route({}, async () => {
      const items = await listFarms(ctx.db);
      return { items, total: items.length };
    }, { cacheIn: ctx.db }),
  );
  r.put(
    '/:farmId/members/:userId',
    requireCoordinator(ctx),
    route({ params: membershipParams, body: farmMembershipSchema }, ({ params, body }, req) =>
      setFarmRole(ctx.db, actorOf(req).id, params.farmId, params.userId, body.farmRole),
    ),
  );
  r.delete(
    '/:farmId/members/:userId',
    requireCoordinator(ctx),
    route({ params: membershipParams }, async ({ params }, req) => {
      await removeFromFarm(ctx.db, actorOf(req).id, params.farmId, params.userId);
    }),
  );
  return r;
}
