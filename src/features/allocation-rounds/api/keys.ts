// Query keys for allocation rounds, general to specific, so a bundle edit can refresh one
// round and a new round can refresh every list.
export const roundKeys = {
  all: ['allocation-rounds'] as const,
  lists: () => [...roundKeys.all, 'list'] as const,
  list: (seasonId: string) => [...roundKeys.lists(), { seasonId }] as const,
  details: () => [...roundKeys.all, 'detail'] as const,
  detail: (roundId: string) => [...roundKeys.details(), roundId] as const,
  /** What the "add a bundle" dialog chooses from: farms, then one farm's offers. */
  farms: () => [...roundKeys.all, 'farms'] as const,
  farmOffers: (seasonId: string, farmId: string) => [...roundKeys.all, 'farm-offers', { seasonId, farmId }] as const,
};
