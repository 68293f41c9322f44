// What the plant pages need from the signed-in person and the farm list, in one place.
import type { Me } from '../../../shared/schemas/members';
import type { FarmSummary } from '../../../shared/schemas/farms';
import type { FarmOption } from '../../features/plants/components/plant-filters';

export const isCoordinator = (me: Me) => me.user.role === 'coordinator';

/** Coordinators and people of a farm add and change plants. */
export const mayKeepRegister = (me: Me) => isCoordinator(me) || me.farms.length > 0;

/** Farms a plant may be added to: a coordinator's choice is every farm; others, their own. */
export function farmsForNewPlant(me: Me, all: FarmSummary[] | undefined): FarmOption[] {
  if (isCoordinator(me)) return (all ?? []).map((f) => ({ id: f.id, name: f.name, code: f.code }));
  return me.farms.map((f) => ({ id: f.farmId, name: f.farmName, code: f.farmCode }));
}

export function farmOptions(all: FarmSummary[] | undefined): FarmOption[] {
  return (all ?? []).map((f) => ({ id: f.id, name: f.name, code: f.code }));
}
