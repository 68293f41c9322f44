import type { UserStatus } from '../../../../shared/domain';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { errorMessage } from '../../../lib/api-client';
import { useMembers } from '../api/get-members';
import type { MemberListFilters } from '../api/keys';
import { MemberFilters } from './member-filters';
import { MembersTable } from './members-table';

export const MEMBERS_PAGE_SIZE = 25;

function emptyMessage(status: UserStatus | undefined, q: string | undefined) {
  if (q) return { title: `No member matches “${q}”`, body: 'Check the spelling, search by part of the name or e-mail, or choose All.' };
  switch (status) {
    case 'pending':
      return { title: 'No applications waiting', body: 'New growers apply from the sign-up page; their applications appear here for you to admit.' };
    case 'suspended':
      return { title: 'Nobody is suspended', body: 'A member you suspend is listed here, ready to reinstate.' };
    case 'active':
      return { title: 'No admitted members yet', body: 'Admit an application from the Awaiting admission list and the member appears here.' };
    default:
      return { title: 'No members yet', body: 'Share the sign-up page with the growers of the cooperative; each application appears here.' };
  }
}

export function MembersAdmin({
  filters,
  onFiltersChange,
}: {
  filters: MemberListFilters;
  onFiltersChange: (next: Partial<MemberListFilters>) => void;
}) {
  const members = useMembers(filters);

  return (
    <div>
      <MemberFilters
        key={filters.q ?? ''}
        status={filters.status}
        q={filters.q ?? ''}
        onStatusChange={(status) => onFiltersChange({ status, page: 1 })}
        onSearch={(q) => onFiltersChange({ q: q || undefined, page: 1 })}
      />
      {members.isPending ? (
        <Loading label="Loading members…" />
      ) : members.isError ? (
        <Alert tone="danger" title="The member list did not load">
          {errorMessage(members.error)} Reload the page to try again.
        </Alert>
      ) : members.data.items.length === 0 && filters.page > 1 ? (
        <EmptyState
          title={`There is no page ${filters.page}`}
          action={<Button onClick={() => onFiltersChange({ page: 1 })}>Go to the first page</Button>}
        >
          The list is shorter than that now. Start again from its first page.
        </EmptyState>
      ) : (
        <div aria-busy={members.isFetching || undefined}>
          <MembersTable
            members={members.data.items}
            total={members.data.total}
            page={filters.page}
            pageSize={filters.pageSize}
            onPageChange={(page) => onFiltersChange({ page })}
            emptyMessage={emptyMessage(filters.status, filters.q)}
          />
        </div>
      )}
    </div>
  );
}
