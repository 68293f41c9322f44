// CSV export and import of mother plants. Mounted on /api/mother-plants before the /:id
// routes, which would otherwise read "export.csv" and "import" as plant ids.
//
// POST /import takes the CSV itself as the body (Content-Type text/csv or text/plain, up to
// 5 MB), or JSON { "csv": "..." } (the app's JSON parser limits that to 1 MB).
// ?dryRun=true checks without writing; without it, or with dryRun=false, a clean file is
// imported. Any problem answers 400 with the full report, and nothing is written.
import express, { Router } from 'express';
import { z } from 'zod';
import { plantListQuerySchema } from '../../../shared/schemas/register.js';
import { actorOf, requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { badRequest } from '../../lib/http-error.js';
import { route } from '../../lib/route.js';
import { exportFileName, exportPlantsCsv, importPlantsCsv } from './plants-csv.service.js';

const importQuerySchema = z.object({
  dryRun: z
    .enum(['true', 'false'], { error: 'dryRun must be true or false' })
    .default('false')
    .transform((v) => v === 'true'),
});

const jsonBodySchema = z.object({ csv: z.string({ error: 'csv must be the text of the file' }) });

export function plantsCsvRouter(ctx: AppContext): Router {
  const r = Router();

  // Guards sit on each route, not on the router: this router shares its mount path with
  // the plant routes, and requests it does not answer pass through untouched.
  r.get(
    '/export.csv',
    requireActive(ctx),
    route({ query: plantListQuerySchema }, async ({ query }, req, res) => {
      const csv = await exportPlantsCsv(ctx.db, actorOf(req), query);
      res
        .status(200)
        .set({
          'Content-Type': 'text/csv; charset=utf-8',
          'Content-Disposition': `attachment; filename="${exportFileName()}"`,
          'Cache-Control': 'private, no-store',
        })
        .send(csv);
    }),
  );

  r.post(
    '/import',
    requireActive(ctx),
    express.text({ type: ['text/csv', 'text/plain'], limit: '5mb' }),
    route({ query: importQuerySchema }, async ({ query }, req, res) => {
      const text = csvText(req.body);
      const report = await importPlantsCsv(ctx.db, actorOf(req), text, { dryRun: query.dryRun });
      if (report.errors.length) {
        const n = new Set(report.errors.map((e) => e.row)).size;
        res.status(400).json({
          error: { code: 'csv_invalid', message: `${n} ${n === 1 ? 'row has' : 'rows have'} problems; nothing was imported`, fields: {} },
          report,
        });
        return;
      }
      res.status(query.dryRun ? 200 : 201).json(report);
    }),
  );
  return r;
}

function csvText(body: unknown): string {
  if (typeof body === 'string') return body;
  const json = jsonBodySchema.safeParse(body);
  if (json.success) return json.data.csv;
  throw badRequest('Send the CSV file as the body with Content-Type text/csv, or as JSON { "csv": "..." }.', { csv: 'missing' });
}
