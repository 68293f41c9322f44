// Who may see and change a mother plant. Coordinators: everything. People of the plant's
// farm: the full record. Other members: clean plants only, without notes or inspections,
// at an approximate position.
import type { Actor } from '../../auth/guards.js';
import { farmRoleOf } from '../../auth/guards.js';

export const isCoordinator = (a: Actor) => a.role === 'coordinator' && a.status === 'active';

export function seesFull(a: Actor, farmId: string): boolean {
  return isCoordinator(a) || farmRoleOf(a, farmId) !== undefined;
}

/** Lead and hand both keep the register of their farm. */
export function mayEdit(a: Actor, farmId: string): boolean {
  return isCoordinator(a) || farmRoleOf(a, farmId) !== undefined;
}

export function mayInspect(a: Actor, farmId: string): boolean {
  return isCoordinator(a) || farmRoleOf(a, farmId) !== undefined;
}

/** Retiring ends a plant's working life: the farm lead's or a coordinator's call. */
export function mayRetire(a: Actor, farmId: string): boolean {
  return isCoordinator(a) || farmRoleOf(a, farmId) === 'lead';
}

/** About 1 km: enough to say how far to drive, not where the bush stands. */
export function approximate(v: number | null): number | null {
  return v == null ? null : Math.round(v * 100) / 100;
}
