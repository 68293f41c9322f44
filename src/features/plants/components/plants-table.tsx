import {
  createColumnHelper,
  rowPaginationFeature,
  rowSelectionFeature,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type PaginationState,
  type RowSelectionState,
  type SortingState,
  type Updater,
} from '@tanstack/react-table';
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { LABELS } from '../../../../shared/domain';
import type { PlantListItem, PlantSort } from '../../../../shared/schemas/register';
import { StatusBadge } from '../../../components/ui/status-badge';
import { Pager, TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { formatDay } from '../../../lib/format';

// Module scope keeps features and columns stable between renders, as the table expects.
const features = tableFeatures({ rowPaginationFeature, rowSortingFeature, rowSelectionFeature });
const column = createColumnHelper<typeof features, PlantListItem>();

const stackedCell = 'max-lg:flex max-lg:items-start max-lg:gap-3 max-lg:border-0 max-lg:py-1';

/** Filled in by the page: the plant page's address (the feature does not know the routes). */
export type PlantHref = (id: string) => string;

function columnsFor(plantHref: PlantHref) {
  return column.columns([
    column.display({
      id: 'select',
      header: ({ table }) => (
        <label className="flex min-h-touch min-w-11 items-center justify-center">
          <span className="sr-only">Select every plant on this page</span>
          <input
            type="checkbox"
            className="h-5 w-5 accent-leaf"
            checked={table.getIsAllPageRowsSelected()}
            ref={(el) => {
              if (el) el.indeterminate = !table.getIsAllPageRowsSelected() && table.getIsSomePageRowsSelected();
            }}
            onChange={table.getToggleAllPageRowsSelectedHandler()}
          />
        </label>
      ),
      cell: ({ row }) => (
        <label className="flex min-h-touch min-w-11 items-center justify-center max-lg:justify-start">
          <span className="sr-only">Select {row.original.code}</span>
          <input type="checkbox" className="h-5 w-5 accent-leaf" checked={row.getIsSelected()} onChange={(event) => row.toggleSelected(event.target.checked)} />
        </label>
      ),
      enableSorting: false,
    }),
    column.accessor('code', {
      id: 'code',
      header: 'Code',
      cell: (info) => (
        <Link to={plantHref(info.row.original.id)} className="font-semibold whitespace-nowrap">
          {info.getValue()}
        </Link>
      ),
    }),
    column.accessor('speciesName', {
      id: 'species',
      header: 'Species',
      cell: (info) => (
        <span>
          {info.getValue()}
          <span className="block text-sm italic text-ink-soft">{info.row.original.scientificName}</span>
        </span>
      ),
    }),
    column.accessor('varietyName', {
      id: 'variety',
      header: 'Variety',
      cell: (info) => info.getValue() ?? <span className="text-ink-faint">Not named</span>,
    }),
    column.accessor('farmName', {
      id: 'farm',
      header: 'Farm',
      cell: (info) => (
        <span>
          {info.getValue()} <span className="text-sm text-ink-soft">({info.row.original.farmCode})</span>
        </span>
      ),
    }),
    column.accessor('plantingYear', { id: 'plantingYear', header: 'Planted', cell: (info) => info.getValue() }),
    column.accessor('role', { id: 'role', header: 'Role', cell: (info) => LABELS.plantRole[info.getValue()] }),
    column.accessor('healthStatus', { id: 'healthStatus', header: 'Health', cell: (info) => <StatusBadge status={info.getValue()} /> }),
    column.accessor('lastInspectedOn', {
      id: 'lastInspectedOn',
      header: 'Last inspected',
      cell: (info) => {
        const value = info.getValue();
        return value ? <time dateTime={value}>{formatDay(value)}</time> : <span className="text-ink-faint">Never</span>;
      },
    }),
  ]);
}

function SortMark({ direction }: { direction: false | 'asc' | 'desc' }) {
  return (
    <svg width="12" height="12" viewBox="0 0 12 12" aria-hidden="true" focusable="false" className={cn('shrink-0', direction ? 'text-currant' : 'text-ink-faint')}>
      {direction === 'asc' ? <polygon points="6,2 11,10 1,10" fill="currentColor" /> : null}
      {direction === 'desc' ? <polygon points="1,2 11,2 6,10" fill="currentColor" /> : null}
      {!direction ? <path d="M3 4.5L6 1.5 9 4.5M3 7.5L6 10.5 9 7.5" fill="none" stroke="currentColor" strokeWidth="1.5" /> : null}
    </svg>
  );
}

const noPlants: PlantListItem[] = [];

export function PlantsTable({
  plants,
  total,
  page,
  pageSize,
  sort,
  dir,
  selection,
  onSelectionChange,
  onPageChange,
  onSortChange,
  plantHref,
}: {
  plants: PlantListItem[] | undefined;
  total: number;
  page: number;
  pageSize: number;
  sort: PlantSort;
  dir: 'asc' | 'desc';
  selection: RowSelectionState;
  onSelectionChange: (next: RowSelectionState) => void;
  onPageChange: (page: number) => void;
  onSortChange: (sort: PlantSort, dir: 'asc' | 'desc') => void;
  plantHref: PlantHref;
}) {
  const columns = useMemo(() => columnsFor(plantHref), [plantHref]);
  const pagination: PaginationState = { pageIndex: page - 1, pageSize };
  const sorting: SortingState = [{ id: sort, desc: dir === 'desc' }];
  const table = useTable({
    features,
    columns,
    data: plants ?? noPlants,
    getRowId: (plant) => plant.id,
    // The server filters, sorts and pages; the table draws the page it is given.
    manualPagination: true,
    manualSorting: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    rowCount: total,
    state: { pagination, sorting, rowSelection: selection },
    onPaginationChange: (updater: Updater<PaginationState>) => {
      const next = typeof updater === 'function' ? updater(pagination) : updater;
      onPageChange(next.pageIndex + 1);
    },
    onSortingChange: (updater: Updater<SortingState>) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first) onSortChange(first.id as PlantSort, first.desc ? 'desc' : 'asc');
    },
    onRowSelectionChange: (updater: Updater<RowSelectionState>) => {
      onSelectionChange(typeof updater === 'function' ? updater(selection) : updater);
    },
  });

  const rows = table.getRowModel().rows;

  return (
    <>
      {/* On a phone each plant becomes a stacked card: cells show their own column name. */}
      <TableShell caption="Mother plants" tableClassName="max-lg:block lg:min-w-[64rem]">
        <thead className="max-lg:sr-only">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const canSort = header.column.getCanSort();
                const direction = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    className={cn(th, header.column.id === 'select' && 'w-12 px-1')}
                    aria-sort={direction === 'asc' ? 'ascending' : direction === 'desc' ? 'descending' : undefined}
                  >
                    {header.isPlaceholder ? null : canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="inline-flex min-h-touch items-center gap-1.5 rounded px-1 text-left font-semibold hover:text-ink"
                      >
                        <table.FlexRender header={header} />
                        <SortMark direction={direction} />
                        <span className="sr-only">{direction ? `, sorted ${direction === 'asc' ? 'ascending' : 'descending'}` : ', sort by this column'}</span>
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="max-lg:block">
          {rows.map((row) => (
            <tr key={row.id} className={cn('max-lg:block max-lg:border-b-2 max-lg:border-paper-edge max-lg:py-2', row.getIsSelected() && 'bg-leaf-light/60')}>
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className={cn(td, stackedCell, cell.column.id === 'select' && 'w-12 px-1')}>
                  {cell.column.id !== 'select' ? (
                    <span aria-hidden="true" className="w-28 shrink-0 pt-0.5 text-sm font-semibold text-ink-soft lg:hidden">
                      {typeof cell.column.columnDef.header === 'string' ? cell.column.columnDef.header : null}
                    </span>
                  ) : null}
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </TableShell>
      <Pager
        page={page}
        pageCount={table.getPageCount()}
        total={total}
        noun={['plant', 'plants']}
        canPrevious={table.getCanPreviousPage()}
        canNext={table.getCanNextPage()}
        onPrevious={() => table.previousPage()}
        onNext={() => table.nextPage()}
      />
    </>
  );
}
