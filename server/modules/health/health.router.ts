import { asc } from 'drizzle-orm';
import { Router } from 'express';
import { districtNoteSchema, pestSchema } from '../../../shared/schemas/health.js';
import { actorOf, requireActive, requireCoordinator } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { districtNotes, pests } from '../../db/schema/index.js';
import { route } from '../../lib/route.js';
import { healthOverview } from './health.service.js';

export function healthRouter(ctx: AppContext): Router {
  const r = Router();
  // The catalogue of pests and diseases is read by everyone who records inspections.
  r.get(
    '/pests',
    requireActive(ctx),
    route({}, async () => {
      const items = await ctx.db.select().from(pests).orderBy(asc(pests.name));
      return { items, total: items.length };
    }, { cacheIn: ctx.db }),
  );
  r.post(
    '/pests',
    requireCoordinator(ctx),
    route({ body: pestSchema }, async ({ body }) => (await ctx.db.insert(pests).values(body).returning())[0], { status: 201 }),
  );
  r.get(
    '/health/overview',
    requireCoordinator(ctx),
    route({}, () => healthOverview(ctx.db), { cacheIn: ctx.db }),
  );
  // Any active member may report what they saw in the district; the coordinator reads it.
  r.post(
    '/health/notes',
    requireActive(ctx),
    route({ body: districtNoteSchema }, async ({ body }, req) => {
      const [row] = await ctx.db
        .insert(districtNotes)
        .values({ ...body, lat: body.lat ?? null, lon: body.lon ?? null, authorId: actorOf(req).id })
        .returning();
      return row;
    }, { status: 201 }),
  );
  return r;
}
