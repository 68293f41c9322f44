import type { FarmCollection } from '../../../../shared/schemas/allocation';

export type GrowerVisit = {
  growerName: string;
  growerEmail: string;
  /** The earliest window of the grower's bundles here, if the farm set one. */
  window: FarmCollection['window'];
  bundles: FarmCollection[];
};

/** Who comes when: one visit per grower, soonest window first, growers without a window last. */
export function visitsByGrower(items: FarmCollection[]): GrowerVisit[] {
  const byGrower = new Map<string, GrowerVisit>();
  for (const item of items) {
    const key = item.growerEmail;
    const visit = byGrower.get(key) ?? { growerName: item.growerName, growerEmail: item.growerEmail, window: null, bundles: [] };
    visit.bundles.push(item);
    if (item.window && (!visit.window || item.window.startsAt < visit.window.startsAt)) visit.window = item.window;
    byGrower.set(key, visit);
  }
  const visits = [...byGrower.values()];
  for (const v of visits) v.bundles.sort((a, b) => (a.code ?? '').localeCompare(b.code ?? '') || a.plantCode.localeCompare(b.plantCode));
  return visits.sort((a, b) => {
    if (a.window && b.window) return a.window.startsAt.localeCompare(b.window.startsAt) || a.growerName.localeCompare(b.growerName);
    if (a.window) return -1;
    if (b.window) return 1;
    return a.growerName.localeCompare(b.growerName);
  });
}

export function collectionCounts(items: FarmCollection[]) {
  const live = items.filter((b) => b.status !== 'cancelled');
  return {
    bundles: live.length,
    collected: live.filter((b) => b.status === 'collected').length,
    cuttings: live.reduce((sum, b) => sum + b.cuttings, 0),
    growers: new Set(live.map((b) => b.growerEmail)).size,
  };
}
