// The season's charts (recharts). This module is imported only by the figures page, which
// the router loads on demand, so the chart library is never in the first-load bundle. Each
// chart sits in a <figure> with a caption and has its data in a table beside it.
import type { ReactNode } from 'react';
import { Bar, BarChart, CartesianGrid, ErrorBar, Legend, Tooltip, XAxis, YAxis } from 'recharts';
import type { SeasonFigures } from '../../../../shared/schemas/figures';
import { count, percent, type SpeciesFigures, type StrikeBar } from '../lib/figures-rows';

// The palette of tailwind.config.ts: bark, amber, currant, leaf.
const COLOURS = { offered: '#a58a6c', asked: '#8a5a00', allocated: '#6a1f48', collected: '#2f6b34', ink: '#4f463c', grid: '#d9ccb3' };
const TICK = { fill: COLOURS.ink, fontSize: 13 };

export function ChartFigure({ id, caption, children }: { id: string; caption: ReactNode; children: ReactNode }) {
  return (
    <figure aria-labelledby={`${id}-caption`} data-testid="chart" className="flex min-w-0 flex-col gap-2">
      <figcaption id={`${id}-caption`} className="text-ink-soft">
        {caption}
      </figcaption>
      <div className="min-w-0 rounded-card border border-paper-edge bg-white/80 p-2">{children}</div>
    </figure>
  );
}

const rowHeight = (n: number, per = 44) => Math.max(160, 60 + n * per);

/** Offered, asked, allocated and collected cuttings per species, as horizontal bars. */
export function WoodChart({ rows }: { rows: SpeciesFigures[] }) {
  return (
    <BarChart
      layout="vertical"
      data={rows}
      responsive
      style={{ width: '100%', height: rowHeight(rows.length, 64) }}
      margin={{ top: 8, right: 16, bottom: 8, left: 8 }}
      title="Cuttings offered, asked, allocated and collected by species"
      desc="Four bars per species; the same numbers are in the table beside the chart."
    >
      <CartesianGrid stroke={COLOURS.grid} horizontal={false} />
      <XAxis type="number" tick={TICK} tickFormatter={(v: number) => count(v)} />
      <YAxis type="category" dataKey="speciesName" width={110} tick={TICK} interval={0} />
      <Tooltip formatter={(v) => count(Number(v))} />
      {/* In the order of the bars (the work flows offered → collected), not alphabetical. */}
      <Legend itemSorter={null} />
      <Bar dataKey="offered" name="Offered" fill={COLOURS.offered} isAnimationActive={false} />
      <Bar dataKey="asked" name="Asked" fill={COLOURS.asked} isAnimationActive={false} />
      <Bar dataKey="allocated" name="Allocated" fill={COLOURS.allocated} isAnimationActive={false} />
      <Bar dataKey="collected" name="Collected" fill={COLOURS.collected} isAnimationActive={false} />
    </BarChart>
  );
}

/** Allocated over asked per species, in percent. */
export function FillChart({ rows }: { rows: SpeciesFigures[] }) {
  // Not "fill": recharts reads a data point's `fill` as the bar's colour.
  const data = rows.filter((r) => r.fillRatio !== null).map((r) => ({ speciesName: r.speciesName, filled: Math.round((r.fillRatio ?? 0) * 100) }));
  return (
    <BarChart
      layout="vertical"
      data={data}
      responsive
      style={{ width: '100%', height: rowHeight(data.length) }}
      margin={{ top: 8, right: 24, bottom: 8, left: 8 }}
      title="Share of the cuttings asked that were allocated, by species"
      desc="One bar per species, in percent; the table beside gives the numbers."
    >
      <CartesianGrid stroke={COLOURS.grid} horizontal={false} />
      <XAxis type="number" domain={[0, (max: number) => Math.max(100, max)]} tick={TICK} unit=" %" />
      <YAxis type="category" dataKey="speciesName" width={110} tick={TICK} interval={0} />
      <Tooltip formatter={(v) => `${v} %`} />
      <Bar dataKey="filled" name="Allocated of asked" fill={COLOURS.allocated} isAnimationActive={false} />
    </BarChart>
  );
}

/** Species-level strike rates per treatment, with the 90 % interval as an error bar. */
export function StrikeChart({ bars }: { bars: StrikeBar[] }) {
  return (
    <BarChart
      layout="vertical"
      data={bars}
      responsive
      style={{ width: '100%', height: rowHeight(bars.length, 36) }}
      margin={{ top: 8, right: 24, bottom: 8, left: 8 }}
      title="Strike rate estimates by species and treatment, with 90 % intervals"
      desc="One bar per species and treatment, with a line for the 90 % interval; the table beside gives the numbers."
    >
      <CartesianGrid stroke={COLOURS.grid} horizontal={false} />
      <XAxis type="number" domain={[0, 100]} tick={TICK} unit=" %" />
      <YAxis type="category" dataKey="label" width={200} tick={TICK} interval={0} />
      <Tooltip formatter={(v, _n, item) => (Array.isArray(v) ? v : `${Math.round(Number(v))} % (${percent((item.payload as StrikeBar).row.low)}–${percent((item.payload as StrikeBar).row.high)})`)} />
      <Bar dataKey="rate" name="Strike rate" fill={COLOURS.collected} isAnimationActive={false}>
        <ErrorBar dataKey="interval" direction="x" width={6} strokeWidth={2} stroke={COLOURS.ink} />
      </Bar>
    </BarChart>
  );
}

/** Plants expected to be raised, by the year they first crop. */
export function RaisedChart({ years }: { years: SeasonFigures['raised']['byFirstCropYear'] }) {
  return (
    <BarChart
      data={years}
      responsive
      style={{ width: '100%', height: 260 }}
      margin={{ top: 8, right: 16, bottom: 8, left: 8 }}
      title="Plants raised by the year they first crop"
      desc="One bar per first crop year; the table beside gives the numbers and their value."
    >
      <CartesianGrid stroke={COLOURS.grid} vertical={false} />
      <XAxis dataKey="year" tick={TICK} />
      <YAxis tick={TICK} allowDecimals={false} />
      <Tooltip formatter={(v) => count(Number(v))} />
      <Bar dataKey="rooted" name="Plants raised" fill={COLOURS.collected} isAnimationActive={false} />
    </BarChart>
  );
}
