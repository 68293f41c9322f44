import { useState } from 'react';
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
import type { BoardRow } from '../../../../shared/schemas/seasons';
import { EmptyState } from '../../../components/ui/empty-state';
import { Select } from '../../../components/ui/field';
import { StatusBadge, type StatusKind } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { km } from '../lib/words';
import { ariaSort, SortButton } from '../../../components/ui/sort-button';

/** How a board row reads: scarce when more is asked than offered (pressure above 1). */
export function boardStatus(row: BoardRow): StatusKind | null {
  if (row.varietyId === null) return null;
  if (row.offered === 0) return row.asked > 0 ? 'unoffered' : null;
  return row.pressure !== null && row.pressure > 1 ? 'scarce' : 'enough';
}

function PressureCell({ row }: { row: BoardRow }) {
  if (row.varietyId === null) {
    return <span className="text-ink-soft">Met from any variety of the species</span>;
  }
  const status = boardStatus(row);
  return (
    <span className="flex flex-col items-start gap-1">
      {status ? <StatusBadge status={status} /> : <span className="text-ink-soft">Not asked for</span>}
      {row.pressure !== null && row.asked > 0 ? (
        <span className="text-sm text-ink-soft">{Math.round(row.pressure * 100)} % of the offer asked</span>
      ) : null}
    </span>
  );
}

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { text: sortFn_text, basic: sortFn_basic },
});
const column = createColumnHelper<typeof features, BoardRow>();

const columns = column.columns([
  column.accessor('speciesName', { header: 'Species', sortFn: 'text', cell: (info) => <span className="font-semibold">{info.getValue()}</span> }),
  column.accessor((row) => row.varietyName ?? '', {
    id: 'variety',
    header: 'Variety',
    sortFn: 'text',
    cell: (info) => info.getValue() || <span className="italic">Any variety</span>,
  }),
  column.accessor('offered', {
    header: 'Offered',
    sortFn: 'basic',
    sortDescFirst: true,
    cell: (info) => (info.row.original.varietyId === null ? '—' : <span className="tabular-nums">{info.getValue().toLocaleString('en')}</span>),
  }),
  column.accessor('asked', { header: 'Asked', sortFn: 'basic', sortDescFirst: true, cell: (info) => <span className="tabular-nums">{info.getValue().toLocaleString('en')}</span> }),
  column.accessor((row) => (row.varietyId === null ? undefined : row.offered === 0 && row.asked > 0 ? Number.MAX_SAFE_INTEGER : (row.pressure ?? undefined)), {
    id: 'pressure',
    header: 'Pressure',
    sortFn: 'basic',
    sortDescFirst: true,
    sortUndefined: 'last',
    cell: (info) => <PressureCell row={info.row.original} />,
  }),
  column.accessor('farms', {
    header: 'Farms',
    sortFn: 'basic',
    sortDescFirst: true,
    cell: (info) => (info.row.original.varietyId === null ? '—' : <span className="tabular-nums">{info.getValue()}</span>),
  }),
  column.accessor((row) => row.nearestKm ?? undefined, {
    id: 'nearest',
    header: 'Nearest farm',
    sortFn: 'basic',
    sortUndefined: 'last',
    cell: (info) => km(info.row.original.nearestKm),
  }),
]);

const NUMERIC = new Set(['offered', 'asked', 'farms', 'nearest']);

function useBoardTable(rows: BoardRow[], sorting: SortingState, setSorting: (next: (old: SortingState) => SortingState) => void) {
  return useTable({
    features,
    columns,
    data: rows,
    getRowId: (row) => `${row.speciesId}:${row.varietyId ?? 'any'}`,
    state: { sorting },
    onSortingChange: (updater: Updater<SortingState>) => setSorting((old) => (typeof updater === 'function' ? updater(old) : updater)),
  });
}

