import type { Me } from '../../../../shared/schemas/members';
import { paths } from '../../../app/paths';
import { ButtonLink } from '../../../components/ui/button';
import { Card, CardTitle } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { StatusShapeIcon } from '../../../components/ui/status-badge';
import { FarmList } from './farm-list';
import { SafetyNote } from './safety-note';

export type PendingCount = { state: 'loading' } | { state: 'error'; message: string } | { state: 'ready'; count: number };

function PendingCard({ pending }: { pending: PendingCount }) {
  return (
    <Card tone={pending.state === 'ready' && pending.count > 0 ? 'emphasis' : 'plain'}>
      <CardTitle>Applications</CardTitle>
      {pending.state === 'loading' ? <p className="text-ink-soft">Counting applications…</p> : null}
      {pending.state === 'error' ? <p className="text-rust">Could not count applications: {pending.message}</p> : null}
      {pending.state === 'ready' ? (
        <p className="flex items-center gap-3">
          <StatusShapeIcon shape="hollow-circle" className="h-5 w-5 text-amber" />
          <span>
            <span className="text-3xl font-bold text-currant">{pending.count}</span>{' '}
            <span className="text-lg">{pending.count === 1 ? 'member awaits' : 'members await'} admission</span>
          </span>
        </p>
      ) : null}
      <p className="mt-2 text-ink-soft">
        {pending.state === 'ready' && pending.count === 0
          ? 'Nobody is waiting. New applications appear here as growers apply.'
          : 'Read each application, then admit the grower or leave it for now.'}
      </p>
      <ButtonLink className="mt-4" to={paths.members({ status: 'pending' })}>
        Review applications
      </ButtonLink>
    </Card>
  );
}

export function CoordinatorHome({ me, pending }: { me: Me; pending: PendingCount }) {
  return (
    <div>
      <PageHeader title="Coordinator's desk" lead={`Signed in as ${me.user.name}. What needs you today.`} />
      <div className="grid gap-5 md:grid-cols-2">
        <PendingCard pending={pending} />
        <Card>
          <CardTitle>Mailbox</CardTitle>
          <p className="text-ink-soft">
            Every e-mail Heelwood sends (password links and other notices) can be read here when no outside mail server is set up.
          </p>
          <ButtonLink className="mt-4" variant="secondary" to={paths.mailbox()}>
            Open the mailbox
          </ButtonLink>
        </Card>
        <Card>
          <CardTitle>Plant health</CardTitle>
          <p className="text-ink-soft">Plants on hold or on watch, plants not inspected in time, findings over the months and members' district notes.</p>
          <div className="mt-4 flex flex-wrap gap-2">
            <ButtonLink variant="secondary" to={paths.health()}>
              Open the health record
            </ButtonLink>
            <ButtonLink variant="secondary" to={paths.plants()}>
              All plants
            </ButtonLink>
          </div>
        </Card>
        <Card>
          <CardTitle>Members</CardTitle>
          <p className="text-ink-soft">Admit, suspend or reinstate members, change roles and place people on farms.</p>
          <ButtonLink className="mt-4" variant="secondary" to={paths.members()}>
            All members
          </ButtonLink>
        </Card>
        {me.farms.length > 0 ? <FarmList farms={me.farms} /> : null}
      </div>
      {me.farms.length > 0 ? (
        <div className="mt-5">
          <SafetyNote />
        </div>
      ) : null}
    </div>
  );
}
