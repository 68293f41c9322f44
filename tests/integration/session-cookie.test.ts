// better-auth's signed session cookie (cookieCache in server/auth/auth.ts) only spares the
// session lookup if the browser gets it renewed: guarded routes hand on the cookies that
// better-auth sets while reading the session (server/auth/guards.ts).
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { user } from '../../server/db/schema/index.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp({ seeded: true });
});
afterAll(() => app?.close());

const pairs = (res: Response) => res.headers.getSetCookie().map((c) => c.split(';')[0]);

async function signIn(email: string): Promise<string[]> {
  const res = await fetch(`${app.url}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: app.url },
    body: JSON.stringify({ email, password: 'heelwood-demo' }),
  });
  expect(res.status).toBe(200);
  return pairs(res);
}

const get = (path: string, cookies: string[]) => fetch(`${app.url}${path}`, { headers: { cookie: cookies.join('; ') } });

describe('the signed session cookie', () => {
  it('is renewed on a guarded route when the browser holds only the session token', async () => {
    const cookies = await signIn('lead@heelwood.test');
    const token = cookies.filter((c) => c.startsWith('better-auth.session_token='));
    expect(token).toHaveLength(1);

    const res = await get('/api/me', token);
    expect(res.status).toBe(200);
    expect((await res.json()).user.email).toBe('lead@heelwood.test');
    const renewed = pairs(res).filter((c) => c.startsWith('better-auth.session_data='));
    expect(renewed).toHaveLength(1);

    // With the renewed cookie the session is read from it: nothing more to set.
    const again = await get('/api/me', [...token, ...renewed]);
    expect(again.status).toBe(200);
    expect(pairs(again)).toEqual([]);
  });

  it('does not let a member suspended since the cookie was made through', async () => {
    const cookies = await signIn('hand@heelwood.test');
    expect((await get('/api/me', cookies)).status).toBe(200);
    await app.ctx.db.update(user).set({ status: 'suspended' }).where(eq(user.email, 'hand@heelwood.test'));
    try {
      expect((await get('/api/me', cookies)).status).toBe(401);
      expect((await get('/api/map/features', cookies)).status).toBe(401);
    } finally {
      await app.ctx.db.update(user).set({ status: 'active' }).where(eq(user.email, 'hand@heelwood.test'));
    }
  });
});
