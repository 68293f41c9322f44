// Bad input, issue 8: generated bodies for every write route (the harness is in
// bad-input.fuzz.ts, the routes in bad-input.routes.ts). This file checks that the list
// covers every write route the app really has, and fuzzes the 'main' group; the other groups
// are in bad-input-<group>.test.ts so vitest runs them in parallel.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.js';
import { startTestApp } from '../fixtures/test-app.js';
import { fuzzGroup } from './bad-input.fuzz.js';
import { appRoutes, EXCLUDED_PATHS, GROUPS, groupFile, isApiWrite, routeKey, ROUTES } from './bad-input.routes.js';

describe('the bad-input route list', () => {
  it('names every write route under /api that the app has, and nothing else', async () => {
    const app = await startTestApp();
    try {
      const writes = appRoutes(await createApp(app.ctx)).filter(isApiWrite);
      // The walk really reads the app: sign-in and the photo upload are among what it found.
      expect(writes.map(routeKey)).toEqual(expect.arrayContaining(['POST /api/auth/sign-in/email', 'POST /api/mother-plants/:id/photos', 'POST /api/auth/*splat']));
      const excluded = new Set(EXCLUDED_PATHS.map((e) => e.path));
      const listed = new Set(ROUTES.map(routeKey));
      const missing = writes.filter((r) => !excluded.has(r.path)).map(routeKey).filter((k) => !listed.has(k));
      expect(missing, 'write routes with no entry in tests/integration/bad-input.routes.ts: add them there').toEqual([]);
      const mounted = new Set(writes.map(routeKey));
      const stale = ROUTES.map(routeKey).filter((k) => !mounted.has(k));
      for (const e of EXCLUDED_PATHS) expect(writes.some((r) => r.path === e.path), `excluded ${e.path} is still mounted`).toBe(true);
      expect(stale, 'entries for routes the app no longer has').toEqual([]);
      expect(new Set(ROUTES.map(routeKey)).size, 'each route once').toBe(ROUTES.length);
    } finally {
      await app.close();
    }
  });

  it('has a test file for every group, and each file fuzzes its group', () => {
    for (const g of GROUPS) {
      const file = path.join(import.meta.dirname, groupFile(g));
      expect(existsSync(file), file).toBe(true);
      expect(readFileSync(file, 'utf8')).toContain(`fuzzGroup('${g}')`);
    }
  });
});

fuzzGroup('main');
