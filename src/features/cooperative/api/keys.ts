export const cooperativeKeys = {
  all: ['cooperative'] as const,
};
