import { useSearchParams } from 'react-router-dom';
import type { Me } from '../../../shared/schemas/members';
import { useFarmChoices } from '../../features/collections/api/get-farm-choices';
import type { FarmOption } from '../../features/collections/components/farm-picker';

/**
 * The farms whose collections this person may see (their own; any farm for a coordinator)
 * and the one chosen in the address, falling back to their own first farm.
 */
export function useCollectionFarm(me: Me) {
  const [search, setSearch] = useSearchParams();
  const coordinator = me.user.role === 'coordinator';
  const all = useFarmChoices(coordinator);
  const own: FarmOption[] = me.farms.map((f) => ({ id: f.farmId, name: f.farmName }));
  const options: FarmOption[] = coordinator ? [...(all.data?.items ?? [])].map((f) => ({ id: f.id, name: f.name })).sort((a, b) => a.name.localeCompare(b.name)) : own;
  const asked = search.get('farmId') ?? '';
  const farmId = asked || own[0]?.id || '';
  const farm = options.find((f) => f.id === farmId) ?? own.find((f) => f.id === farmId) ?? null;
  const choose = (id: string) => setSearch(id ? { farmId: id } : {}, { replace: true });
  return { coordinator, options, farmId, farm, choose, loadingFarms: coordinator && all.isPending };
}
