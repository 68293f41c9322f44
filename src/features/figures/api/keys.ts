export const figuresKeys = {
  all: ['figures'] as const,
  season: (seasonId: string) => [...figuresKeys.all, 'season', seasonId] as const,
};
