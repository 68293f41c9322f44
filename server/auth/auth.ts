// Sign-in with better-auth: e-mail and password, session cookies, password reset by e-mail.
// Users carry two fields of ours: role (coordinator | member) and status (pending | active |
// suspended). Neither can be set by the person signing up.
import { betterAuth } from 'better-auth';
import { APIError } from 'better-auth/api';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { eq } from 'drizzle-orm';
import { PASSWORD_MAX, PASSWORD_MIN } from '../../shared/schemas/common.js';
import type { Config } from '../config.js';
import type { Db } from '../db/client.js';
import { account, session, user, verification } from '../db/schema/index.js';
import type { Mailer } from '../modules/mail/mailer.js';
import { passwordResetMail } from '../modules/mail/templates.js';

/**
 * The client address as Express resolved it (req.ip under TRUST_PROXY). app.ts overwrites
 * whatever a caller sent in this header before better-auth reads it.
 */
export const CLIENT_IP_HEADER = 'x-heelwood-client-ip';

/** Requests per client address within `window` seconds; the rest are answered 429. */
export const AUTH_RATE_LIMITS = {
  '/sign-in/email': { window: 60, max: 10 },
  '/request-password-reset': { window: 60, max: 5 },
  '/sign-up/email': { window: 60, max: 10 },
};

export function createAuth(config: Config, db: Db, mailer: Mailer) {
  return betterAuth({
    appName: 'Heelwood',
    baseURL: config.publicUrl,
    basePath: '/api/auth',
    secret: config.authSecret,
    // On this machine only, the same server is often opened as 127.0.0.1 too.
    trustedOrigins: config.loopbackOnly ? [config.publicUrl, config.publicUrl.replace('//localhost', '//127.0.0.1')] : [config.publicUrl],
    telemetry: { enabled: false },
    database: drizzleAdapter(db, { provider: 'pg', schema: { user, session, account, verification } }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: PASSWORD_MIN,
      maxPasswordLength: PASSWORD_MAX,
      revokeSessionsOnPasswordReset: true,
      resetPasswordTokenExpiresIn: 60 * 60,
      async sendResetPassword({ user: u, url }) {
        const result = await mailer.send(passwordResetMail({ to: u.email, name: u.name, url }));
        if (result.status === 'failed') console.error(`[heelwood] password reset mail to ${u.email} failed: ${result.error}`);
      },
    },
    user: {
      additionalFields: {
        role: { type: 'string', required: false, defaultValue: 'member', input: false },
        status: { type: 'string', required: false, defaultValue: 'pending', input: false },
        placeName: { type: 'string', required: false, input: true },
        application: { type: 'string', required: false, input: true },
      },
    },
    session: {
      expiresIn: 60 * 60 * 24 * 30,
      updateAge: 60 * 60 * 24,
      // A signed cookie spares a session lookup per request. Safe here because every guarded
      // request still reads the member's status and farms from the database (guards.ts), so a
      // suspension takes effect at once; a session revoked elsewhere lapses within a minute.
      cookieCache: { enabled: true, maxAge: 60 },
    },
    databaseHooks: {
      session: {
        create: {
          // A suspended member cannot start a session, whatever their password.
          async before(s) {
            const [u] = await db.select({ status: user.status }).from(user).where(eq(user.id, s.userId));
            if (u?.status === 'suspended') {
              throw new APIError('FORBIDDEN', {
                message: 'This account is suspended. Ask the cooperative coordinator to reinstate it.',
                code: 'ACCOUNT_SUSPENDED',
              });
            }
          },
        },
      },
    },
    rateLimit: {
      // Per client address and path, in memory. On unless NODE_ENV=test (RATE_LIMIT=on turns
      // it on there too). The address is Express's req.ip, handed over in CLIENT_IP_HEADER
      // (app.ts), so TRUST_PROXY decides whether X-Forwarded-For is believed.
      enabled: config.rateLimit,
      window: 60,
      max: 100,
      customRules: AUTH_RATE_LIMITS,
    },
    advanced: {
      ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] },
      useSecureCookies: config.publicUrl.startsWith('https://'),
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax' },
    },
  });
}

export type Auth = ReturnType<typeof createAuth>;
