import { Card } from '../../../components/ui/card';
import { StatusBadge } from '../../../components/ui/status-badge';

export function PendingNotice({ name }: { name: string }) {
  return (
    <Card tone="emphasis" className="max-w-2xl">
      <div className="mb-3">
        <StatusBadge status="pending" />
      </div>
      <h1 className="text-2xl font-bold">Your application is with a coordinator</h1>
      <p className="mt-3">
        Thank you, {name}. A coordinator of the cooperative reads each application and admits new members. Until then there is
        nothing else to see here.
      </p>
      <p className="mt-3 text-ink-soft">You can sign in as usual; this page changes as soon as you are admitted.</p>
    </Card>
  );
}

export function SuspendedNotice({ message }: { message?: string }) {
  return (
    <Card tone="plain" className="max-w-2xl">
      <div className="mb-3">
        <StatusBadge status="suspended" />
      </div>
      <h1 className="text-2xl font-bold">Your membership is suspended</h1>
      <p className="mt-3">{message || 'A coordinator has suspended your membership, so Heelwood is closed to you for now.'}</p>
      <p className="mt-3 text-ink-soft">If you think this is a mistake, contact your cooperative's coordinator.</p>
    </Card>
  );
}
