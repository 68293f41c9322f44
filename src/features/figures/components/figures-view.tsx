import type { ReactNode } from 'react';
import type { SeasonFigures } from '../../../../shared/schemas/figures';
import { Card, CardTitle } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { plural } from '../../../lib/format';
import { count, isEmpty, km, money, percent, speciesFigures, strikeBars, treatmentName, varietyName, withRatios } from '../lib/figures-rows';
import { ChartFigure, FillChart, RaisedChart, StrikeChart, WoodChart } from './figures-charts';

const num = cn(td, 'text-right tabular-nums');
const numTh = cn(th, 'text-right');

function Tile({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div className="flex flex-col gap-1 rounded-card border border-paper-edge bg-white/70 p-4">
      <dt className="font-semibold text-ink-soft">{label}</dt>
      <dd className="text-2xl font-bold text-ink tabular-nums">{value}</dd>
      {note ? <dd className="text-sm text-ink-soft">{note}</dd> : null}
    </div>
  );
}

/** A chart and its table side by side on a wide screen, one above the other on a phone. */
function ChartAndTable({ chart, table }: { chart: ReactNode; table: ReactNode }) {
  return <div className="grid items-start gap-5 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">{chart}<div className="min-w-0">{table}</div></div>;
}

function Headings({ cols, numeric }: { cols: string[]; numeric: string[] }) {
  return (
    <thead>
      <tr>
        {cols.map((c) => (
          <th key={c} scope="col" className={numeric.includes(c) ? numTh : th}>
            {c}
          </th>
        ))}
      </tr>
    </thead>
  );
}

function WoodSection({ f }: { f: SeasonFigures }) {
  const species = speciesFigures(f);
  const varieties = withRatios(f.byVariety.filter((r) => r.offered + r.asked + r.allocated + r.collected + r.cancelled > 0));
  const t = f.totals;
  return (
    <Card>
      <CardTitle>Wood by species</CardTitle>
      {species.length === 0 ? (
        <p className="text-ink-soft">No wood was offered or asked for.</p>
      ) : (
        <>
          <ChartAndTable
            chart={
              <ChartFigure
                id="chart-wood"
                caption={`Cuttings offered, asked, allocated and collected for ${plural(species.length, 'species', 'species')}. In all: ${count(t.offered)} offered, ${count(t.asked)} asked, ${count(t.allocated)} allocated, ${count(t.collected)} collected.`}
              >
                <WoodChart rows={species} />
              </ChartFigure>
            }
            table={
              <TableShell caption="Cuttings by species" tableClassName="min-w-[36rem]">
                <Headings cols={['Species', 'Offered', 'Asked', 'Allocated', 'Collected', 'Filled']} numeric={['Offered', 'Asked', 'Allocated', 'Collected', 'Filled']} />
                <tbody>
                  {species.map((r) => (
                    <tr key={r.speciesId}>
                      <th scope="row" className={cn(td, 'text-left font-semibold')}>
                        {r.speciesName}
                      </th>
                      <td className={num}>{count(r.offered)}</td>
                      <td className={num}>{count(r.asked)}</td>
                      <td className={num}>{count(r.allocated)}</td>
                      <td className={num}>{count(r.collected)}</td>
                      <td className={num}>{percent(r.fillRatio)}</td>
                    </tr>
                  ))}
                  <tr className="font-semibold">
                    <th scope="row" className={cn(td, 'text-left')}>
                      All species
                    </th>
                    <td className={num}>{count(t.offered)}</td>
                    <td className={num}>{count(t.asked)}</td>
                    <td className={num}>{count(t.allocated)}</td>
                    <td className={num}>{count(t.collected)}</td>
                    <td className={num}>{percent(f.fill.overallRatio)}</td>
                  </tr>
                </tbody>
              </TableShell>
            }
          />
          <details className="mt-4">
            <summary className="min-h-touch cursor-pointer content-center font-semibold">By variety ({varieties.length} rows)</summary>
            <p className="mb-3 text-ink-soft">
              Lines that asked for any variety of a species are counted under “Any or unnamed variety”; the wood that met them is counted under the variety it came from,
              so one variety can show more allocated than asked.
            </p>
            <TableShell caption="Cuttings by species and variety" tableClassName="min-w-[44rem]">
              <Headings
                cols={['Species', 'Variety', 'Offered', 'Asked', 'Allocated', 'Collected', 'Cancelled']}
                numeric={['Offered', 'Asked', 'Allocated', 'Collected', 'Cancelled']}
              />
              <tbody>
                {varieties.map((r) => (
                  <tr key={`${r.speciesId}:${r.varietyId ?? 'any'}`}>
                    <td className={td}>{r.speciesName}</td>
                    <td className={cn(td, !r.varietyName && 'italic text-ink-soft')}>{varietyName(r)}</td>
                    <td className={num}>{count(r.offered)}</td>
                    <td className={num}>{count(r.asked)}</td>
                    <td className={num}>{count(r.allocated)}</td>
                    <td className={num}>{count(r.collected)}</td>
                    <td className={num}>{count(r.cancelled)}</td>
                  </tr>
                ))}
              </tbody>
            </TableShell>
          </details>
        </>
      )}
    </Card>
  );
}

