import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../config.js';

const tmp = () => mkdtempSync(path.join(tmpdir(), 'heelwood-config-'));

describe('loadConfig', () => {
  it('starts locally with no settings at all, and keeps a generated secret', () => {
    const dir = tmp();
    const a = loadConfig({ DATA_DIR: dir });
    expect(a.publicUrl).toBe('http://localhost:3000');
    expect(a.seedDemo).toBe(true);
    expect(a.authSecret).toMatch(/^[0-9a-f]{64}$/);
    expect(existsSync(path.join(dir, 'auth-secret'))).toBe(true);
    const b = loadConfig({ DATA_DIR: dir });
    expect(b.authSecret).toBe(a.authSecret);
    expect(readFileSync(path.join(dir, 'auth-secret'), 'utf8').trim()).toBe(a.authSecret);
  });

  it('lists every bad setting at once', () => {
    try {
      loadConfig({ PORT: 'eighty', DATABASE_URL: 'mysql://x', SMTP_URL: 'mail.example.org', DATA_DIR: tmp() });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ConfigError);
      const problems = (e as ConfigError).problems.join('\n');
      expect(problems).toMatch(/PORT/);
      expect(problems).toMatch(/DATABASE_URL/);
      expect(problems).toMatch(/SMTP_URL/);
    }
  });

  it('refuses an insecure production set-up on a network, saying what to set', () => {
    try {
      loadConfig({ NODE_ENV: 'production', PUBLIC_URL: 'http://heelwood.example.org', DATA_DIR: tmp() });
      expect.unreachable();
    } catch (e) {
      const problems = (e as ConfigError).problems.join('\n');
      expect(problems).toMatch(/PUBLIC_URL .*https/);
      expect(problems).toMatch(/SEED_DEMO=false/);
      expect(problems).toMatch(/SMTP_URL/);
    }
  });

  it('accepts a secure production set-up', () => {
    const c = loadConfig({
      NODE_ENV: 'production',
      PUBLIC_URL: 'https://heelwood.example.org',
      SEED_DEMO: 'false',
      SMTP_URL: 'smtps://u:p@mail.example.org:465',
      BETTER_AUTH_SECRET: 'x'.repeat(40),
      DATA_DIR: tmp(),
    });
    expect(c.loopbackOnly).toBe(false);
    expect(c.authSecret).toBe('x'.repeat(40));
  });

  it('refuses the approval test hook and RATE_LIMIT=off in production; the hook works under test', () => {
    const secure = {
      NODE_ENV: 'production',
      PUBLIC_URL: 'https://heelwood.example.org',
      SEED_DEMO: 'false',
      SMTP_URL: 'smtps://u:p@mail.example.org:465',
      BETTER_AUTH_SECRET: 'x'.repeat(40),
      DATA_DIR: tmp(),
    };
    try {
      loadConfig({ ...secure, HEELWOOD_TEST_APPROVAL_DELAY_MS: '5000', RATE_LIMIT: 'off' });
      expect.unreachable();
    } catch (e) {
      const problems = (e as ConfigError).problems.join('\n');
      expect(problems).toMatch(/HEELWOOD_TEST_APPROVAL_DELAY_MS is a test hook/);
      expect(problems).toMatch(/RATE_LIMIT is off/);
    }
    expect(loadConfig(secure).rateLimit).toBe(true);
    expect(loadConfig(secure).testApprovalDelayMs).toBe(0);
    const test = loadConfig({ NODE_ENV: 'test', DATA_DIR: tmp(), HEELWOOD_TEST_APPROVAL_DELAY_MS: '250' });
    expect(test.testApprovalDelayMs).toBe(250);
    expect(test.rateLimit).toBe(false);
    expect(loadConfig({ NODE_ENV: 'test', DATA_DIR: tmp(), RATE_LIMIT: 'on' }).rateLimit).toBe(true);
  });

  it('reads TRUST_PROXY as hops or a list of proxies, and names a bad one', () => {
    expect(loadConfig({ DATA_DIR: tmp() }).trustProxy).toBe(false);
    expect(loadConfig({ DATA_DIR: tmp(), TRUST_PROXY: '1' }).trustProxy).toBe(1);
    expect(loadConfig({ DATA_DIR: tmp(), TRUST_PROXY: 'loopback, 10.0.0.0/8,::1' }).trustProxy).toEqual(['loopback', '10.0.0.0/8', '::1']);
    for (const bad of ['everyone', '10.0.0.0/33', 'true']) {
      try {
        loadConfig({ DATA_DIR: tmp(), TRUST_PROXY: bad });
        expect.unreachable();
      } catch (e) {
        expect((e as ConfigError).problems.join('\n')).toMatch(/TRUST_PROXY: use false, a number of proxy hops/);
      }
    }
  });
});
