import type { Hemisphere, SeasonKind } from '../../../../shared/domain';

export const seasonKeys = {
  all: ['seasons'] as const,
  lists: () => [...seasonKeys.all, 'list'] as const,
  list: () => [...seasonKeys.lists(), {}] as const,
  details: () => [...seasonKeys.all, 'detail'] as const,
  detail: (id: string) => [...seasonKeys.details(), id] as const,
  suggestions: () => [...seasonKeys.all, 'suggestion'] as const,
  suggestion: (kind: SeasonKind, hemisphere: Hemisphere) => [...seasonKeys.suggestions(), { kind, hemisphere }] as const,
};