function FillSection({ f }: { f: SeasonFigures }) {
  const species = speciesFigures(f).filter((r) => r.fillRatio !== null);
  const { fill } = f;
  const lines = [...f.lines].sort((a, b) => a.ratio - b.ratio || a.growerName.localeCompare(b.growerName));
  return (
    <Card>
      <CardTitle>How request lines were filled</CardTitle>
      {fill.lines === 0 ? (
        <p className="text-ink-soft">No wood request was filed.</p>
      ) : (
        <>
          <p className="mb-4">
            Of {plural(fill.lines, 'request line')}, {fill.fullyMet} met in full, {fill.partlyMet} in part and {fill.unmet} not at all. A line got {percent(fill.meanRatio)}{' '}
            of what it asked on average (median {percent(fill.medianRatio)}, lowest {percent(fill.minRatio)}); all lines together, {percent(fill.overallRatio)} of the
            cuttings asked were allocated.
          </p>
          <ChartAndTable
            chart={
              <ChartFigure id="chart-fill" caption={`Share of the cuttings asked that were allocated, for ${plural(species.length, 'species', 'species')} that were asked for.`}>
                <FillChart rows={species} />
              </ChartFigure>
            }
            table={
              <TableShell caption="Cuttings asked and allocated by species" tableClassName="min-w-[28rem]">
                <Headings cols={['Species', 'Asked', 'Allocated', 'Filled']} numeric={['Asked', 'Allocated', 'Filled']} />
                <tbody>
                  {species.map((r) => (
                    <tr key={r.speciesId}>
                      <th scope="row" className={cn(td, 'text-left font-semibold')}>
                        {r.speciesName}
                      </th>
                      <td className={num}>{count(r.asked)}</td>
                      <td className={num}>{count(r.allocated)}</td>
                      <td className={num}>{percent(r.fillRatio)}</td>
                    </tr>
                  ))}
                </tbody>
              </TableShell>
            }
          />
          <details className="mt-4">
            <summary className="min-h-touch cursor-pointer content-center font-semibold">Every request line ({lines.length}), least filled first</summary>
            <TableShell caption="Request lines and how they were filled" tableClassName="min-w-[40rem]">
              <Headings cols={['Grower', 'Asked for', 'Asked', 'Allocated', 'Collected', 'Filled']} numeric={['Asked', 'Allocated', 'Collected', 'Filled']} />
              <tbody>
                {lines.map((l) => (
                  <tr key={l.lineId}>
                    <td className={td}>{l.growerName}</td>
                    <td className={td}>
                      {l.speciesName}
                      <span className="block text-sm text-ink-soft">{l.varietyName ?? 'any variety'}</span>
                    </td>
                    <td className={num}>{count(l.asked)}</td>
                    <td className={num}>{count(l.allocated)}</td>
                    <td className={num}>{count(l.collected)}</td>
                    <td className={num}>{percent(l.ratio)}</td>
                  </tr>
                ))}
              </tbody>
            </TableShell>
          </details>
        </>
      )}
    </Card>
  );
}

