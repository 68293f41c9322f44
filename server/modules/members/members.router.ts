import { Router } from 'express';
import { z } from 'zod';
import { memberListQuerySchema, memberPatchSchema } from '../../../shared/schemas/members.js';
import { actorOf, requireCoordinator, requireUser } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { listMembers } from './members.repo.js';
import { patchMember } from './members.service.js';

export function meRouter(ctx: AppContext): Router {
  const r = Router();
  r.get(
    '/',
    requireUser(ctx),
    route({}, (_i, req) => {
      const { farms, ...user } = actorOf(req);
      return { user, farms };
    }, { cacheIn: ctx.db }),
  );
  return r;
}

export function membersRouter(ctx: AppContext): Router {
  const r = Router();
  r.use(requireCoordinator(ctx));
  r.get(
    '/',
    route({ query: memberListQuerySchema }, ({ query }) => listMembers(ctx.db, query), { cacheIn: ctx.db }),
  );
  r.patch(
    '/:id',
    route({ params: z.object({ id: z.string().min(1) }), body: memberPatchSchema }, ({ params, body }, req) =>
      patchMember(ctx.db, actorOf(req).id, params.id, body),
    ),
  );
  return r;
}
