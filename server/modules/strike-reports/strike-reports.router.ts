// Strike reports, plants raised from bundles, and the strike-rate table. HTTP and validation
// only; the rules are in strike-reports.service.ts. Mounted at /api: every route carries its
// own guard (a router.use() guard here would answer 401 for every unknown /api path).
import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { raisePlantsSchema, strikeRatesQuerySchema, strikeReportCreateSchema } from '../../../shared/schemas/strike-reports.js';
import { actorOf, requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { photosDir } from '../photos/photos.service.js';
import { fileStrikeReport, myBundles, raisePlants, removeStrikeReport, strikeRateTable } from './strike-reports.service.js';

const bundleParams = z.object({ bundleId: uuidParam });

export function strikeReportsRouter(ctx: AppContext): Router {
  const r = Router();
  const active = requireActive(ctx);
  r.get(
    '/my/bundles',
    active,
    route({}, (_input, req) => myBundles(ctx.db, actorOf(req)), { cacheIn: ctx.db }),
  );
  r.post(
    '/bundles/:bundleId/strike-reports',
    active,
    route({ params: bundleParams, body: strikeReportCreateSchema }, ({ params, body }, req) => fileStrikeReport(ctx.db, actorOf(req), params.bundleId, body), { status: 201 }),
  );
  r.delete(
    '/strike-reports/:id',
    active,
    route({ params: z.object({ id: uuidParam }) }, async ({ params }, req) => {
      await removeStrikeReport(ctx.db, photosDir(ctx.config), actorOf(req), params.id);
    }),
  );
  r.post(
    '/bundles/:bundleId/raise-plants',
    active,
    route({ params: bundleParams, body: raisePlantsSchema }, ({ params, body }, req) => raisePlants(ctx.db, actorOf(req), params.bundleId, body), { status: 201 }),
  );
  r.get(
    '/strike-rates',
    active,
    route({ query: strikeRatesQuerySchema }, async ({ query }) => {
      const items = await strikeRateTable(ctx.db, query);
      return { items, total: items.length };
    }, { cacheIn: ctx.db }),
  );
  return r;
}
