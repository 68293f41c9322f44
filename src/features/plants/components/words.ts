// Plain words for the register's codes, used on every plant screen.
import type { Provenance, Severity } from '../../../../shared/domain';

export const PROVENANCE_LABELS: Record<Provenance, string> = {
  bought: 'Bought',
  seed: 'Grown from seed',
  exchange: 'Received through an exchange',
};

export const SEVERITY_LABELS: Record<Severity, string> = {
  minor: 'Minor',
  moderate: 'Moderate',
  severe: 'Severe',
};

export const INSPECTED_LABELS = {
  recent: 'Inspected within the look-back',
  stale: 'Not inspected within the look-back',
  never: 'Never inspected',
} as const;

/**
 * A form error that says which field it is about. Schema messages mostly do ("Planting year
 * must be a number"); server messages for one field sometimes do not ("not in the catalogue").
 */
export function named(label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  const first = label.toLowerCase().split(/[\s(]/)[0];
  if (message.toLowerCase().startsWith(first)) return message;
  return `${label}: ${message.charAt(0).toLowerCase()}${message.slice(1)}`;
}

/** "52.19910, -2.50558" */
export function formatPosition(lat: number | null, lon: number | null): string | null {
  if (lat == null || lon == null) return null;
  return `${lat.toFixed(5)}, ${lon.toFixed(5)}`;
}

export function todayIso(): string {
  const now = new Date();
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}
