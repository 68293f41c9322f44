import type { PickupSlip, PickupStop } from '../../../../shared/schemas/allocation';
import { Button } from '../../../components/ui/button';
import { StatusBadge } from '../../../components/ui/status-badge';
import { groupCautions } from '../lib/cautions';
import { formatWindow, zoneWords } from '../lib/farm-time';

// On paper: black on white, no app header or buttons, each farm kept whole on a page, and
// small enough type that a usual slip (two or three farms) fits one A4 sheet.
const PRINT_CSS = `
@page { size: A4 portrait; margin: 12mm; }
@media print {
  html, body { font-size: 10pt !important; background: #fff !important; }
  body:has(.hw-slip) header,
  body:has(.hw-slip) .hw-no-print { display: none !important; }
  body:has(.hw-slip) main { padding: 0 !important; margin: 0 !important; max-width: none !important; }
  .hw-slip, .hw-slip * { color: #000 !important; background: #fff !important; box-shadow: none !important; }
  .hw-slip .hw-slip-box { border-color: #000 !important; }
  .hw-slip-stop { break-inside: avoid; page-break-inside: avoid; }
  .hw-slip a { text-decoration: none !important; }
}
`;

function cuttingsWord(n: number) {
  return `${n.toLocaleString('en')} ${n === 1 ? 'cutting' : 'cuttings'}`;
}

