// Who is calling, and may they? Routes say what they need; refusals are 401 or 403.
import { fromNodeHeaders } from 'better-auth/node';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { FarmRole, UserRole, UserStatus } from '../../shared/domain.js';
import type { FarmLink } from '../../shared/schemas/members.js';
import type { AppContext } from '../context.js';
import { forbidden, unauthorized } from '../lib/http-error.js';
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
    }
  }
}

export async function loadActor(ctx: AppContext, req: Request, res?: Response): Promise<Actor | undefined> {
  if (req.actor) return req.actor;
  const { headers, response: s } = await ctx.auth.api.getSession({ headers: fromNodeHeaders(req.headers), returnHeaders: true });
  // better-auth renews its signed session cookie (cookieCache, auth.ts) and, once a day, the
  // session's expiry: hand those cookies on, or every request after the first minute would
  // look the session up in the database again.
  const cookies = headers.getSetCookie();
  if (res && cookies.length && !res.headersSent) res.append('Set-Cookie', cookies);
  if (!s) return undefined;
  const actor = await findActor(ctx.db, s.user.id);
  // A member suspended while signed in loses access at once.
  if (!actor || actor.status === 'suspended') return undefined;
  req.actor = actor;
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
