// Sign-in and password-reset limits per client address (better-auth's rate limiter, turned on
// here with RATE_LIMIT=on), which address counts behind a proxy, and the session cookie's
// attributes in production over HTTPS.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AUTH_RATE_LIMITS } from '../../server/auth/auth.js';
import { Client } from '../fixtures/http.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

const DEMO = { email: 'coordinator@heelwood.test', password: 'heelwood-demo' };
// The limits under test are the configured ones (server/auth/auth.ts).
const SIGN_IN = AUTH_RATE_LIMITS['/sign-in/email'];
const RESET = AUTH_RATE_LIMITS['/request-password-reset'];

/** A client that says it is `ip`, as a proxy in front of Heelwood would. */
function from(app: TestApp, ip: string) {
  const c = new Client(app.url);
  const request = c.request.bind(c);
  c.request = (method, path, body, init = {}) => request(method, path, body, { ...init, headers: { 'x-forwarded-for': ip, ...init.headers } });
  return c;
}

const wrongSignIn = (c: Client) => c.post('/api/auth/sign-in/email', { email: DEMO.email, password: 'not the password at all' });

describe('behind a trusted proxy (RATE_LIMIT=on, TRUST_PROXY=loopback)', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp({ seeded: true, env: { RATE_LIMIT: 'on', TRUST_PROXY: 'loopback' } });
  });
  afterAll(() => app?.close());

  it(`refuses the sign-in after ${SIGN_IN.max} within ${SIGN_IN.window} s from one address, even with the right password`, async () => {
    const attacker = from(app, '198.51.100.7');
    for (let i = 0; i < SIGN_IN.max; i++) expect((await wrongSignIn(attacker)).status).toBe(401);
    const refused = await wrongSignIn(attacker);
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('rate_limited');
    const retry = Number(refused.headers.get('retry-after'));
    expect(retry).toBeGreaterThan(0);
    expect(retry).toBeLessThanOrEqual(SIGN_IN.window);
    // The right password does not get through either, and starts no session.
    const right = await attacker.post('/api/auth/sign-in/email', DEMO);
    expect(right.status).toBe(429);
    expect(right.headers.getSetCookie().some((c) => c.includes('session_token'))).toBe(false);
  });

  it('does not refuse a different client address', async () => {
    const other = from(app, '198.51.100.8');
    expect((await wrongSignIn(other)).status).toBe(401);
    expect((await other.post('/api/auth/sign-in/email', DEMO)).status).toBe(200);
    expect((await other.get('/api/me')).status).toBe(200);
  });

  it(`refuses password-reset requests after ${RESET.max} within ${RESET.window} s from one address`, async () => {
    const asker = from(app, '203.0.113.20');
    for (let i = 0; i < RESET.max; i++) {
      const r = await asker.post('/api/auth/request-password-reset', { email: `nobody${i}@example.org`, redirectTo: '/reset-password' });
      expect(r.status).toBe(200);
    }
    const refused = await asker.post('/api/auth/request-password-reset', { email: 'nobody@example.org', redirectTo: '/reset-password' });
    expect(refused.status).toBe(429);
    const other = from(app, '203.0.113.21');
    expect((await other.post('/api/auth/request-password-reset', { email: 'nobody@example.org', redirectTo: '/reset-password' })).status).toBe(200);
  });
});

describe('without a trusted proxy (the default)', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp({ seeded: true, env: { RATE_LIMIT: 'on' } });
  });
  afterAll(() => app?.close());

  it('counts the connection, so a made-up X-Forwarded-For does not escape the limit', async () => {
    for (let i = 0; i < SIGN_IN.max; i++) expect((await wrongSignIn(from(app, `192.0.2.${i + 1}`))).status).toBe(401);
    expect((await wrongSignIn(from(app, '192.0.2.200'))).status).toBe(429);
    expect((await wrongSignIn(new Client(app.url))).status).toBe(429);
  });
});

describe('rate limits are off under test unless asked for', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp({ seeded: true });
  });
  afterAll(() => app?.close());

  it(`answers more than ${SIGN_IN.max} sign-ins in a row with 401, not 429`, async () => {
    const c = new Client(app.url);
    for (let i = 0; i < SIGN_IN.max + 2; i++) expect((await wrongSignIn(c)).status).toBe(401);
  });
});

describe('session cookie in production over HTTPS', () => {
  const publicUrl = 'https://heelwood.example.org';
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp({
      seeded: true,
      env: {
        NODE_ENV: 'production',
        PUBLIC_URL: publicUrl,
        SEED_DEMO: 'false',
        // Nothing is mailed in this test; production only insists that a mail server is named.
        SMTP_URL: 'smtp://127.0.0.1:9',
        BETTER_AUTH_SECRET: 'a-test-only-secret-that-is-long-enough-0123456789',
        // Behind its TLS proxy, as production on a network is. (better-auth keeps its counts
        // per process: the other suites here have used up 127.0.0.1's sign-ins.)
        TRUST_PROXY: 'loopback',
      },
    });
  });
  afterAll(() => app?.close());

  it('is HttpOnly, SameSite=Lax, Secure and __Secure- prefixed', async () => {
    const c = from(app, '198.51.100.99');
    // The page a browser signs in from is the public https address.
    const r = await c.request('POST', '/api/auth/sign-in/email', DEMO, { headers: { origin: publicUrl } });
    expect(r.status).toBe(200);
    const cookies = r.headers.getSetCookie();
    const session = cookies.find((x) => x.includes('session_token'));
    expect(session).toBeDefined();
    expect(session).toMatch(/^__Secure-/);
    expect(session).toMatch(/;\s*HttpOnly/i);
    expect(session).toMatch(/;\s*SameSite=Lax/i);
    expect(session).toMatch(/;\s*Secure/i);
    // Every cookie better-auth sets on sign-in keeps the same attributes.
    for (const x of cookies) {
      expect(x).toMatch(/;\s*Secure/i);
      expect(x).toMatch(/;\s*HttpOnly/i);
    }
    // And the app sends HSTS over HTTPS.
    expect(r.headers.get('strict-transport-security')).toMatch(/max-age=\d+/);
  });

  it('refuses a sign-in posted from another origin', async () => {
    const r = await from(app, '198.51.100.98').request('POST', '/api/auth/sign-in/email', DEMO, { headers: { origin: 'https://elsewhere.example' } });
    expect(r.status).toBe(403);
    expect(r.headers.getSetCookie().some((x) => x.includes('session_token'))).toBe(false);
  });
});
