export type FarmSeason = { seasonId: string; farmId: string };

export const offerKeys = {
  all: ['wood-offers'] as const,
  lists: () => [...offerKeys.all, 'list'] as const,
  list: (key: FarmSeason) => [...offerKeys.lists(), key] as const,
};

export const windowKeys = {
  all: ['pickup-windows'] as const,
  lists: () => [...windowKeys.all, 'list'] as const,
  list: (key: FarmSeason) => [...windowKeys.lists(), key] as const,
};
