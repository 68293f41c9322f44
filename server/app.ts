// Builds the Express app from a context; importable by tests, started by index.ts.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { toNodeHandler } from 'better-auth/node';
import express, { type Express } from 'express';
import { CLIENT_IP_HEADER } from './auth/auth.js';
import { authFormsRouter } from './auth/auth.router.js';
import type { AppContext } from './context.js';
import { errorHandler } from './lib/error-handler.js';
import { sameOriginWrites, securityHeaders } from './lib/security.js';
import { HttpError } from './lib/http-error.js';
import { cooperativeRouter } from './modules/cooperative/cooperative.router.js';
import { farmsRouter } from './modules/farms/farms.router.js';
import { mailRouter } from './modules/mail/mail.router.js';
import { meRouter, membersRouter } from './modules/members/members.router.js';
import { motherPlantsRouter } from './modules/mother-plants/mother-plants.router.js';
import { healthRouter } from './modules/health/health.router.js';
import { inspectionsRouter } from './modules/inspections/inspections.router.js';
import { speciesRouter } from './modules/species/species.router.js';
import { photosRouter } from './modules/photos/photos.router.js';
import { seasonsRouter } from './modules/seasons/seasons.router.js';
import { woodOffersRouter } from './modules/wood-offers/wood-offers.router.js';
import { woodRequestsRouter } from './modules/wood-requests/wood-requests.router.js';
import { plannerRouter } from './modules/planner/planner.router.js';
import { allocationRoundsRouter } from './modules/allocation-rounds/allocation-rounds.router.js';
import { bundlesRouter } from './modules/bundles/bundles.router.js';
import { tilesRouter } from './modules/map/tiles.router.js';
import { strikeReportsRouter } from './modules/strike-reports/strike-reports.router.js';
import { traceRouter } from './modules/trace/trace.router.js';
import { figuresRouter } from './modules/figures/figures.router.js';
import { mapRouter } from './modules/map/map.router.js';
import { plantsCsvRouter } from './modules/mother-plants/plants-csv.router.js';

export async function createApp(ctx: AppContext): Promise<Express> {
  const app = express();
  app.disable('x-powered-by');
  // Which proxies may say who the client is (X-Forwarded-For); off unless TRUST_PROXY is set.
  app.set('trust proxy', ctx.config.trustProxy);
  if (ctx.config.logRequests) {
    app.use((req, res, next) => {
      const t = performance.now();
      res.on('finish', () => console.log(`${req.method} ${req.originalUrl} ${res.statusCode} ${(performance.now() - t).toFixed(1)}ms`));
      next();
    });
  }

  app.use(securityHeaders(ctx.config));
  app.use('/api', sameOriginWrites(ctx.config));

  app.get('/api/health', (_req, res) => {
    res.json({ ok: true });
  });

  // better-auth rate-limits by client address: hand it Express's view of it, never the
  // caller's own header.
  app.use('/api/auth', (req, _res, next) => {
    req.headers[CLIENT_IP_HEADER] = req.ip ?? req.socket.remoteAddress ?? '';
    next();
  });
  // better-auth reads its own request bodies: mount it before express.json().
  app.use('/api/auth', authFormsRouter(ctx));
  app.all('/api/auth/*splat', toNodeHandler(ctx.auth));

  app.use('/api', express.json({ limit: '1mb' }));
  app.use('/api/cooperative', cooperativeRouter(ctx));
  app.use('/api/me', meRouter(ctx));
  app.use('/api/members', membersRouter(ctx));
  app.use('/api/farms', farmsRouter(ctx));
  app.use('/api/mail', mailRouter(ctx));
  app.use('/api/species', speciesRouter(ctx));
  app.use('/api', inspectionsRouter(ctx));
  app.use('/api/mother-plants', plantsCsvRouter(ctx));
  app.use('/api/mother-plants', motherPlantsRouter(ctx));
  app.use('/api', healthRouter(ctx));
  app.use('/api', photosRouter(ctx));
  app.use('/api/seasons', seasonsRouter(ctx));
  app.use('/api', woodOffersRouter(ctx));
  app.use('/api', woodRequestsRouter(ctx));
  app.use('/api/planner', plannerRouter(ctx));
  app.use('/api', allocationRoundsRouter(ctx));
  app.use('/api', bundlesRouter(ctx));
  app.use('/api', strikeReportsRouter(ctx));
  app.use('/api', traceRouter(ctx));
  app.use('/api', figuresRouter(ctx));
  app.use('/api', mapRouter(ctx));

  app.use('/api', (req) => {
    throw new HttpError(404, 'not_found', `No such API route: ${req.method} ${req.originalUrl}`);
  });

  app.use('/tiles', tilesRouter(ctx.tiles));

  await mountClient(app, ctx);
  app.use(errorHandler);
  return app;
}

/** Vite's middleware in development; the built files otherwise. */
async function mountClient(app: Express, ctx: AppContext) {
  if (ctx.config.env === 'development') {
    const { createServer } = await import('vite');
    const vite = await createServer({ root: ctx.config.rootDir, server: { middlewareMode: true }, appType: 'spa' });
    app.use(vite.middlewares);
    return;
  }
  const dist = ctx.config.distDir;
  const index = path.join(dist, 'index.html');
  // Hashed assets never change; index.html always revalidates.
  app.use('/assets', express.static(path.join(dist, 'assets'), { immutable: true, maxAge: '1y', fallthrough: false }));
  app.use(express.static(dist, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (_req, res) => {
    if (!existsSync(index)) {
      res.status(503).type('text/plain').send('The client is not built yet: run `npm run build` (npm start does it for you).');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
