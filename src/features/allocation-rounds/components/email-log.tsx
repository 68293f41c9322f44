import type { RoundView } from '../../../../shared/schemas/allocation';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { mailStatusKind, StatusBadge } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { errorMessage } from '../../../lib/api-client';
import { plural } from '../../../lib/format';
import { useResendMail } from '../api/resend-mail';
import { MAIL_KIND_WORDS } from '../lib/round-facts';

/** After approval: every pickup slip and farm list, whether it went, and a way to retry failures. */
export function EmailLog({ round }: { round: RoundView }) {
  const resend = useResendMail();
  const failed = round.emails.filter((e) => e.status === 'failed');
  const sent = round.emails.filter((e) => e.status === 'sent').length;
  const order = (kind: string) => (kind === 'pickup_slip' ? 0 : 1);
  const emails = [...round.emails].sort((a, b) => order(a.kind) - order(b.kind) || a.to.localeCompare(b.to));
  const stuck = round.status === 'approved' && failed.length === 0;

  return (
    <div className="flex flex-col gap-4">
      <p>
        {plural(sent, 'e-mail')} sent{failed.length ? `, ${failed.length} failed` : ''}.{' '}
        {round.status === 'notified' ? 'Every grower and farm has been told.' : ''}
      </p>
      {failed.length > 0 || stuck ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={() => resend.mutate(round.id)} busy={resend.isPending}>
            Send failed ones again
          </Button>
          <span className="text-ink-soft">Only the failed messages go again; nobody gets a second copy.</span>
        </div>
      ) : null}
      {resend.isError ? <Alert tone="danger">{errorMessage(resend.error)}</Alert> : null}
      {resend.isSuccess ? (
        <Alert tone={resend.data.mail.failed ? 'warning' : 'success'}>
          {`Sent again: ${resend.data.mail.sent}; still failing: ${resend.data.mail.failed}.`}
        </Alert>
      ) : null}
      {emails.length > 0 ? (
        <TableShell caption="E-mails sent for this round" tableClassName="min-w-[44rem]">
          <thead>
            <tr>
              <th scope="col" className={th}>
                Message
              </th>
              <th scope="col" className={th}>
                To
              </th>
              <th scope="col" className={th}>
                Status
              </th>
              <th scope="col" className={`${th} text-right`}>
                Attempts
              </th>
              <th scope="col" className={th}>
                Last error
              </th>
            </tr>
          </thead>
          <tbody>
            {emails.map((e, i) => (
              <tr key={`${e.kind}:${e.to}:${i}`}>
                <td className={td}>{MAIL_KIND_WORDS[e.kind] ?? e.kind}</td>
                <td className={`${td} break-all`}>{e.to}</td>
                <td className={td}>
                  <StatusBadge status={mailStatusKind(e.status)} />
                </td>
                <td className={`${td} text-right tabular-nums`}>{e.attempts}</td>
                <td className={`${td} text-sm`}>{e.lastError ?? <span className="text-ink-faint">None</span>}</td>
              </tr>
            ))}
          </tbody>
        </TableShell>
      ) : (
        <p className="text-ink-soft">No e-mails are logged for this round yet.</p>
      )}
    </div>
  );
}
