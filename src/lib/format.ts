import { format, formatDistanceToNowStrict, isValid, parseISO } from 'date-fns';

function toDate(value: string | Date): Date | null {
  const date = typeof value === 'string' ? parseISO(value) : value;
  return isValid(date) ? date : null;
}

/** "3 Mar 2027" */
export function formatDay(value: string | Date): string {
  const date = toDate(value);
  return date ? format(date, 'd MMM yyyy') : '—';
}

/** "3 Mar 2027, 14:05" */
export function formatDateTime(value: string | Date): string {
  const date = toDate(value);
  return date ? format(date, 'd MMM yyyy, HH:mm') : '—';
}

/** "5 minutes ago" */
export function formatAgo(value: string | Date): string {
  const date = toDate(value);
  return date ? `${formatDistanceToNowStrict(date)} ago` : '';
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}
