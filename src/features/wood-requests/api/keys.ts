export type BoardFrom = { lat: number; lon: number } | null;

export const requestKeys = {
  all: ['wood-requests'] as const,
  mine: (seasonId: string) => [...requestKeys.all, 'mine', seasonId] as const,
  lists: () => [...requestKeys.all, 'list'] as const,
  list: (seasonId: string) => [...requestKeys.lists(), { seasonId }] as const,
};

export const boardKeys = {
  all: ['wood-board'] as const,
  boards: () => [...boardKeys.all, 'board'] as const,
  board: (seasonId: string, from: BoardFrom) => [...boardKeys.boards(), { seasonId, from }] as const,
};
