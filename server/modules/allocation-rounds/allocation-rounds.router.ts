import { Router } from 'express';
import { z } from 'zod';
import { bundleAddSchema, bundleEditSchema } from '../../../shared/schemas/allocation.js';
import { uuidParam } from '../../../shared/schemas/common.js';
import { actorOf, requireCoordinator } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { listRounds } from './allocation-rounds.repo.js';
import { notifyRound } from './allocation-notify.js';
import { addBundle, approveRound, editBundle, removeBundle, rerunRound, roundView, startRound } from './allocation-rounds.service.js';

const waitQuery = z.object({ wait: z.enum(['true', 'false']).optional() });
const roundParams = z.object({ roundId: uuidParam });
const bundleParams = z.object({ roundId: uuidParam, bundleId: uuidParam });

/** Coordinator only: run, review, edit, approve allocation rounds. Mounted at /api. */
export function allocationRoundsRouter(ctx: AppContext): Router {
  const r = Router();
  const coord = requireCoordinator(ctx);
  r.get(
    '/seasons/:seasonId/rounds',
    coord,
    route({ params: z.object({ seasonId: uuidParam }) }, async ({ params }) => {
      const rows = await listRounds(ctx.db, params.seasonId);
      return { items: rows.map((x) => ({ ...x, createdAt: x.createdAt.toISOString(), approvedAt: x.approvedAt?.toISOString() ?? null })), total: rows.length };
    }),
  );
  r.post(
    '/seasons/:seasonId/rounds',
    coord,
    route({ params: z.object({ seasonId: uuidParam }), query: waitQuery }, async ({ params, query }, req) => {
      const id = await startRound(ctx, actorOf(req), params.seasonId, query.wait === 'true');
      return roundView(ctx.db, id);
    }, { status: 202 }),
  );
  r.get('/rounds/:roundId', coord, route({ params: roundParams }, ({ params }) => roundView(ctx.db, params.roundId)));
  r.post(
    '/rounds/:roundId/rerun',
    coord,
    route({ params: roundParams, query: waitQuery }, async ({ params, query }) => {
      await rerunRound(ctx, params.roundId, query.wait === 'true');
      return roundView(ctx.db, params.roundId);
    }, { status: 202 }),
  );
  r.patch(
    '/rounds/:roundId/bundles/:bundleId',
    coord,
    route({ params: bundleParams, body: bundleEditSchema }, async ({ params, body }, req) => {
      await editBundle(ctx.db, actorOf(req), params.roundId, params.bundleId, body.cuttings);
      return roundView(ctx.db, params.roundId);
    }),
  );
  r.post(
    '/rounds/:roundId/bundles',
    coord,
    route({ params: roundParams, body: bundleAddSchema }, async ({ params, body }, req) => {
      await addBundle(ctx.db, actorOf(req), params.roundId, body);
      return roundView(ctx.db, params.roundId);
    }, { status: 201 }),
  );
  r.delete(
    '/rounds/:roundId/bundles/:bundleId',
    coord,
    route({ params: bundleParams }, async ({ params }, req) => {
      await removeBundle(ctx.db, actorOf(req), params.roundId, params.bundleId);
      return roundView(ctx.db, params.roundId);
    }),
  );
  r.post(
    '/rounds/:roundId/approve',
    coord,
    route({ params: roundParams }, async ({ params }, req) => {
      const mail = await approveRound(ctx, actorOf(req), params.roundId);
      return { round: await roundView(ctx.db, params.roundId), mail };
    }),
  );
  r.post(
    '/rounds/:roundId/resend',
    coord,
    route({ params: roundParams }, async ({ params }) => {
      const mail = await notifyRound(ctx, params.roundId);
      return { round: await roundView(ctx.db, params.roundId), mail };
    }),
  );
  return r;
}
