// GET /api/seasons/:id/figures (JSON) and /api/seasons/:id/figures.csv. HTTP only; the sums
// are in figures.service.ts. Mounted at /api, each route with its own guard.
import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { actorOf, requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { figuresCsv, figuresFileName } from './figures-csv.js';
import { seasonFigures } from './figures.service.js';

const idParams = z.object({ id: uuidParam });

export function figuresRouter(ctx: AppContext): Router {
  const r = Router();
  r.get(
    '/seasons/:id/figures',
    requireActive(ctx),
    route({ params: idParams }, ({ params }, req) => seasonFigures(ctx.db, actorOf(req), params.id), { cacheIn: ctx.db }),
  );
  r.get(
    '/seasons/:id/figures.csv',
    requireActive(ctx),
    route({ params: idParams }, async ({ params }, req, res) => {
      const figures = await seasonFigures(ctx.db, actorOf(req), params.id);
      res
        .status(200)
        .set({
          'Content-Type': 'text/csv; charset=utf-8',
          'Content-Disposition': `attachment; filename="${figuresFileName(figures.season.name)}"`,
          'Cache-Control': 'private, no-store',
        })
        .send(figuresCsv(figures));
    }),
  );
  return r;
}
