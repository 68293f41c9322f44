import { Fragment, useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import type { RoundBundle } from '../../../../shared/schemas/allocation';
import { paths } from '../../../app/paths';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { StatusBadge } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { km, woodName } from '../lib/round-facts';
import { CuttingsEditor } from './cuttings-editor';
import { LockMark } from './lock-mark';
import { useRoundContext } from './round-context';

const stackedCell = 'max-lg:flex max-lg:items-start max-lg:gap-3 max-lg:border-0 max-lg:py-1.5';

function StateCell({ bundle }: { bundle: RoundBundle }) {
  const { round } = useRoundContext();
  const approved = round.status === 'approved' || round.status === 'notified';
  return (
    <div className="flex flex-col items-start gap-1.5">
      {approved ? (
        <>
          {bundle.code ? <span className="font-mono text-base font-bold tracking-wide">{bundle.code}</span> : null}
          <StatusBadge status={bundle.status} />
        </>
      ) : null}
      {bundle.locked ? <LockMark /> : !approved ? <span className="text-sm text-ink-soft">From the solver</span> : null}
    </div>
  );
}

function RemoveCell({ bundle }: { bundle: RoundBundle }) {
  const { editable, askRemove } = useRoundContext();
  if (!editable) return null;
  return (
    <Button variant="danger" size="sm" onClick={() => askRemove(bundle)} aria-label={`Remove the bundle from ${bundle.plantCode} for ${bundle.growerName}`}>
      Remove
    </Button>
  );
}

const features = tableFeatures({});
const column = createColumnHelper<typeof features, RoundBundle>();

const columns = column.columns([
  column.accessor('growerName', { header: 'Grower', cell: (info) => <span className="font-semibold">{info.getValue()}</span> }),
  column.accessor((b) => woodName(b.speciesName, b.varietyName), { id: 'wood', header: 'Wood', cell: (info) => info.getValue() }),
  column.accessor('plantCode', {
    header: 'From plant',
    cell: (info) => (
      <span className="flex flex-col">
        <Link to={paths.plant(info.row.original.plantId)} className="font-mono font-semibold">
          {info.getValue()}
        </Link>
        <span className="text-sm text-ink-soft">{info.row.original.farmName}</span>
      </span>
    ),
  }),
  column.accessor('distanceKm', { header: 'Distance', cell: (info) => <span className="tabular-nums">{km(info.getValue())}</span> }),
  column.accessor('cuttings', { header: 'Cuttings', cell: (info) => <CuttingsEditor bundle={info.row.original} /> }),
  column.display({ id: 'state', header: 'Bundle', cell: (info) => <StateCell bundle={info.row.original} /> }),
  column.display({ id: 'actions', header: 'Change', cell: (info) => <RemoveCell bundle={info.row.original} /> }),
]);

/** Problems first (they block approval), then by grower and plant. */
function ordered(bundles: RoundBundle[], held: ReadonlySet<string>): RoundBundle[] {
  const flagged = (b: RoundBundle) => (b.problem || held.has(b.id) ? 0 : 1);
  return [...bundles].sort((a, b) => flagged(a) - flagged(b) || a.growerName.localeCompare(b.growerName) || a.plantCode.localeCompare(b.plantCode));
}

/** Every bundle of the round: edit cuttings in place (which locks the bundle), or remove it. */
export function BundlesTable() {
  const { round, heldIds, editable } = useRoundContext();
  const data = useMemo(() => ordered(round.bundles, heldIds), [round.bundles, heldIds]);
  const table = useTable({ features, columns, data, getRowId: (b) => b.id });
  const visible = table.getAllLeafColumns().filter((c) => editable || c.id !== 'actions');
  const columnCount = visible.length;

  if (round.bundles.length === 0) {
    return (
      <EmptyState title="No bundles in this round">
        {editable ? 'No offered wood could reach any request line. Add a bundle by hand from a request line above, or run the round again after farms offer more.' : 'This round gives no wood.'}
      </EmptyState>
    );
  }

  return (
    <TableShell caption="Bundles in this round" tableClassName="max-lg:block lg:min-w-[60rem]">
      <thead className="max-lg:sr-only">
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers
              .filter((h) => editable || h.column.id !== 'actions')
              .map((header) => (
                <th key={header.id} scope="col" className={th}>
                  {header.isPlaceholder ? null : <table.FlexRender header={header} />}
                </th>
              ))}
          </tr>
        ))}
      </thead>
      <tbody className="max-lg:block">
        {table.getRowModel().rows.map((row) => {
          const b = row.original;
          const held = heldIds.has(b.id);
          const note = b.problem ?? (held ? 'Approval was refused for this bundle: its plant may no longer give wood. Change or remove it.' : null);
          return (
            <Fragment key={row.id}>
              <tr
                data-testid="bundle-row"
                data-problem={note ? 'true' : undefined}
                className={cn(
                  'max-lg:block max-lg:pt-2',
                  note ? 'bg-rust-light/60 [&>td]:border-b-0' : 'max-lg:border-b-2 max-lg:border-paper-edge',
                  note ? 'border-l-4 border-l-rust' : '',
                )}
              >
                {row
                  .getAllCells()
                  .filter((cell) => editable || cell.column.id !== 'actions')
                  .map((cell) => (
                    <td key={cell.id} className={cn(td, stackedCell)}>
                      <span aria-hidden="true" className="w-24 shrink-0 pt-0.5 text-sm font-semibold text-ink-soft lg:hidden">
                        {typeof cell.column.columnDef.header === 'string' ? cell.column.columnDef.header : null}
                      </span>
                      <table.FlexRender cell={cell} />
                    </td>
                  ))}
              </tr>
              {note ? (
                <tr className="border-l-4 border-l-rust bg-rust-light/60 max-lg:block max-lg:border-b-2 max-lg:border-b-paper-edge">
                  <td colSpan={columnCount} className={cn(td, 'pt-0 max-lg:block max-lg:border-0')}>
                    <p className="flex items-start gap-2 font-medium text-rust">
                      <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true" focusable="false" className="mt-1 shrink-0">
                        <polygon points="4.2,0.5 9.8,0.5 13.5,4.2 13.5,9.8 9.8,13.5 4.2,13.5 0.5,9.8 0.5,4.2" fill="currentColor" />
                      </svg>
                      <span>
                        <span className="text-ink">Problem: </span>
                        {note}
                      </span>
                    </p>
                  </td>
                </tr>
              ) : null}
            </Fragment>
          );
        })}
      </tbody>
    </TableShell>
  );
}
