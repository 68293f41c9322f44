import { Router } from 'express';
import type { Hemisphere } from '../../../shared/domain.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { getSetting } from './cooperative.repo.js';

type Cooperative = { name: string; region: string; hemisphere: Hemisphere };

export function cooperativeRouter(ctx: AppContext): Router {
  const r = Router();
  // Public: the sign-in page shows whose Heelwood this is.
  r.get(
    '/',
    route({}, async () => {
      const c = await getSetting<Partial<Cooperative>>(ctx.db, 'cooperative');
      return { name: c?.name ?? 'Heelwood cooperative', region: c?.region ?? '', hemisphere: c?.hemisphere ?? 'north' };
    }),
  );
  return r;
}
