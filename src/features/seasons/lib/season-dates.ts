// A season's dates and kind in words, for the season pages.
import { LABELS } from '../../../../shared/domain';
import type { Season } from '../../../../shared/schemas/seasons';
import { formatDateTime, formatDay } from '../../../lib/format';

export function kindLabel(season: Pick<Season, 'kind'>): string {
  return LABELS.seasonKind[season.kind];
}

export function collectionWindow(season: Pick<Season, 'collectionStart' | 'collectionEnd'>): string {
  return `${formatDay(season.collectionStart)} to ${formatDay(season.collectionEnd)}`;
}

export function deadlineText(season: Pick<Season, 'requestDeadline'>): string {
  return formatDateTime(season.requestDeadline);
}

