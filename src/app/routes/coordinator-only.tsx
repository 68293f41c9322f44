import type { ReactNode } from 'react';
import { paths } from '../paths';
import { ButtonLink } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { useSignedIn } from './use-signed-in';

/** Guards coordinator pages; the server refuses the data anyway, this explains it kindly. */
export function CoordinatorOnly({ children }: { children: ReactNode }) {
  const me = useSignedIn();
  if (me.user.role !== 'coordinator') {
    return (
      <div>
        <title>For coordinators · Heelwood</title>
        <PageHeader
          title="This page is for coordinators"
          lead="Your account is a member account. If you need something done here, ask one of the cooperative's coordinators."
        />
        <ButtonLink to={paths.home()}>Go to your home page</ButtonLink>
      </div>
    );
  }
  return <>{children}</>;
}
