import { Fragment } from 'react';
import { createColumnHelper, rowPaginationFeature, tableFeatures, useTable, type PaginationState, type Updater } from '@tanstack/react-table';
import type { Member } from '../../../../shared/schemas/members';
import { EmptyState } from '../../../components/ui/empty-state';
import { StatusBadge } from '../../../components/ui/status-badge';
import { Pager, TableShell, td, th } from '../../../components/ui/table-shell';
import { formatDay } from '../../../lib/format';
import { MemberFarms } from './member-farms';
import { MemberRoleSelect } from './member-role-select';
import { MemberStatusActions } from './member-status-actions';
import { cn } from '../../../lib/cn';
import { memberNameId } from './members-context';

const stackedCell = 'max-lg:flex max-lg:items-start max-lg:gap-3 max-lg:border-0 max-lg:py-1.5';

// Module scope keeps features and columns stable between renders, as the table expects.
const features = tableFeatures({ rowPaginationFeature });
const column = createColumnHelper<typeof features, Member>();

const columns = column.columns([
  column.accessor('name', {
    header: 'Name and e-mail',
    cell: (info) => (
      <div className="min-w-44">
        <span id={memberNameId(info.row.original.id)} className="block font-semibold">
          {info.getValue()}
        </span>
        <span className="block break-all text-sm text-ink-soft">{info.row.original.email}</span>
      </div>
    ),
  }),
  column.display({ id: 'role', header: 'Role', cell: (info) => <MemberRoleSelect member={info.row.original} /> }),
  column.accessor('status', {
    header: 'Status',
    cell: (info) => <StatusBadge status={info.getValue()} />,
  }),
  column.accessor('placeName', {
    header: 'Place',
    cell: (info) => info.getValue() || <span className="text-ink-faint">Not given</span>,
  }),
  column.display({ id: 'farms', header: 'Farms', cell: (info) => <MemberFarms member={info.row.original} /> }),
  column.accessor('createdAt', {
    header: 'Applied',
    cell: (info) => <time dateTime={info.getValue()}>{formatDay(info.getValue())}</time>,
  }),
  column.display({ id: 'actions', header: 'Membership', cell: (info) => <MemberStatusActions member={info.row.original} /> }),
]);

const noMembers: Member[] = [];

export function MembersTable({
  members,
  total,
  page,
  pageSize,
  onPageChange,
  emptyMessage,
}: {
  members: Member[] | undefined;
  total: number;
  page: number;
  pageSize: number;
  onPageChange: (page: number) => void;
  emptyMessage: { title: string; body: string };
}) {
  const pagination: PaginationState = { pageIndex: page - 1, pageSize };
  const table = useTable({
    features,
    columns,
    data: members ?? noMembers,
    getRowId: (member) => member.id,
    // The server pages; the table only does the arithmetic for the pager.
    manualPagination: true,
    rowCount: total,
    state: { pagination },
    onPaginationChange: (updater: Updater<PaginationState>) => {
      const next = typeof updater === 'function' ? updater(pagination) : updater;
      onPageChange(next.pageIndex + 1);
    },
  });

  const rows = table.getRowModel().rows;
  const columnCount = table.getAllLeafColumns().length;

  if (members && members.length === 0) {
    return <EmptyState title={emptyMessage.title}>{emptyMessage.body}</EmptyState>;
  }

  return (
    <>
      {/* On a phone each member becomes a stacked card: cells show their own column name. */}
      <TableShell caption="Members of the cooperative" tableClassName="max-lg:block lg:min-w-[60rem]">
        <thead className="max-lg:sr-only">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => (
                <th key={header.id} scope="col" className={th}>
                  {header.isPlaceholder ? null : <table.FlexRender header={header} />}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody className="max-lg:block">
          {rows.map((row) => {
            const note = row.original.status === 'pending' ? row.original.application?.trim() : '';
            return (
              <Fragment key={row.id}>
                <tr className={cn('max-lg:block max-lg:pt-2', note ? '[&>td]:border-b-0' : 'max-lg:border-b-2 max-lg:border-paper-edge')}>
                  {row.getAllCells().map((cell) => (
                    <td key={cell.id} className={cn(td, stackedCell)}>
                      <span aria-hidden="true" className="w-24 shrink-0 pt-0.5 text-sm font-semibold text-ink-soft lg:hidden">
                        {typeof cell.column.columnDef.header === 'string' ? cell.column.columnDef.header : null}
                      </span>
                      <table.FlexRender cell={cell} />
                    </td>
                  ))}
                </tr>
                {note ? (
                  <tr className="max-lg:block max-lg:border-b-2 max-lg:border-paper-edge">
                    <td colSpan={columnCount} className={cn(td, 'pt-0 max-lg:block max-lg:border-0 max-lg:pt-2')}>
                      <div className="rounded-lg bg-paper-deep px-4 py-3">
                        <p className="text-sm font-semibold text-ink-soft">Application from {row.original.name}</p>
                        <p className="mt-1 whitespace-pre-wrap">{note}</p>
                      </div>
                    </td>
                  </tr>
                ) : null}
              </Fragment>
            );
          })}
        </tbody>
      </TableShell>
      <Pager
        page={page}
        pageCount={table.getPageCount()}
        total={total}
        noun={['member', 'members']}
        canPrevious={table.getCanPreviousPage()}
        canNext={table.getCanNextPage()}
        onPrevious={() => table.previousPage()}
        onNext={() => table.nextPage()}
      />
    </>
  );
}
