import { CoordinatorHome, type PendingCount } from '../../features/home/components/coordinator-home';
import { MemberHome } from '../../features/home/components/member-home';
import { usePendingMemberCount } from '../../features/members/api/get-members';
import { errorMessage } from '../../lib/api-client';
import { useSignedIn } from './use-signed-in';

function CoordinatorHomeRoute() {
  const me = useSignedIn();
  const count = usePendingMemberCount();
  const pending: PendingCount = count.isPending
    ? { state: 'loading' }
    : count.isError
      ? { state: 'error', message: errorMessage(count.error) }
      : { state: 'ready', count: count.data };
  return <CoordinatorHome me={me} pending={pending} />;
}

export function HomeRoute() {
  const me = useSignedIn();
  return (
    <>
      <title>Home · Heelwood</title>
      {me.user.role === 'coordinator' ? <CoordinatorHomeRoute /> : <MemberHome me={me} />}
    </>
  );
}
