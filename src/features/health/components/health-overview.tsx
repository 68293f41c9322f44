import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import type { HealthOverview } from '../../../../shared/schemas/health';
import { paths } from '../../../app/paths';
import { Button } from '../../../components/ui/button';
import { Card, CardTitle } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { STATUS_LOOKS, StatusBadge, StatusShapeIcon, type StatusShape } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { formatDay, plural } from '../../../lib/format';

const ATTENTION_SHOWN = 50;

function CountTile({ label, count, shape, tone, note }: { label: string; count: number; shape: StatusShape; tone: string; note?: string }) {
  return (
    <li className="flex flex-col gap-1 rounded-card border border-paper-edge bg-white/70 p-4">
      <span className="flex items-center gap-2 font-semibold">
        <StatusShapeIcon shape={shape} className={cn('h-5 w-5', tone)} />
        {label}
      </span>
      <span className="text-3xl font-bold text-ink">{count}</span>
      {note ? <span className="text-sm text-ink-soft">{note}</span> : null}
    </li>
  );
}

function monthName(month: string): string {
  const [y, m] = month.split('-').map(Number);
  return new Date(y, m - 1, 1).toLocaleDateString('en-GB', { month: 'short', year: 'numeric' });
}

/** Findings per month and pest, with a bar per month so a rise stands out at a glance. */
export function FindingsByMonth({ rows }: { rows: HealthOverview['findingsByMonth'] }) {
  const { months, pests, cell, totals, max } = useMemo(() => {
    const cell = new Map<string, number>();
    const totals = new Map<string, number>();
    const pestTotals = new Map<string, number>();
    for (const r of rows) {
      cell.set(`${r.month}|${r.pestName}`, (cell.get(`${r.month}|${r.pestName}`) ?? 0) + r.n);
      totals.set(r.month, (totals.get(r.month) ?? 0) + r.n);
      pestTotals.set(r.pestName, (pestTotals.get(r.pestName) ?? 0) + r.n);
    }
    const months = [...totals.keys()].sort().reverse();
    const pests = [...pestTotals.entries()].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).map(([name]) => name);
    return { months, pests, cell, totals, max: Math.max(1, ...totals.values()) };
  }, [rows]);

  if (rows.length === 0) {
    return <p className="text-ink-soft">No findings in the last three years. Findings appear here as farms record inspections.</p>;
  }
  return (
    <TableShell caption="Findings by month and pest or disease" tableClassName="min-w-[40rem]">
      <thead>
        <tr>
          <th scope="col" className={th}>
            Month
          </th>
          <th scope="col" className={cn(th, 'w-56')}>
            All findings
          </th>
          {pests.map((pest) => (
            <th key={pest} scope="col" className={cn(th, 'text-right')}>
              {pest}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {months.map((month) => {
          const total = totals.get(month) ?? 0;
          return (
            <tr key={month}>
              <th scope="row" className={cn(td, 'whitespace-nowrap text-left font-medium')}>
                {monthName(month)}
              </th>
              <td className={td}>
                <span className="flex items-center gap-2">
                  <span aria-hidden="true" className="h-3 rounded-sm bg-currant" style={{ width: `${Math.max(4, (total / max) * 100)}%` }} />
                  <span className="font-semibold">{total}</span>
                </span>
              </td>
              {pests.map((pest) => (
                <td key={pest} className={cn(td, 'text-right tabular-nums')}>
                  {cell.get(`${month}|${pest}`) ?? <span className="text-ink-faint">·</span>}
                </td>
              ))}
            </tr>
          );
        })}
      </tbody>
    </TableShell>
  );
}

function AttentionList({ items, lookbackMonths }: { items: HealthOverview['attention']; lookbackMonths: number }) {
  const [all, setAll] = useState(false);
  if (items.length === 0) {
    return (
      <EmptyState title="Nothing needs attention">
        No plant is on hold or on watch, and every plant was inspected within the last {lookbackMonths} months.
      </EmptyState>
    );
  }
  const shown = all ? items : items.slice(0, ATTENTION_SHOWN);
  return (
    <div className="flex flex-col gap-3">
      <TableShell caption="Plants that need attention" tableClassName="max-lg:block lg:min-w-[56rem]">
        <thead className="max-lg:sr-only">
          <tr>
            <th scope="col" className={th}>
              Status
            </th>
            <th scope="col" className={th}>
              Plant
            </th>
            <th scope="col" className={th}>
              Farm
            </th>
            <th scope="col" className={th}>
              Last inspected
            </th>
            <th scope="col" className={th}>
              Why it is here
            </th>
          </tr>
        </thead>
        <tbody className="max-lg:block">
          {shown.map((item) => (
            <tr key={item.id} className="max-lg:flex max-lg:flex-col max-lg:gap-1 max-lg:border-b-2 max-lg:border-paper-edge max-lg:py-3">
              <td className={cn(td, 'max-lg:border-0 max-lg:py-0')}>
                {item.healthStatus === 'clean' ? (
                  <span className="inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border border-ink-faint/40 bg-paper-deep px-2.5 py-0.5 text-sm font-medium">
                    <StatusShapeIcon shape="hollow-circle" className="text-ink-soft" />
                    Not inspected
                  </span>
                ) : (
                  <StatusBadge status={item.healthStatus} />
                )}
              </td>
              <td className={cn(td, 'max-lg:border-0 max-lg:py-0')}>
                <Link to={paths.plant(item.id)} className="font-semibold">
                  {item.code}
                </Link>{' '}
                <span className="text-ink-soft">
                  {item.varietyName ? `${item.varietyName} · ` : ''}
                  {item.speciesName}
                </span>
              </td>
              <td className={cn(td, 'max-lg:border-0 max-lg:py-0')}>{item.farmName}</td>
              <td className={cn(td, 'max-lg:border-0 max-lg:py-0')}>
                <span className="lg:hidden">Last inspected </span>
                {item.lastInspectedOn ? formatDay(item.lastInspectedOn) : <span className="lg:hidden">never</span>}
                {item.lastInspectedOn ? null : <span className="max-lg:hidden">Never</span>}
              </td>
              <td className={cn(td, 'max-lg:border-0 max-lg:py-0 max-lg:text-ink-soft')}>
                {item.reason}
                {item.healthStatus === 'hold' ? (
                  <Link to={paths.plantExposure(item.id)} className="relative mt-1 block min-h-touch content-center font-semibold lg:min-h-0">
                    Exposure and notices{' '}<span className="sr-only">of {item.code}</span>
                  </Link>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </TableShell>
      {items.length > ATTENTION_SHOWN ? (
        <div>
          <Button variant="secondary" onClick={() => setAll((v) => !v)}>
            {all ? `Show the first ${ATTENTION_SHOWN}` : `Show all ${items.length}`}
          </Button>
        </div>
      ) : null}
    </div>
  );
}

export function DistrictNotes({ notes }: { notes: HealthOverview['notes'] }) {
  if (notes.length === 0) return <p className="text-ink-soft">No notes yet. Members add what they see around the district, and it appears here.</p>;
  return (
    <ul className="flex flex-col divide-y divide-paper-edge">
      {notes.map((note) => (
        <li key={note.id} className="py-3">
          <p className="whitespace-pre-wrap">{note.body}</p>
          <p className="mt-1 text-sm text-ink-soft">
            {formatDay(note.notedOn)} · {note.authorName ?? 'a member'}
            {note.lat != null && note.lon != null ? ` · at ${note.lat.toFixed(4)}, ${note.lon.toFixed(4)}` : ''}
          </p>
        </li>
      ))}
    </ul>
  );
}

export function HealthOverviewView({ overview, noteForm }: { overview: HealthOverview; noteForm?: React.ReactNode }) {
  const { counts, lookbackMonths } = overview;
  return (
    <div className="flex flex-col gap-5">
      <section aria-labelledby="health-counts">
        <h2 id="health-counts" className="sr-only">
          Plants by health status
        </h2>
        <ul className="grid grid-cols-2 gap-3 md:grid-cols-3 lg:grid-cols-5">
          <CountTile label={STATUS_LOOKS.hold.label} count={counts.hold} shape={STATUS_LOOKS.hold.shape} tone="text-rust" note="no wood taken" />
          <CountTile label={STATUS_LOOKS.watch.label} count={counts.watch} shape={STATUS_LOOKS.watch.shape} tone="text-amber" note="a finding to follow" />
          <CountTile label="Not inspected" count={counts.stale} shape="hollow-circle" tone="text-ink-soft" note={`within ${plural(lookbackMonths, 'month')}`} />
          <CountTile label={STATUS_LOOKS.clean.label} count={counts.clean} shape={STATUS_LOOKS.clean.shape} tone="text-leaf" />
          <CountTile label={STATUS_LOOKS.retired.label} count={counts.retired} shape={STATUS_LOOKS.retired.shape} tone="text-ink-soft" />
        </ul>
      </section>

      <Card>
        <CardTitle>Needs attention ({overview.attention.length})</CardTitle>
        <p className="mb-4 text-ink-soft">Plants on hold first, then on watch, then those not inspected within the look-back of {plural(lookbackMonths, 'month')}.</p>
        <AttentionList items={overview.attention} lookbackMonths={lookbackMonths} />
      </Card>

      <Card>
        <CardTitle>Findings over time</CardTitle>
        <p className="mb-4 text-ink-soft">Findings recorded in inspections over the last three years, newest month first.</p>
        <FindingsByMonth rows={overview.findingsByMonth} />
      </Card>

      <div className="grid items-start gap-5 lg:grid-cols-2">
        <Card>
          <CardTitle>District notes</CardTitle>
          <DistrictNotes notes={overview.notes} />
        </Card>
        {noteForm ? (
          <Card>
            <CardTitle>Add a district note</CardTitle>
            {noteForm}
          </Card>
        ) : null}
      </div>
    </div>
  );
}
