import {
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_basic,
  sortFn_text,
  tableFeatures,
  useTable,
  type SortingState,
  type Updater,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { TREATMENTS } from '../../../../shared/domain';
import type { StrikeRateRow } from '../../../../shared/schemas/strike-reports';
import { EmptyState } from '../../../components/ui/empty-state';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { pct, treatmentWords, whole } from '../lib/words';
import { ariaSort, SortButton } from '../../../components/ui/sort-button';

/** The interval as a bar from 0 to 100 %, the mean marked; the figures beside it say the same. */
function IntervalBar({ row }: { row: StrikeRateRow }) {
  return (
    <svg width="64" height="14" viewBox="0 0 100 14" preserveAspectRatio="none" aria-hidden="true" focusable="false" className="shrink-0">
      <rect x="0" y="6" width="100" height="2" className="fill-paper-edge" />
      <rect x={row.low * 100} y="3" width={Math.max(1, (row.high - row.low) * 100)} height="8" rx="2" className={row.source === 'reports' ? 'fill-leaf/70' : 'fill-bark-light'} />
      <rect x={row.rate * 100 - 1} y="0" width="2" height="14" className="fill-ink" />
    </svg>
  );
}

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { text: sortFn_text, basic: sortFn_basic },
});
const column = createColumnHelper<typeof features, StrikeRateRow>();

/** The table does not know the species list; the page says how each species is propagated. */
export type MethodsOf = (speciesId: string) => string;

function columnsFor(methodsOf: MethodsOf) {
  return column.columns([
    column.accessor('speciesName', { id: 'species', header: 'Species', sortFn: 'text', cell: (info) => <span className="font-semibold">{info.getValue()}</span> }),
    column.accessor((row) => row.varietyName ?? '', {
      id: 'variety',
      header: 'Variety',
      sortFn: 'text',
      cell: (info) => (info.row.original.level === 'species' ? <span className="italic text-ink-soft">All varieties</span> : info.getValue() || 'Not named'),
    }),
    column.accessor((row) => methodsOf(row.speciesId), { id: 'method', header: 'Method', sortFn: 'text', cell: (info) => <span className="block min-w-36 text-sm text-ink-soft">{info.getValue()}</span> }),
    column.accessor((row) => TREATMENTS.indexOf(row.treatment), { id: 'treatment', header: 'Treatment', sortFn: 'basic', cell: (info) => treatmentWords(info.row.original.treatment) }),
    column.accessor((row) => row.prior.rate, {
      id: 'prior',
      header: 'Reference (prior)',
      sortFn: 'basic',
      sortDescFirst: true,
      cell: (info) => (
        <span className="whitespace-nowrap tabular-nums" title={`Untreated reference ${pct(info.row.original.prior.untreated)}, weighed as ${whole(info.row.original.prior.strength)} cuttings`}>
          {pct(info.getValue())} <span className="text-sm text-ink-soft">weight {whole(info.row.original.prior.strength)}</span>
        </span>
      ),
    }),
    column.accessor('reports', {
      id: 'reports',
      header: 'Reports',
      sortFn: 'basic',
      sortDescFirst: true,
      cell: (info) =>
        info.getValue() === 0 ? (
          <span className="text-ink-soft">None yet</span>
        ) : (
          <span className="whitespace-nowrap tabular-nums">
            {whole(info.getValue())}{' '}
            <span className="text-sm text-ink-soft">
              ({whole(info.row.original.rooted)} of {whole(info.row.original.stuck)} rooted)
            </span>
          </span>
        ),
    }),
    column.accessor('rate', {
      id: 'rate',
      header: 'Posterior mean',
      sortFn: 'basic',
      sortDescFirst: true,
      cell: (info) => (
        <strong className="whitespace-nowrap tabular-nums" data-testid="rate-mean">
          {pct(info.getValue())}
        </strong>
      ),
    }),
    column.accessor((row) => row.high - row.low, {
      id: 'interval',
      header: '90 % interval',
      sortFn: 'basic',
      cell: (info) => (
        <span className="flex items-center justify-end gap-2">
          <span className="whitespace-nowrap tabular-nums" data-testid="rate-interval">
            {pct(info.row.original.low)} to {pct(info.row.original.high)}
          </span>
          <IntervalBar row={info.row.original} />
        </span>
      ),
    }),
  ]);
}

const NUMERIC = new Set(['prior', 'reports', 'rate', 'interval']);

export const rowKey = (row: Pick<StrikeRateRow, 'speciesId' | 'varietyId' | 'treatment'>) => `${row.speciesId}:${row.varietyId ?? 'all'}:${row.treatment}`;

/**
 * Strike-rate estimates: one row per species and treatment (every variety pooled), and one per
 * variety and treatment that has reports. Sortable by any column; the server's order first.
 */
export function StrikeRateTable({ rows, methodsOf }: { rows: StrikeRateRow[]; methodsOf: MethodsOf }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const columns = useMemo(() => columnsFor(methodsOf), [methodsOf]);
  const table = useTable({
    features,
    columns,
    data: rows,
    getRowId: rowKey,
    state: { sorting },
    onSortingChange: (updater: Updater<SortingState>) => setSorting((old) => (typeof updater === 'function' ? updater(old) : updater)),
  });

  if (rows.length === 0) {
    return <EmptyState title="No strike rates for this choice">Choose another species or treatment, or show them all.</EmptyState>;
  }

  return (
    <TableShell caption="Strike rates by species, variety and treatment" tableClassName="min-w-[60rem]">
      <thead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => {
              const dir = header.column.getIsSorted();
              return (
                <th
                  key={header.id}
                  scope="col"
                  className={cn(th, NUMERIC.has(header.column.id) && 'text-right')}
                  aria-sort={ariaSort(dir)}
                >
                  <SortButton dir={dir} onClick={header.column.getToggleSortingHandler()} className={cn('px-1', NUMERIC.has(header.column.id) && 'flex-row-reverse text-right')}>
                    <table.FlexRender header={header} />
                  </SortButton>
                </th>
              );
            })}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr
            key={row.id}
            className={cn(row.original.level === 'species' && 'bg-paper-deep/40')}
            data-testid="strike-rate-row"
            data-species={row.original.speciesName}
            data-variety={row.original.varietyName ?? ''}
            data-level={row.original.level}
            data-treatment={row.original.treatment}
          >
            {row.getAllCells().map((cell) => (
              <td key={cell.id} className={cn(td, 'py-2', NUMERIC.has(cell.column.id) && 'text-right')}>
                <table.FlexRender cell={cell} />
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}
