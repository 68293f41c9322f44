import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { speciesPatchSchema, speciesSchema, varietyPatchSchema, varietySchema } from '../../../shared/schemas/register.js';
import { actorOf, requireActive, requireCoordinator } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { species, varieties } from '../../db/schema/index.js';
import { badRequest, notFound } from '../../lib/http-error.js';
import { route } from '../../lib/route.js';
import { writeAudit } from '../audit/audit.repo.js';
import { findSpecies, listSpecies } from './species.repo.js';

const idParams = z.object({ id: uuidParam });

/** Species and their varieties: everyone reads, the coordinator keeps the lists. */
export function speciesRouter(ctx: AppContext): Router {
  const r = Router();
  r.get(
    '/',
    requireActive(ctx),
    route({}, async () => {
      const items = await listSpecies(ctx.db);
      return { items, total: items.length };
    }, { cacheIn: ctx.db }),
  );
  r.post(
    '/',
    requireCoordinator(ctx),
    route({ body: speciesSchema }, async ({ body }, req) => {
      const [row] = await ctx.db.insert(species).values(body).returning();
      await writeAudit(ctx.db, { actorId: actorOf(req).id, entity: 'species', entityId: row.id, action: 'create', after: body });
      return row;
    }, { status: 201 }),
  );
  r.patch(
    '/:id',
    requireCoordinator(ctx),
    route({ params: idParams, body: speciesPatchSchema }, async ({ params, body }, req) => {
      return ctx.db.transaction(async (tx) => {
        const before = await findSpecies(tx, params.id);
        if (!before) throw notFound('That species');
        const [row] = await tx.update(species).set(body).where(eq(species.id, params.id)).returning();
        await writeAudit(tx, { actorId: actorOf(req).id, entity: 'species', entityId: row.id, action: 'edit', after: body });
        return row;
      });
    }),
  );
  r.post(
    '/varieties',
    requireCoordinator(ctx),
    route({ body: varietySchema }, async ({ body }) => {
      if (!(await findSpecies(ctx.db, body.speciesId))) throw badRequest('Choose a species from the list.', { speciesId: 'unknown species' });
      const [row] = await ctx.db.insert(varieties).values(body).returning();
      return row;
    }, { status: 201 }),
  );
  r.patch(
    '/varieties/:id',
    requireCoordinator(ctx),
    route({ params: idParams, body: varietyPatchSchema }, async ({ params, body }) => {
      const [row] = await ctx.db.update(varieties).set(body).where(eq(varieties.id, params.id)).returning();
      if (!row) throw notFound('That variety');
      return row;
    }),
  );
  return r;
}
