// Sign-up and sign-in go through better-auth, but their bodies are first checked with the
// same zod schemas the forms use, so a bad field is named, and better-auth's refusals are
// answered in the API's one error shape (with `message` and `code` also at the top level,
// where better-auth's own client reads them).
import { fromNodeHeaders } from 'better-auth/node';
import express, { type Request, Router, type Response } from 'express';
import { signInSchema, signUpSchema } from '../../shared/schemas/members.js';
import type { AppContext } from '../context.js';
import { fromZod, HttpError, unstorableTextError } from '../lib/http-error.js';

const REFUSALS: Record<string, (m: string) => HttpError> = {
  USER_ALREADY_EXISTS: () =>
    new HttpError(409, 'email_taken', 'An account with that e-mail already exists. Sign in, or reset its password.', {
      email: 'already registered',
    }),
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: () =>
    new HttpError(409, 'email_taken', 'An account with that e-mail already exists. Sign in, or reset its password.', {
      email: 'already registered',
    }),
  INVALID_EMAIL_OR_PASSWORD: () =>
    new HttpError(401, 'wrong_credentials', 'That e-mail and password do not match an account.', {
      password: 'e-mail or password is wrong',
    }),
  ACCOUNT_SUSPENDED: (m) => new HttpError(403, 'account_suspended', m),
};

function sendError(res: Response, e: HttpError) {
  const body = { code: e.code, message: e.message, fields: e.fields };
  res.status(e.status).json({ error: body, ...body });
}

async function relay(res: Response, response: globalThis.Response) {
  if (response.ok) {
    res.status(response.status);
    response.headers.forEach((value, key) => {
      if (key !== 'set-cookie' && key !== 'content-length') res.setHeader(key, value);
    });
    const cookies = response.headers.getSetCookie();
    if (cookies.length) res.setHeader('set-cookie', cookies);
    res.send(Buffer.from(await response.arrayBuffer()));
    return;
  }
  if (response.status === 429) {
    const wait = response.headers.get('x-retry-after');
    if (wait) res.setHeader('Retry-After', wait);
    return sendError(res, new HttpError(429, 'rate_limited', `Too many attempts from this address. Wait ${wait ?? 'a minute'} seconds and try again.`));
  }
  const body = (await response.json().catch(() => ({}))) as { code?: string; message?: string };
  const known = body.code ? REFUSALS[body.code] : undefined;
  sendError(res, known ? known(body.message ?? '') : new HttpError(response.status, (body.code ?? 'auth_error').toLowerCase(), body.message ?? 'Sign-in failed.'));
}

/**
 * The checked body goes to better-auth's own request handler, not to `auth.api.*`: only the
 * handler applies the rate limits and origin checks configured in auth.ts.
 */
function viaHandler(ctx: AppContext, req: Request, body: unknown): Promise<globalThis.Response> {
  const headers = fromNodeHeaders(req.headers);
  headers.delete('content-length');
  headers.delete('transfer-encoding');
  headers.set('content-type', 'application/json');
  const url = `${req.protocol}://${req.get('host') ?? 'localhost'}${req.originalUrl}`;
  return ctx.auth.handler(new globalThis.Request(url, { method: 'POST', headers, body: JSON.stringify(body) }));
}

export function authFormsRouter(ctx: AppContext): Router {
  const r = Router();
  r.use(express.json({ limit: '32kb' }));

  r.post('/sign-up/email', async (req, res) => {
    const parsed = signUpSchema.safeParse(req.body ?? {});
    if (!parsed.success) return sendError(res, fromZod(parsed.error, 'form'));
    const unstorable = unstorableTextError(parsed.data, 'form');
    if (unstorable) return sendError(res, unstorable);
    await relay(res, await viaHandler(ctx, req, parsed.data));
  });

  r.post('/sign-in/email', async (req, res) => {
    const parsed = signInSchema.safeParse(req.body ?? {});
    if (!parsed.success) return sendError(res, fromZod(parsed.error, 'form'));
    const unstorable = unstorableTextError(parsed.data, 'form');
    if (unstorable) return sendError(res, unstorable);
    const body = { ...parsed.data, rememberMe: (req.body as { rememberMe?: boolean }).rememberMe !== false };
    await relay(res, await viaHandler(ctx, req, body));
  });
  return r;
}
