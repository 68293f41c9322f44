import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';
import { HEMISPHERES, SEASON_KINDS } from '../../../shared/domain.js';
import { STAGE_MOVES, suggestSeasonDates } from '../../../shared/seasons.js';
import { uuidParam } from '../../../shared/schemas/common.js';
import { seasonCreateSchema, seasonStageSchema } from '../../../shared/schemas/seasons.js';
import { actorOf, requireActive, requireCoordinator } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { seasons } from '../../db/schema/index.js';
import { conflict, notFound } from '../../lib/http-error.js';
import { route } from '../../lib/route.js';
import { writeAudit } from '../audit/audit.repo.js';
import { getSetting } from '../cooperative/cooperative.repo.js';
import { getSeason, listSeasons, seasonRow } from './seasons.repo.js';

const idParams = z.object({ id: uuidParam });

export function seasonsRouter(ctx: AppContext): Router {
  const r = Router();
  r.get(
    '/',
    requireActive(ctx),
    route({}, async () => {
      const items = await listSeasons(ctx.db);
      return { items, total: items.length };
    }, { cacheIn: ctx.db }),
  );
  r.get(
    '/suggest',
    requireCoordinator(ctx),
    route(
      {
        query: z.object({
          kind: z.enum(SEASON_KINDS, { error: 'kind must be dormant_hardwood, leafy_summer or scion' }),
          hemisphere: z.enum(HEMISPHERES).optional(),
        }),
      },
      async ({ query }) => {
        const coop = await getSetting<{ hemisphere?: 'north' | 'south' }>(ctx.db, 'cooperative');
        const hemisphere = query.hemisphere ?? coop?.hemisphere ?? 'north';
        return { hemisphere, ...suggestSeasonDates(query.kind, hemisphere, new Date()) };
      },
    ),
  );
  r.get(
    '/:id',
    requireActive(ctx),
    route({ params: idParams }, async ({ params }) => (await getSeason(ctx.db, params.id)) ?? Promise.reject(notFound('That season')), { cacheIn: ctx.db }),
  );
  r.post(
    '/',
    requireCoordinator(ctx),
    route({ body: seasonCreateSchema }, async ({ body }, req) => {
      const [row] = await ctx.db
        .insert(seasons)
        .values({ ...body, requestDeadline: new Date(body.requestDeadline), createdBy: actorOf(req).id })
        .returning();
      return getSeason(ctx.db, row.id);
    }, { status: 201 }),
  );
  r.post(
    '/:id/stage',
    requireCoordinator(ctx),
    route({ params: idParams, body: seasonStageSchema }, async ({ params, body }, req) => {
      await ctx.db.transaction(async (tx) => {
        const s = await seasonRow(tx, params.id, true);
        if (!s) throw notFound('That season');
        if (!STAGE_MOVES[s.stage].includes(body.stage)) {
          throw conflict(`A season in ${s.stage} cannot move to ${body.stage}.`, { stage: `from ${s.stage}: ${STAGE_MOVES[s.stage].join(' or ') || 'no further stage'}` });
        }
        await tx.update(seasons).set({ stage: body.stage }).where(eq(seasons.id, s.id));
        await writeAudit(tx, { actorId: actorOf(req).id, entity: 'season', entityId: s.id, action: 'stage', before: { stage: s.stage }, after: { stage: body.stage } });
      });
      return getSeason(ctx.db, params.id);
    }),
  );
  return r;
}
