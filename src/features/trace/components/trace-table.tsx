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
import { Link } from 'react-router-dom';
import type { HealthStatus } from '../../../../shared/domain';
import type { Trace } from '../../../../shared/schemas/trace';
import { paths } from '../../../app/paths';
import { StatusBadge } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { generationLabel, generationNumber, traceRows, type TraceRow } from '../lib/trace-tree';
import { ViaText } from './trace-tree';
import { ariaSort, SortButton } from '../../../components/ui/sort-button';

// Module scope keeps features and columns stable between renders, as the table expects.
const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { text: sortFn_text, basic: sortFn_basic },
});
const column = createColumnHelper<typeof features, TraceRow>();

const HEALTH_ORDER: Record<HealthStatus, number> = { clean: 0, watch: 1, hold: 2, retired: 3 };

const columns = column.columns([
  column.accessor('generation', {
    id: 'generation',
    header: 'Generation',
    sortFn: 'basic',
    // Oldest generation first, as in the tree.
    sortDescFirst: false,
    cell: (info) => (
      <span className="flex flex-col">
        <span className="font-semibold tabular-nums">{generationNumber(info.getValue())}</span>
        <span className="text-sm text-ink-soft">{generationLabel(info.getValue())}</span>
      </span>
    ),
  }),
  column.accessor((row) => row.node.code, {
    id: 'code',
    header: 'Plant',
    sortFn: 'text',
    cell: (info) =>
      info.row.original.generation === 0 ? (
        <span className="font-bold whitespace-nowrap">{info.getValue()}</span>
      ) : (
        <Link to={paths.plant(info.row.original.node.id)} className="font-semibold whitespace-nowrap">
          {info.getValue()}
        </Link>
      ),
  }),
  column.accessor((row) => `${row.node.speciesName} ${row.node.varietyName ?? ''}`, {
    id: 'variety',
    header: 'Variety',
    sortFn: 'text',
    cell: (info) => (
      <span>
        {info.row.original.node.varietyName ?? <span className="text-ink-faint">Not named</span>}
        <span className="block text-sm text-ink-soft">{info.row.original.node.speciesName}</span>
      </span>
    ),
  }),
  column.accessor((row) => row.node.farmName, { id: 'farm', header: 'Farm', sortFn: 'text', cell: (info) => info.getValue() }),
  column.accessor((row) => HEALTH_ORDER[row.node.healthStatus], {
    id: 'health',
    header: 'Health',
    sortFn: 'basic',
    cell: (info) => <StatusBadge status={info.row.original.node.healthStatus} />,
  }),
  column.accessor((row) => row.parent?.code ?? '', {
    id: 'parent',
    header: 'Raised from',
    sortFn: 'text',
    cell: (info) => {
      const parent = info.row.original.parent;
      return parent ? <Link to={paths.plant(parent.id)}>{parent.code}</Link> : <span className="text-ink-faint">—</span>;
    },
  }),
  column.accessor((row) => row.node.via?.code ?? '', {
    id: 'bundle',
    header: 'Bundle it came as',
    sortFn: 'text',
    enableSorting: false,
    cell: (info) => (info.row.original.node.via ? <ViaText node={info.row.original.node} /> : <span className="text-ink-faint">—</span>),
  }),
]);

/** Every plant of the trace in one sortable table, oldest generation first. */
export function TraceTable({ trace }: { trace: Trace }) {
  const data = useMemo(() => traceRows(trace), [trace]);
  const [sorting, setSorting] = useState<SortingState>([]);
  const table = useTable({
    features,
    columns,
    data,
    getRowId: (row) => row.node.id,
    state: { sorting },
    onSortingChange: (updater: Updater<SortingState>) => setSorting((old) => (typeof updater === 'function' ? updater(old) : updater)),
  });

  return (
    <TableShell caption={`Plants in the trace of ${trace.plant.code}`} tableClassName="min-w-[60rem]">
      <thead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => {
              const dir = header.column.getIsSorted();
              const label = typeof header.column.columnDef.header === 'string' ? header.column.columnDef.header : header.id;
              return (
                <th key={header.id} scope="col" className={th} aria-sort={header.column.getCanSort() ? ariaSort(dir, 'none') : undefined}>
                  {header.column.getCanSort() ? (
                    <SortButton dir={dir} onClick={header.column.getToggleSortingHandler()} className="relative text-left">
                      {label}
                    </SortButton>
                  ) : (
                    label
                  )}
                </th>
              );
            })}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} data-testid="trace-row" className={cn(row.original.generation === 0 && 'bg-currant-light/40')}>
            {row.getAllCells().map((cell) => (
              <td key={cell.id} className={td}>
                <table.FlexRender cell={cell} />
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}