function TravelSection({ f }: { f: SeasonFigures }) {
  const { travel } = f;
  return (
    <Card>
      <CardTitle>Travel</CardTitle>
      {travel.bundles === 0 ? (
        <p className="text-ink-soft">No bundles were allocated, so nobody had to travel.</p>
      ) : (
        <>
          <p className="mb-4">
            {plural(travel.bundles, 'bundle')}, {km(travel.bundleKm)} from growers to farms counted bundle by bundle. Visiting their farms in the shortest order,{' '}
            {plural(travel.growers.length, 'grower')} drove {km(travel.roundTripKm)} in round trips. Straight-line distances, not roads.
          </p>
          <TableShell caption="Round trips per grower" tableClassName="min-w-[32rem]">
            <Headings cols={['Grower', 'Farms', 'Bundles', 'Round trip']} numeric={['Farms', 'Bundles', 'Round trip']} />
            <tbody>
              {travel.growers.map((g) => (
                <tr key={g.growerId}>
                  <td className={td}>{g.growerName}</td>
                  <td className={num}>{g.farms}</td>
                  <td className={num}>{g.bundles}</td>
                  <td className={num}>{g.roundTripKm == null ? 'no place given' : km(g.roundTripKm)}</td>
                </tr>
              ))}
            </tbody>
          </TableShell>
        </>
      )}
    </Card>
  );
}

