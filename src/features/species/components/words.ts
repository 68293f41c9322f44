import type { PropagationMethod } from '../../../../shared/domain';

export const METHOD_LABELS: Record<PropagationMethod, string> = {
  hardwood: 'Hardwood cuttings',
  leafy: 'Leafy summer cuttings',
  scion: 'Scion wood for grafting',
  live_stake: 'Live stakes',
};

/** A form error that names its field (schema messages mostly do; bounds checks may not). */
export function named(label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  const first = label.toLowerCase().split(/[\s(]/)[0];
  if (message.toLowerCase().startsWith(first)) return message;
  return `${label}: ${message.charAt(0).toLowerCase()}${message.slice(1)}`;
}

export function percent(fraction: number): string {
  return `${Math.round(fraction * 1000) / 10} %`;
}
