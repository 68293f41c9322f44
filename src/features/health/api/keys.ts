export const healthKeys = {
  all: ['health'] as const,
  overview: () => [...healthKeys.all, 'overview'] as const,
};
