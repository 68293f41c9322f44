// The season's figures shaped for the charts and tables: ratios per species, the strike
// rates at species level as chart bars with their interval, and number words.
import { LABELS } from '../../../../shared/domain';
import type { FiguresRow, SeasonFigures, SeasonStrikeRate } from '../../../../shared/schemas/figures';

/** "74 %", or a dash when there is nothing to divide by. */
export function percent(ratio: number | null | undefined): string {
  return ratio == null || !Number.isFinite(ratio) ? '—' : `${Math.round(ratio * 100)} %`;
}

export function count(n: number): string {
  return n.toLocaleString('en');
}

export function km(n: number | null): string {
  return n == null ? '—' : `${n.toLocaleString('en', { maximumFractionDigits: 1 })} km`;
}

/** Money in the cooperative's currency when it has one, else a plain number. */
export function money(n: number, currency: string | null): string {
  if (!currency) return n.toLocaleString('en', { maximumFractionDigits: 0 });
  try {
    return new Intl.NumberFormat('en-GB', { style: 'currency', currency, maximumFractionDigits: 0 }).format(n);
  } catch {
    return `${n.toLocaleString('en', { maximumFractionDigits: 0 })} ${currency}`;
  }
}

export type SpeciesFigures = FiguresRow & {
  /** Allocated over asked (can pass 100 % for one variety when "any variety" lines were met from it). */
  fillRatio: number | null;
  /** Collected over allocated. */
  collectedRatio: number | null;
};

export function withRatios(rows: FiguresRow[]): SpeciesFigures[] {
  return rows.map((r) => ({
    ...r,
    fillRatio: r.asked > 0 ? r.allocated / r.asked : null,
    collectedRatio: r.allocated > 0 ? r.collected / r.allocated : null,
  }));
}

/** Species that had any wood offered, asked, allocated or collected, largest first. */
export function speciesFigures(f: SeasonFigures): SpeciesFigures[] {
  return withRatios(f.bySpecies.filter((r) => r.offered + r.asked + r.allocated + r.collected + r.cancelled > 0)).sort(
    (a, b) => b.offered + b.asked - (a.offered + a.asked) || a.speciesName.localeCompare(b.speciesName),
  );
}

export function varietyName(r: Pick<FiguresRow, 'varietyName'>): string {
  return r.varietyName ?? 'Any or unnamed variety';
}

export type StrikeBar = {
  id: string;
  label: string;
  /** Percent, for the chart. */
  rate: number;
  /** [below, above] the rate, in percent, for the error bar of the 90 % interval. */
  interval: [number, number];
  row: SeasonStrikeRate;
};

export function treatmentName(t: SeasonStrikeRate['treatment']): string {
  return LABELS.treatment[t];
}

/** Species-level strike rates as chart bars, with the 90 % interval as an error bar. */
export function strikeBars(f: SeasonFigures): StrikeBar[] {
  return f.strikeRates
    .filter((r) => r.level === 'species')
    .map((r) => ({
      id: `${r.speciesId}:${r.treatment}`,
      label: `${r.speciesName} · ${treatmentName(r.treatment)}`,
      rate: r.rate * 100,
      interval: [(r.rate - r.low) * 100, (r.high - r.rate) * 100] as [number, number],
      row: r,
    }));
}

/** Whose figures these are, in a sentence for the page. */
export function scopeSentence(f: SeasonFigures, farmNames: string[]): string {
  if (f.scope === 'cooperative') return "The whole cooperative's figures: every farm's offers and bundles, and every grower's requests.";
  const farms = farmNames.length ? `the offers and bundles of ${farmNames.length === 1 ? 'your farm' : 'your farms'} (${farmNames.join(', ')}), and ` : '';
  return `Your own figures: ${farms}your own wood requests and the bundles you received. The coordinator sees the whole cooperative's.`;
}

/** True when nothing at all happened in the season for this person. */
export function isEmpty(f: SeasonFigures): boolean {
  const t = f.totals;
  return t.offered + t.asked + t.allocated + t.collected + t.cancelled === 0 && f.lines.length === 0 && f.raised.rooted === 0;
}
