export const collectionKeys = {
  all: ['collections'] as const,
  lists: () => [...collectionKeys.all, 'list'] as const,
  list: (seasonId: string, farmId: string) => [...collectionKeys.lists(), { seasonId, farmId }] as const,
  /** The farm's pickup windows: they carry the farm's time zone. */
  windows: (seasonId: string, farmId: string) => [...collectionKeys.all, 'windows', { seasonId, farmId }] as const,
  /** The farm's plants this season (offers): plant codes to plant ids for the label QR codes. */
  plants: (seasonId: string, farmId: string) => [...collectionKeys.all, 'plants', { seasonId, farmId }] as const,
  farms: () => [...collectionKeys.all, 'farms'] as const,
};
