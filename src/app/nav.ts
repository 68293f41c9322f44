// The main navigation, filtered by who is signed in. A later area (Plants, Map, Seasons,
// Planner, Pickups, Health, Figures) gets one entry here when its route exists, never before:
// a link to a page that is not there only sends people to "Page not found".
import type { Me } from '../../shared/schemas/members';
import { patterns } from './paths';

export type NavAccess = 'active' | 'coordinator';

export type NavItem = {
  label: string;
  to: string;
  access: NavAccess;
  /** Match the path exactly (for "/", which every path starts with). */
  end?: boolean;
};

export const NAV_ITEMS: NavItem[] = [
  { label: 'Home', to: patterns.home, access: 'active', end: true },
  { label: 'Plants', to: patterns.plants, access: 'active' },
  { label: 'Map', to: patterns.map, access: 'active' },
  { label: 'Species', to: patterns.species, access: 'active' },
  { label: 'Seasons', to: patterns.seasons, access: 'active' },
  { label: 'Figures', to: patterns.figures, access: 'active' },
  { label: 'Planner', to: patterns.planner, access: 'active' },
  { label: 'Health', to: patterns.health, access: 'coordinator' },
  { label: 'Members', to: patterns.members, access: 'coordinator' },
  { label: 'Mailbox', to: patterns.mailbox, access: 'coordinator' },
];

export function navFor(me: Me): NavItem[] {
  if (me.user.status !== 'active') return [];
  return NAV_ITEMS.filter((item) => item.access === 'active' || me.user.role === 'coordinator');
}
