// HTML for the map's markers. A plant's status is its shape, its words (label and
// aria-label) and its colour, with the shape and colour taken from the one status mapping
// in components/ui/status-badge.tsx, so the map, its legend and every badge agree.
import type { HealthStatus } from '../../../../shared/domain';
import { STATUS_LOOKS, type StatusShape } from '../../../components/ui/status-badge';
import { escapeHtml } from './format';

// The same drawings as StatusShapeIcon (a 14 x 14 box), as strings for Leaflet's DivIcon.
const SHAPES: Record<StatusShape, string> = {
  'hollow-circle': '<circle cx="7" cy="7" r="5.25" fill="none" stroke="currentColor" stroke-width="2"/>',
  'filled-circle': '<circle cx="7" cy="7" r="6" fill="currentColor"/>',
  'square-bar': '<rect x="1" y="1" width="12" height="12" rx="1" fill="currentColor"/><rect x="3" y="6" width="8" height="2" fill="white"/>',
  triangle: '<polygon points="7,0.8 13.4,12.6 0.6,12.6" fill="currentColor"/>',
  octagon: '<polygon points="4.2,0.5 9.8,0.5 13.5,4.2 13.5,9.8 9.8,13.5 4.2,13.5 0.5,9.8 0.5,4.2" fill="currentColor"/>',
  cross: '<path d="M2 2l10 10M12 2L2 12" stroke="currentColor" stroke-width="2.4" stroke-linecap="round"/>',
  diamond: '<polygon points="7,0.6 13.4,7 7,13.4 0.6,7" fill="currentColor"/>',
  'filled-square': '<rect x="1.5" y="1.5" width="11" height="11" rx="1.5" fill="currentColor"/>',
  'half-circle':
    '<circle cx="7" cy="7" r="5.25" fill="none" stroke="currentColor" stroke-width="2"/><path d="M7 1.75a5.25 5.25 0 0 1 0 10.5z" fill="currentColor"/>',
};

/** The text colour class of a status (e.g. text-leaf-dark), from its badge tone. */
export function statusColourClass(status: HealthStatus): string {
  return STATUS_LOOKS[status].tone.split(/\s+/).find((c) => c.startsWith('text-')) ?? 'text-ink';
}

export function shapeSvg(shape: StatusShape, size: number): string {
  return `<svg width="${size}" height="${size}" viewBox="0 0 14 14" aria-hidden="true" focusable="false" data-shape="${shape}">${SHAPES[shape]}</svg>`;
}

/** Retired plants are kept as history: a smaller mark so they do not crowd the living ones. */
const SIZE: Record<HealthStatus, number> = { clean: 16, watch: 18, hold: 18, retired: 12 };

export function plantIconHtml(p: { code: string; healthStatus: HealthStatus; speciesName: string; varietyName: string | null }): string {
  const look = STATUS_LOOKS[p.healthStatus];
  const what = [p.speciesName, p.varietyName].filter(Boolean).join(' ');
  const label = `${p.code}, ${what}, ${look.label}`;
  return (
    `<span class="hw-plant ${statusColourClass(p.healthStatus)}" role="img" aria-label="${escapeHtml(label)}" data-status="${p.healthStatus}">` +
    shapeSvg(look.shape, SIZE[p.healthStatus]) +
    `<span class="hw-plant__label">${escapeHtml(p.code)}</span></span>`
  );
}

export type ClusterCounts = Record<HealthStatus, number>;

export function clusterIconHtml(total: number, counts: ClusterCounts): { html: string; size: number } {
  const size = total < 10 ? 34 : total < 100 ? 40 : total < 1000 ? 46 : 52;
  const parts = [`${total} plants`];
  const marks: string[] = [];
  for (const s of ['hold', 'watch'] as const) {
    if (!counts[s]) continue;
    parts.push(`${counts[s]} ${STATUS_LOOKS[s].label.toLowerCase()}`);
    marks.push(`<span class="hw-cluster__mark ${statusColourClass(s)}">${shapeSvg(STATUS_LOOKS[s].shape, 11)}</span>`);
  }
  return {
    size,
    html:
      `<span class="hw-cluster" role="img" aria-label="${escapeHtml(parts.join(', '))}" style="width:${size}px;height:${size}px">` +
      `<span class="hw-cluster__count">${total >= 10000 ? `${Math.round(total / 1000)}k` : total}</span>` +
      (marks.length ? `<span class="hw-cluster__marks">${marks.join('')}</span>` : '') +
      `</span>`,
  };
}

const FARM_SHAPE = '<path d="M2 13V6.5L8 2l6 4.5V13z" fill="currentColor" stroke="white" stroke-width="1.2" stroke-linejoin="round"/>';

/** A farm: a small barn-gable shape and its name. */
export function farmIconHtml(name: string, code: string): string {
  return (
    `<span class="hw-farm" role="img" aria-label="${escapeHtml(`Farm: ${name} (${code})`)}">` +
    `<svg width="18" height="18" viewBox="0 0 16 15" aria-hidden="true" focusable="false">${FARM_SHAPE}</svg>` +
    `<span class="hw-farm__name">${escapeHtml(name)}</span></span>`
  );
}

/** The ring that marks a plant's new position while it is being moved. */
export const PENDING_HTML =
  '<span class="hw-pending" role="img" aria-label="New position (drag to adjust)"><svg width="34" height="34" viewBox="0 0 34 34" aria-hidden="true" focusable="false">' +
  '<circle cx="17" cy="17" r="12" fill="none" stroke="white" stroke-width="6"/><circle cx="17" cy="17" r="12" fill="none" stroke="currentColor" stroke-width="3"/>' +
  '<path d="M17 2v9M17 23v9M2 17h9M23 17h9" stroke="currentColor" stroke-width="2"/></svg></span>';