function StrikeSection({ f }: { f: SeasonFigures }) {
  const bars = strikeBars(f);
  const rows = [...f.strikeRates].sort(
    (a, b) => a.speciesName.localeCompare(b.speciesName) || (a.level === b.level ? 0 : a.level === 'species' ? -1 : 1) || (a.varietyName ?? '').localeCompare(b.varietyName ?? '') || a.treatment.localeCompare(b.treatment),
  );
  return (
    <Card>
      <CardTitle>Strike rates</CardTitle>
      {rows.length === 0 ? (
        <p className="text-ink-soft">No strike reports for this season's wood yet. Growers report how many cuttings rooted once they know.</p>
      ) : (
        <>
          <p className="mb-4 text-ink-soft">
            From this season's strike reports only: each species' reference rate updated by what rooted, with a 90 % interval. The planner uses every season's reports.
          </p>
          <ChartAndTable
            chart={
              <ChartFigure id="chart-strike" caption={`Estimated strike rate by species and treatment, with its 90 % interval, from ${plural(bars.reduce((s, b) => s + b.row.reports, 0), 'strike report')}.`}>
                <StrikeChart bars={bars} />
              </ChartFigure>
            }
            table={
              <TableShell caption="Strike rates by species, variety and treatment" tableClassName="min-w-[44rem]">
                <Headings cols={['Species and variety', 'Treatment', 'Reports', 'Rooted of stuck', 'Estimate', '90 % interval']} numeric={['Reports', 'Rooted of stuck', 'Estimate']} />
                <tbody>
                  {rows.map((r) => (
                    <tr key={`${r.level}:${r.speciesId}:${r.varietyId ?? ''}:${r.treatment}`} className={cn(r.level === 'species' && 'font-medium')}>
                      <td className={td}>
                        {r.speciesName}
                        <span className="block text-sm font-normal text-ink-soft">{r.level === 'species' ? 'all varieties' : (r.varietyName ?? 'unnamed variety')}</span>
                      </td>
                      <td className={td}>{treatmentName(r.treatment)}</td>
                      <td className={num}>{r.reports}</td>
                      <td className={num}>
                        {count(r.rooted)} of {count(r.stuck)}
                      </td>
                      <td className={num}>{percent(r.rate)}</td>
                      <td className={cn(td, 'whitespace-nowrap tabular-nums')}>
                        {percent(r.low)} – {percent(r.high)}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </TableShell>
            }
          />
        </>
      )}
    </Card>
  );
}

function RaisedSection({ f }: { f: SeasonFigures }) {
  const { raised } = f;
  return (
    <Card>
      <CardTitle>Plants raised and their value</CardTitle>
      {raised.rooted === 0 ? (
        <p className="text-ink-soft">No rooted cuttings reported yet. Once growers file strike reports, the plants raised and their estimated value appear here.</p>
      ) : (
        <>
          <p className="mb-4">
            {count(raised.rooted)} plants raised, worth about <strong>{money(raised.value, raised.currency)}</strong> at {money(raised.valuePerPlant, raised.currency)}{' '}
            a plant (the cooperative's setting; about 10 in the local currency is common practice). An estimate for planning, not a valuation.
          </p>
          <ChartAndTable
            chart={
              <ChartFigure
                id="chart-raised"
                caption={`Plants raised by the year they are expected to first crop: ${raised.byFirstCropYear.map((y) => `${y.year}: ${count(y.rooted)}`).join('; ')}.`}
              >
                <RaisedChart years={raised.byFirstCropYear} />
              </ChartFigure>
            }
            table={
              <TableShell caption="Plants raised by species and first crop year" tableClassName="min-w-[36rem]">
                <Headings cols={['Species', 'Collected', 'First crop', 'Plants', 'Value']} numeric={['Plants', 'Value']} />
                <tbody>
                  {raised.bySpecies.map((r) => (
                    <tr key={`${r.speciesId}:${r.collectionYear}`}>
                      <td className={td}>{r.speciesName}</td>
                      <td className={td}>{r.collectionYear}</td>
                      <td className={td}>
                        {r.firstCropYear} <span className="text-sm text-ink-soft">(after {plural(r.firstCropYears, 'year')})</span>
                      </td>
                      <td className={num}>{count(r.rooted)}</td>
                      <td className={num}>{money(r.value, raised.currency)}</td>
                    </tr>
                  ))}
                </tbody>
              </TableShell>
            }
          />
        </>
      )}
    </Card>
  );
}

/** A season's figures: totals, then wood, fill, travel, strike rates and plants raised, each a chart with its table. */
export function FiguresView({ figures }: { figures: SeasonFigures }) {
  if (isEmpty(figures)) {
    return (
      <EmptyState title="No figures for this season yet">
        Nothing has been offered, asked for or collected{figures.scope === 'member' ? ' by you or your farms' : ''} in {figures.season.name}. Figures appear as farms offer wood
        and growers file requests.
      </EmptyState>
    );
  }
  const t = figures.totals;
  return (
    <div className="flex flex-col gap-5">
      <section aria-labelledby="figures-totals">
        <h2 id="figures-totals" className="sr-only">
          Totals
        </h2>
        <dl className="grid grid-cols-2 gap-3 md:grid-cols-3 xl:grid-cols-6">
          <Tile label="Offered" value={count(t.offered)} note="cuttings" />
          <Tile label="Asked" value={count(t.asked)} note="cuttings" />
          <Tile label="Allocated" value={count(t.allocated)} note={`${percent(figures.fill.overallRatio)} of asked`} />
          <Tile label="Collected" value={count(t.collected)} note={t.cancelled ? `${count(t.cancelled)} cancelled` : 'cuttings'} />
          <Tile label="Round trips" value={km(figures.travel.roundTripKm)} note={plural(figures.travel.growers.length, 'grower')} />
          <Tile label="Plants raised" value={count(figures.raised.rooted)} note={`about ${money(figures.raised.value, figures.raised.currency)}`} />
        </dl>
      </section>
      <WoodSection f={figures} />
      <FillSection f={figures} />
      <StrikeSection f={figures} />
      <RaisedSection f={figures} />
      <TravelSection f={figures} />
    </div>
  );
}