/** The season's wood by species and variety, sortable by any column. */
export function WoodBoardTable({ rows, hasPlace }: { rows: BoardRow[]; hasPlace: boolean }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const table = useBoardTable(rows, sorting, setSorting);

  if (rows.length === 0) {
    return <EmptyState title="Nothing on the board yet">Farms have not offered wood this season and nobody has asked yet. Look again once offers come in.</EmptyState>;
  }

  const sorted = table.getRowModel().rows;
  const phoneSort = sorting[0] ? `${sorting[0].id}:${sorting[0].desc ? 'desc' : 'asc'}` : '';

  return (
    <>
      {/* On a phone: one short card per row, and a sort choice instead of column headers. */}
      <div className="flex flex-col gap-3 lg:hidden">
        <div className="flex flex-col gap-1.5">
          <label htmlFor="board-sort" className="font-medium">
            Order
          </label>
          <Select
            id="board-sort"
            value={phoneSort}
            onChange={(event) => {
              const [id, dir] = event.target.value.split(':');
              setSorting(id ? [{ id, desc: dir === 'desc' }] : []);
            }}
          >
            <option value="">By species and variety</option>
            <option value="pressure:desc">Scarcest first</option>
            <option value="nearest:asc">Nearest farm first</option>
            <option value="offered:desc">Most offered first</option>
          </Select>
        </div>
        <ul className="flex flex-col divide-y divide-paper-edge rounded-card border border-paper-edge bg-white/70">
          {sorted.map((row) => {
            const r = row.original;
            return (
              <li key={row.id} className="flex flex-col gap-1.5 px-4 py-3">
                <div className="flex items-start justify-between gap-3">
                  <p className="font-semibold">
                    {r.speciesName} · {r.varietyName ?? <span className="italic">any variety</span>}
                  </p>
                  {boardStatus(r) ? <StatusBadge status={boardStatus(r)!} /> : null}
                </div>
                <p className="text-ink-soft">
                  {r.varietyId === null ? (
                    <>{r.asked.toLocaleString('en')} asked, met from any variety of the species</>
                  ) : (
                    <>
                      {r.offered.toLocaleString('en')} offered · {r.asked.toLocaleString('en')} asked · {r.farms} {r.farms === 1 ? 'farm' : 'farms'}
                      {hasPlace && r.nearestKm !== null ? ` · nearest ${km(r.nearestKm)}` : ''}
                    </>
                  )}
                </p>
              </li>
            );
          })}
        </ul>
      </div>
      <div className="hidden lg:block">
        <WideTable table={table} hasPlace={hasPlace} />
      </div>
    </>
  );
}

function WideTable({ table, hasPlace }: { table: ReturnType<typeof useBoardTable>; hasPlace: boolean }) {
  return (
    <TableShell caption="Wood on offer and asked for, by species and variety" tableClassName="min-w-[56rem]">
      <thead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => {
              const dir = header.column.getIsSorted();
              const label = typeof header.column.columnDef.header === 'string' ? header.column.columnDef.header : header.id;
              return (
                <th
                  key={header.id}
                  scope="col"
                  className={cn(th, NUMERIC.has(header.column.id) && 'text-right')}
                  aria-sort={ariaSort(dir, 'none')}
                >
                  <SortButton dir={dir} onClick={header.column.getToggleSortingHandler()}>
                    {label}
                  </SortButton>
                </th>
              );
            })}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => {
          const status = boardStatus(row.original);
          return (
            <tr
              key={row.id}
              className={status === 'scarce' || status === 'unoffered' ? 'bg-amber-light/30' : undefined}
            >
              {row.getAllCells().map((cell) => {
                if (cell.column.id === 'nearest' && !hasPlace) {
                  return (
                    <td key={cell.id} className={cn(td, 'text-right text-ink-soft')}>
                      Give a place above
                    </td>
                  );
                }
                return (
                  <td key={cell.id} className={cn(td, NUMERIC.has(cell.column.id) && 'text-right')}>
                    <table.FlexRender cell={cell} />
                  </td>
                );
              })}
            </tr>
          );
        })}
      </tbody>
    </TableShell>
  );
}
