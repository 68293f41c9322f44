// Who is calling, and may they? Routes say what they need; refusals are 401 or 403.
import { fromNodeHeaders } from 'better-auth/node';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { FarmRole, UserRole, UserStatus } from '../../shared/domain.js';
import type { FarmLink } from '../../shared/schemas/members.js';
import type { AppContext } from '../context.js';
import { forbidden, unauthorized } from '../lib/http-error.js';
import { readCacheOf } from '../lib/read-cache.js';
import { findActor } from '../modules/members/members.repo.js';

export type Actor = {
  id: string;
  name: string;
  email: string;
  role: UserRole;
  status: UserStatus;
  farms: FarmLink[];
};

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      actor?: Actor;
      /** The database snapshot this request started from (read-cache.ts). */
      dbState?: string;
    }
  }
}

type Session = Awaited<ReturnType<AppContext['auth']['api']['getSession']>>;

/**
 * Sessions better-auth has just read from a browser's signed cookie, by the Cookie header that
 * carried them, for a few seconds: verifying the signature is most of a cached read's cost.
 * Only answers that renewed nothing are kept; the signed cookie itself is trusted for a minute
 * (auth.ts), so this adds at most SESSION_MEMO_MS to how long a revoked session still reads.
 */
const SESSION_MEMO_MS = 5_000;
const SESSION_MEMO_MAX = 1_000;
const sessionMemos = new WeakMap<AppContext['auth'], Map<string, { until: number; session: NonNullable<Session> }>>();

async function sessionOf(ctx: AppContext, req: Request, res?: Response): Promise<Session> {
  const cookie = req.headers.cookie;
  let memo = sessionMemos.get(ctx.auth);
  if (!memo) sessionMemos.set(ctx.auth, (memo = new Map()));
  const now = Date.now();
  const kept = cookie ? memo.get(cookie) : undefined;
  if (kept && kept.until > now && new Date(kept.session.session.expiresAt).getTime() > now) return kept.session;
  if (kept) memo.delete(cookie!);
  const { headers, response: s } = await ctx.auth.api.getSession({ headers: fromNodeHeaders(req.headers), returnHeaders: true });
  // better-auth renews its signed session cookie (cookieCache, auth.ts) and, once a day, the
  // session's expiry: hand those cookies on, or every request after the first minute would
  // look the session up in the database again.
  const cookies = headers.getSetCookie();
  if (res && cookies.length && !res.headersSent) res.append('Set-Cookie', cookies);
  if (s && cookie && !cookies.length) {
    memo.set(cookie, { until: now + SESSION_MEMO_MS, session: s });
    if (memo.size > SESSION_MEMO_MAX) memo.delete(memo.keys().next().value!);
  }
  return s;
}

export async function loadActor(ctx: AppContext, req: Request, res?: Response): Promise<Actor | undefined> {
  if (req.actor) return req.actor;
  const s = await sessionOf(ctx, req, res);
  if (!s) return undefined;
  // The caller as of this request's snapshot: looked up once per user until the data changes.
  const cache = readCacheOf(ctx.db);
  const state = await cache.snapshot();
  const userId = s.user.id;
  // Shared by concurrent requests, so frozen: a handler cannot change another's caller.
  const actor = await cache.actor(state, userId, async () => {
    const found = await findActor(ctx.db, userId);
    if (found) {
      for (const f of found.farms) Object.freeze(f);
      Object.freeze(found.farms);
      Object.freeze(found);
    }
    return found;
  });
  // A member suspended while signed in loses access at once.
  if (!actor || actor.status === 'suspended') return undefined;
  req.actor = actor;
  req.dbState = state;
  return actor;
}

/** The signed-in caller; a route behind a guard can rely on it. */
export function actorOf(req: Request): Actor {
  if (!req.actor) throw unauthorized();
  return req.actor;
}

function guard(ctx: AppContext, check: (a: Actor) => string | null): RequestHandler {
  return async (req: Request, res: Response, next: NextFunction) => {
    const actor = await loadActor(ctx, req, res);
    if (!actor) throw unauthorized();
    const refusal = check(actor);
    if (refusal) throw forbidden(refusal);
    next();
  };
}

/** Any signed-in person, pending applicants included. */
export const requireUser = (ctx: AppContext) => guard(ctx, () => null);

/** An admitted member or a coordinator. */
export const requireActive = (ctx: AppContext) =>
  guard(ctx, (a) => (a.status === 'active' ? null : 'Your application is waiting for a coordinator to admit you.'));

export const requireCoordinator = (ctx: AppContext) =>
  guard(ctx, (a) =>
    a.status === 'active' && a.role === 'coordinator' ? null : 'Only a coordinator may do that.',
  );

export function farmRoleOf(actor: Actor, farmId: string): FarmRole | undefined {
  return actor.farms.find((f) => f.farmId === farmId)?.farmRole;
}
