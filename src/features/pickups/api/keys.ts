export const pickupKeys = {
  all: ['pickups'] as const,
  details: () => [...pickupKeys.all, 'slip'] as const,
  /** The signed-in grower's slip for one season. */
  detail: (seasonId: string) => [...pickupKeys.details(), seasonId] as const,
};
