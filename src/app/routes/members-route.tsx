import { useQueryClient } from '@tanstack/react-query';
import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { USER_STATUSES, type UserStatus } from '../../../shared/domain';
import { meKeys } from '../../features/auth/api/keys';
import { useFarms } from '../../features/farms/api/get-farms';
import { farmKeys } from '../../features/farms/api/keys';
import type { MemberListFilters } from '../../features/members/api/keys';
import { MEMBERS_PAGE_SIZE, MembersAdmin } from '../../features/members/components/members-admin';
import { MembersTableContext, type MembersTableContextValue } from '../../features/members/components/members-context';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';
import { CoordinatorOnly } from './coordinator-only';
import { useSignedIn } from './use-signed-in';

function readFilters(params: URLSearchParams): MemberListFilters {
  const status = params.get('status');
  const page = Number.parseInt(params.get('page') ?? '1', 10);
  return {
    status: (USER_STATUSES as readonly string[]).includes(status ?? '') ? (status as UserStatus) : undefined,
    q: params.get('q')?.trim() || undefined,
    page: Number.isFinite(page) && page > 0 ? page : 1,
    pageSize: MEMBERS_PAGE_SIZE,
  };
}

function MembersPage() {
  const me = useSignedIn();
  const queryClient = useQueryClient();
  const [params, setParams] = useSearchParams();
  const filters = readFilters(params);
  const farms = useFarms();

  const context = useMemo<MembersTableContextValue>(
    () => ({
      currentUserId: me.user.id,
      farms: farms.data?.items ?? [],
      farmsUnavailable: farms.isError ? `The farm list did not load: ${errorMessage(farms.error)}` : null,
      // Farm membership shows up in the farms' member counts and, for yourself, on your home page.
      onMembershipChange: () => {
        void queryClient.invalidateQueries({ queryKey: farmKeys.all });
        void queryClient.invalidateQueries({ queryKey: meKeys.all });
      },
    }),
    [me.user.id, farms.data, farms.isError, farms.error, queryClient],
  );

  const onFiltersChange = (next: Partial<MemberListFilters>) => {
    const merged = { ...filters, ...next };
    const href = paths.members({ status: merged.status, q: merged.q, page: merged.page });
    setParams(new URLSearchParams(href.split('?')[1] ?? ''));
  };

  return (
    <>
      <title>Members · Heelwood</title>
      <PageHeader title="Members" lead="Admit applications, suspend or reinstate members, set coordinators, and place members on farms." />
      <MembersTableContext.Provider value={context}>
        <MembersAdmin filters={filters} onFiltersChange={onFiltersChange} />
      </MembersTableContext.Provider>
    </>
  );
}

export function MembersRoute() {
  return (
    <CoordinatorOnly>
      <MembersPage />
    </CoordinatorOnly>
  );
}
