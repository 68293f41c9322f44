import { formatDateTime } from '../../../lib/format';

export const formDateTimeSafe = (iso: string) => formatDateTime(iso);

/** "12.3 km" */
export function km(value: number | null): string {
  return value === null ? '—' : `${value.toLocaleString('en', { maximumFractionDigits: 1 })} km`;
}
