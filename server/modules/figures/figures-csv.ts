// A season's figures as one CSV table for spreadsheets: one row per figure, a `section`
// column saying what the row is, and the same columns throughout (cells that do not apply
// are empty), so a pivot table or a filter on `section` gives each view.
//
// Sections: variety, species, total (wood offered/asked/allocated/collected/cancelled and the
// fill ratio allocated/asked), line (each request line's fill), strike_rate_species and
// strike_rate_variety (this season's reports by treatment, with the posterior mean and 90 %
// interval), raised (rooted cuttings, first crop year and estimated value), trip (each
// grower's shortest round trip) and travel (sum of bundle distances, sum of round trips).
import Papa from 'papaparse';
import type { SeasonFigures } from '../../../shared/schemas/figures.js';

export const FIGURES_CSV_COLUMNS = [
  'section',
  'species',
  'variety',
  'treatment',
  'grower',
  'offered',
  'asked',
  'allocated',
  'collected',
  'cancelled',
  'fill_ratio',
  'reports',
  'stuck',
  'rooted',
  'observed_rate',
  'strike_rate',
  'rate_low',
  'rate_high',
  'collection_year',
  'first_crop_year',
  'estimated_value',
  'km',
] as const;
type Column = (typeof FIGURES_CSV_COLUMNS)[number];
type Cells = Partial<Record<Column, string | number | null>>;

/** What a spreadsheet would run as a formula; papaparse puts an apostrophe before it. */
const FORMULA_START = /^[=+\-@\t\r]/;

const ratio = (x: number | null) => (x == null ? null : Math.round(x * 10_000) / 10_000);

export function figuresCsv(f: SeasonFigures): string {
  const out: Cells[] = [];
  const wood = (section: string, r: { speciesName?: string; varietyName?: string | null; offered: number; asked: number; allocated: number; collected: number; cancelled: number }) =>
    out.push({
      section,
      species: r.speciesName ?? '',
      variety: r.varietyName ?? '',
      offered: r.offered,
      asked: r.asked,
      allocated: r.allocated,
      collected: r.collected,
      cancelled: r.cancelled,
      fill_ratio: r.asked > 0 ? ratio(r.allocated / r.asked) : null,
    });
  for (const r of f.byVariety) wood('variety', { ...r, varietyName: r.varietyName ?? (r.varietyId ? '' : 'any or unnamed') });
  for (const r of f.bySpecies) wood('species', r);
  wood('total', f.totals);
  for (const l of f.lines) {
    out.push({ section: 'line', species: l.speciesName, variety: l.varietyName ?? 'any', grower: l.growerName, asked: l.asked, allocated: l.allocated, collected: l.collected, fill_ratio: ratio(l.ratio) });
  }
  for (const s of f.strikeRates) {
    out.push({
      section: s.level === 'species' ? 'strike_rate_species' : 'strike_rate_variety',
      species: s.speciesName,
      variety: s.varietyName ?? '',
      treatment: s.treatment,
      reports: s.reports,
      stuck: s.stuck,
      rooted: s.rooted,
      observed_rate: ratio(s.observed),
      strike_rate: ratio(s.rate),
      rate_low: ratio(s.low),
      rate_high: ratio(s.high),
    });
  }
  for (const r of f.raised.bySpecies) {
    out.push({ section: 'raised', species: r.speciesName, rooted: r.rooted, collection_year: r.collectionYear, first_crop_year: r.firstCropYear, estimated_value: r.value });
  }
  for (const g of f.travel.growers) out.push({ section: 'trip', grower: g.growerName, km: g.roundTripKm });
  out.push({ section: 'travel', grower: 'bundle distances', km: f.travel.bundleKm });
  out.push({ section: 'travel', grower: 'round trips', km: f.travel.roundTripKm });

  const csv = Papa.unparse(
    { fields: [...FIGURES_CSV_COLUMNS], data: out.map((c) => FIGURES_CSV_COLUMNS.map((k) => c[k] ?? '')) },
    { escapeFormulae: FORMULA_START, newline: '\r\n' },
  );
  // The byte-order mark makes spreadsheet programs read the file as UTF-8 (accented names).
  return `\ufeff${csv}\r\n`;
}

export function figuresFileName(seasonName: string): string {
  const slug = seasonName
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, '-');
  return `heelwood-figures-${slug || 'season'}.csv`;
}
