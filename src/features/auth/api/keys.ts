/** Who is signed in is one cache entry, ['me'], read by the shell, guards and pages. */
export const meKeys = {
  all: ['me'] as const,
};