function Stop({ stop, index }: { stop: PickupStop; index: number }) {
  const total = stop.bundles.reduce((sum, b) => sum + b.cuttings, 0);
  return (
    <li className="hw-slip-stop hw-slip-box rounded-card border border-paper-edge bg-white/70 p-4 sm:p-5 print:rounded-none print:p-3" data-testid="slip-stop">
      <h2 className="flex items-start gap-3 text-xl font-semibold print:text-base">
        <span aria-hidden="true" className="hw-slip-box inline-flex h-8 w-8 shrink-0 items-center justify-center rounded-full border-2 border-currant text-base font-bold text-currant print:h-6 print:w-6">
          {index + 1}
        </span>
        <span>
          <span className="sr-only">Stop {index + 1}: </span>
          {stop.farmName}
        </span>
      </h2>
      <div className="mt-2 grid gap-x-6 gap-y-3 sm:grid-cols-2 print:mt-1 print:gap-y-1">
        <div>
          <p>{stop.address}</p>
          <p className="text-sm text-ink-soft">{stop.distanceKm.toLocaleString('en', { maximumFractionDigits: 1 })} km from your place</p>
          {stop.directions ? (
            <p className="mt-2 print:mt-1">
              <span className="font-semibold">How to find it: </span>
              {stop.directions}
            </p>
          ) : null}
        </div>
        <div>
          <p className="font-semibold">When to come ({zoneWords(stop.timezone)})</p>
          {stop.windows.length ? (
            <ul className="mt-1 flex flex-col gap-1">
              {stop.windows.map((w) => (
                <li key={w.startsAt}>
                  <span className="tabular-nums">{formatWindow(w.startsAt, w.endsAt, stop.timezone)}</span>
                  {w.note ? <span className="block text-sm text-ink-soft">{w.note}</span> : null}
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-ink-soft">No pickup window is set: the farm will get in touch.</p>
          )}
        </div>
      </div>
      <ul className="mt-4 flex flex-col gap-2 sm:hidden print:hidden" aria-label={`Bundles to collect at ${stop.farmName}`}>
        {stop.bundles.map((b) => (
          <li key={b.id} className="rounded-lg border border-paper-edge bg-white px-3 py-2">
            <p className="flex flex-wrap items-center justify-between gap-2">
              <span className="whitespace-nowrap font-mono font-bold tracking-wide">{b.code ?? 'pending'}</span>
              <StatusBadge status={b.status} />
            </p>
            <p>
              <span className="font-semibold tabular-nums">{b.cuttings.toLocaleString('en')}</span> cuttings of {b.speciesName}
              {b.varietyName ? ` ‘${b.varietyName}’` : ''}
            </p>
            <p className="text-sm text-ink-soft">
              from plant <span className="font-mono">{b.plantCode}</span>
            </p>
          </li>
        ))}
      </ul>
      <table className="mt-4 w-full border-collapse text-left text-base max-sm:hidden print:mt-2 print:table print:text-[9.5pt]">
        <caption className="sr-only">Bundles to collect at {stop.farmName}</caption>
        <thead>
          <tr className="border-b-2 border-paper-edge">
            <th scope="col" className="hidden w-8 py-1.5 pr-2 print:table-cell">
              <span className="sr-only">Tick</span>
            </th>
            <th scope="col" className="py-1.5 pr-3 font-semibold text-ink-soft">
              Bundle
            </th>
            <th scope="col" className="py-1.5 pr-3 font-semibold text-ink-soft">
              Wood
            </th>
            <th scope="col" className="py-1.5 pr-3 font-semibold text-ink-soft">
              Plant
            </th>
            <th scope="col" className="py-1.5 pr-3 text-right font-semibold text-ink-soft">
              Cuttings
            </th>
            <th scope="col" className="py-1.5 font-semibold text-ink-soft print:hidden">
              Status
            </th>
          </tr>
        </thead>
        <tbody>
          {stop.bundles.map((b) => (
            <tr key={b.id} className="border-b border-paper-edge align-top">
              <td className="hidden py-2 pr-2 print:table-cell" aria-hidden="true">
                <span className="hw-slip-box inline-block h-4 w-4 border border-ink" />
              </td>
              <td className="whitespace-nowrap py-2 pr-3 font-mono font-bold tracking-wide">{b.code ?? 'pending'}</td>
              <td className="py-2 pr-3">
                {b.speciesName}
                {b.varietyName ? ` ‘${b.varietyName}’` : ''}
              </td>
              <td className="py-2 pr-3 font-mono">{b.plantCode}</td>
              <td className="py-2 pr-3 text-right tabular-nums">{b.cuttings.toLocaleString('en')}</td>
              <td className="py-2 print:hidden">
                <StatusBadge status={b.status} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-sm text-ink-soft">
        {stop.bundles.length === 1 ? '1 bundle' : `${stop.bundles.length} bundles`}, {cuttingsWord(total)} in all.
      </p>
    </li>
  );
}

/** The grower's pickup slip: farms in visiting order, when to come, what to collect, and how to handle it. */
export function PickupSlipView({ slip }: { slip: PickupSlip }) {
  const bundles = slip.stops.reduce((n, s) => n + s.bundles.length, 0);
  return (
    <article className="hw-slip" aria-labelledby="slip-title">
      <style>{PRINT_CSS}</style>
      <div className="flex flex-col gap-3 sm:flex-row sm:items-start sm:justify-between">
        <div>
          <h1 id="slip-title" className="text-2xl font-bold tracking-tight sm:text-3xl print:text-xl">
            Pickup slip
          </h1>
          <p className="mt-1 text-lg print:text-base">
            {slip.growerName} · {slip.seasonName}
          </p>
        </div>
        <div className="hw-no-print flex flex-wrap gap-2 print:hidden">
          <Button onClick={() => window.print()}>Print the slip</Button>
        </div>
      </div>
      <p className="mt-4 max-w-prose print:mt-2">
        Collect {bundles === 1 ? '1 bundle' : `${bundles} bundles`} at {slip.stops.length === 1 ? '1 farm' : `${slip.stops.length} farms`}.{' '}
        {slip.stops.length > 1 ? 'Visit them in this order, the shortest round trip from ' : 'The round trip from '}
        <span className="font-semibold">{slip.start.label}</span> is about{' '}
        <span className="font-semibold tabular-nums">{slip.roundTripKm.toLocaleString('en', { maximumFractionDigits: 1 })} km</span>. Each bundle carries its code on a
        label: check it before you leave the farm.
      </p>
      <ol className="mt-5 flex flex-col gap-4 print:mt-3 print:gap-2" aria-label="Farms in visiting order">
        {slip.stops.map((stop, i) => (
          <Stop key={stop.farmId} stop={stop} index={i} />
        ))}
      </ol>
      <section aria-labelledby="slip-cautions" className="hw-slip-stop hw-slip-box mt-6 rounded-card border border-amber/50 bg-amber-light/60 p-4 sm:p-5 print:mt-3 print:rounded-none print:p-3">
        <h2 id="slip-cautions" className="flex items-center gap-2 text-lg font-semibold print:text-base">
          <svg width="18" height="18" viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="shrink-0 text-amber">
            <polygon points="10,1.5 19,18 1,18" fill="currentColor" />
            <rect x="9" y="7" width="2" height="6" fill="white" />
            <rect x="9" y="14.5" width="2" height="2" fill="white" />
          </svg>
          Handling and safety
        </h2>
        <div className="mt-3 grid gap-4 lg:grid-cols-3 print:mt-1 print:grid-cols-3 print:gap-3">
          {groupCautions(slip.cautions).map((group) => (
            <div key={group.title}>
              <h3 className="font-semibold print:text-[9pt]">{group.title}</h3>
              <ul className="mt-1 flex list-disc flex-col gap-1.5 pl-5 print:gap-0.5 print:text-[8.5pt]">
                {group.items.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ul>
            </div>
          ))}
        </div>
      </section>
    </article>
  );
}
