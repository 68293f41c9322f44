export const speciesKeys = {
  all: ['species'] as const,
  lists: () => [...speciesKeys.all, 'list'] as const,
};
