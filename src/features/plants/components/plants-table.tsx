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
import { useId, useMemo } from 'react';
import { Link } from 'react-router-dom';
import { LABELS } from '../../../../shared/domain';
import type { PlantListItem, PlantSort } from '../../../../shared/schemas/register';
import { Button } from '../../../components/ui/button';
import { Select } from '../../../components/ui/field';
import { StatusBadge } from '../../../components/ui/status-badge';
import { Pager, TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { formatDay } from '../../../lib/format';
import { ariaSort, SortButton, SortMark } from '../../../components/ui/sort-button';

// Module scope keeps features and columns stable between renders, as the table expects.
const features = tableFeatures({ rowPaginationFeature, rowSortingFeature, rowSelectionFeature });
const column = createColumnHelper<typeof features, PlantListItem>();

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
        <label className="flex min-h-touch min-w-11 items-center justify-center">
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

const noPlants: PlantListItem[] = [];

const SORT_WORDS: Record<PlantSort, string> = {
  code: 'Code',
  species: 'Species',
  variety: 'Variety',
  farm: 'Farm',
  plantingYear: 'Planting year',
  lastInspectedOn: 'Last inspected',
  healthStatus: 'Health',
  role: 'Role',
};

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
    // Every column starts ascending (A–Z, oldest first), whatever its type.
    sortDescFirst: false,
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
  const sortId = useId();

  return (
    <>
      {/* On a phone each plant is a short card: code and health first, then what and where. */}
      <div className="mb-3 flex items-end gap-2 lg:hidden">
        <div className="flex flex-1 flex-col gap-1.5">
          <label htmlFor={sortId} className="text-sm font-medium">
            Sort by
          </label>
          <Select id={sortId} value={sort} onChange={(event) => onSortChange(event.target.value as PlantSort, dir)}>
            {(Object.keys(SORT_WORDS) as PlantSort[]).map((key) => (
              <option key={key} value={key}>
                {SORT_WORDS[key]}
              </option>
            ))}
          </Select>
        </div>
        <Button variant="secondary" onClick={() => onSortChange(sort, dir === 'asc' ? 'desc' : 'asc')} aria-label={dir === 'asc' ? 'Ascending; switch to descending' : 'Descending; switch to ascending'}>
          <SortMark dir={dir} />
          {dir === 'asc' ? 'Up' : 'Down'}
        </Button>
      </div>
      <ul className="flex flex-col gap-3 lg:hidden" aria-label="Mother plants">
        {rows.map((row) => {
          const plant = row.original;
          return (
            <li
              key={row.id}
              className={cn('rounded-card border border-paper-edge bg-white/70 p-3', row.getIsSelected() && 'border-leaf bg-leaf-light/60')}
            >
              <div className="flex items-center gap-2">
                <label className="-m-1 flex min-h-touch min-w-11 items-center justify-center">
                  <span className="sr-only">Select {plant.code}</span>
                  <input type="checkbox" className="h-5 w-5 accent-leaf" checked={row.getIsSelected()} onChange={(event) => row.toggleSelected(event.target.checked)} />
                </label>
                <Link to={plantHref(plant.id)} className="min-h-touch flex-1 content-center text-lg font-semibold">
                  {plant.code}
                </Link>
                <StatusBadge status={plant.healthStatus} />
              </div>
              <p className="mt-1">
                <span className="font-medium">{plant.varietyName ?? 'Variety not named'}</span>
                <span className="text-ink-soft"> · {plant.speciesName}</span>
              </p>
              <p className="text-sm text-ink-soft">
                {plant.farmName} · planted {plant.plantingYear} · {LABELS.plantRole[plant.role]}
              </p>
              <p className="text-sm text-ink-soft">
                Last inspected {plant.lastInspectedOn ? <time dateTime={plant.lastInspectedOn}>{formatDay(plant.lastInspectedOn)}</time> : 'never'}
              </p>
            </li>
          );
        })}
      </ul>
      <TableShell caption="Mother plants" className="max-lg:hidden" tableClassName="min-w-[64rem]">
        <thead>
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
                    aria-sort={ariaSort(direction)}
                  >
                    {header.isPlaceholder ? null : canSort ? (
                      <SortButton dir={direction} onClick={header.column.getToggleSortingHandler()} className="px-1 text-left">
                        <table.FlexRender header={header} />
                      </SortButton>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.id} className={cn(row.getIsSelected() && 'bg-leaf-light/60')}>
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className={cn(td, cell.column.id === 'select' && 'w-12 px-1')}>
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
