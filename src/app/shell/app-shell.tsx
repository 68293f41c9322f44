import { Navigate, Outlet, useLocation } from 'react-router-dom';
import type { Me } from '../../../shared/schemas/members';
import { useMe } from '../../features/auth/api/get-me';
import { PendingNotice, SuspendedNotice } from '../../features/home/components/account-notices';
import { Loading } from '../../components/ui/loading';
import { ApiError } from '../../lib/api-client';
import { paths } from '../paths';
import { AppHeader } from './app-header';
import { MAIN_ID, SkipLink } from './skip-link';

function Frame({ me, children }: { me: Me | null; children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      {me ? <AppHeader me={me} /> : null}
      <main id={MAIN_ID} tabIndex={-1} className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 sm:px-6 sm:py-10">
        {children}
      </main>
    </div>
  );
}

/**
 * Everything behind sign-in. The person comes from GET /api/me: nobody signed in goes to
 * the sign-in page (and back here afterwards); an applicant not yet admitted sees only
 * the waiting page, whatever address they open.
 */
export function AppShell() {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) {
    return (
      <Frame me={null}>
        <Loading label="Opening Heelwood…" />
      </Frame>
    );
  }

  if (me.isError) {
    // A suspended account may be refused outright rather than answered with its status.
    if (me.error instanceof ApiError && me.error.status === 403) {
      return (
        <Frame me={null}>
          <SuspendedNotice message={me.error.message} />
        </Frame>
      );
    }
    throw me.error;
  }

  if (me.data === null) {
    return <Navigate to={paths.signIn(`${location.pathname}${location.search}`)} replace />;
  }

  const { user } = me.data;
  return (
    <Frame me={me.data}>
      {user.status === 'pending' ? (
        <PendingNotice name={user.name} />
      ) : user.status === 'suspended' ? (
        <SuspendedNotice />
      ) : (
        <Outlet context={me.data} />
      )}
    </Frame>
  );
}
