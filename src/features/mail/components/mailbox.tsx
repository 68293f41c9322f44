import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Pager } from '../../../components/ui/table-shell';
import { errorMessage } from '../../../lib/api-client';
import { useMail } from '../api/get-mail';
import { useMailStatus } from '../api/get-mail-status';
import { MailMessageItem } from './mail-message';

export const MAIL_PAGE_SIZE = 20;

export function Mailbox({ page, onPageChange }: { page: number; onPageChange: (page: number) => void }) {
  const status = useMailStatus();
  const mail = useMail({ page, pageSize: MAIL_PAGE_SIZE });
  const pageCount = mail.data ? Math.ceil(mail.data.total / MAIL_PAGE_SIZE) : 0;

  return (
    <div className="flex flex-col gap-5">
      {status.data && !status.data.catcher ? (
        <Alert tone="info" title="Mail goes to the configured SMTP server">
          Heelwood sends its e-mail through {status.data.smtpHost || 'the configured SMTP server'}, so new messages do not appear in this
          mailbox. Anything listed below was caught earlier.
        </Alert>
      ) : null}
      {status.data?.catcher ? (
        <p className="text-ink-soft">
          No outside mail server is set up, so Heelwood keeps every e-mail it sends here instead: password links, notices to members
          and, later, pickup slips. Open a message to read it.
        </p>
      ) : null}

      {mail.isPending ? (
        <Loading label="Loading messages…" />
      ) : mail.isError ? (
        <Alert tone="danger" title="The mailbox did not load">
          {errorMessage(mail.error)} Reload the page to try again.
        </Alert>
      ) : mail.data.items.length === 0 && page > 1 ? (
        <EmptyState title={`There is no page ${page}`} action={<Button onClick={() => onPageChange(1)}>Go to the newest messages</Button>}>
          The mailbox is shorter than that now.
        </EmptyState>
      ) : mail.data.items.length === 0 ? (
        <EmptyState
          title="No messages yet"
          action={
            <Button variant="secondary" onClick={() => mail.refetch()} busy={mail.isFetching}>
              Check again
            </Button>
          }
        >
          Mail appears here as soon as Heelwood sends it, for example when someone asks for a password link. This page checks every
          15 seconds.
        </EmptyState>
      ) : (
        <>
          <div className="flex items-center justify-between gap-3">
            <p className="text-ink-soft">Newest first.</p>
            <Button size="sm" variant="secondary" onClick={() => mail.refetch()} busy={mail.isFetching}>
              Check for new mail
            </Button>
          </div>
          <ul className="flex flex-col gap-3" aria-busy={mail.isFetching || undefined}>
            {mail.data.items.map((message) => (
              <MailMessageItem key={message.id} message={message} />
            ))}
          </ul>
          <Pager
            page={page}
            pageCount={pageCount}
            total={mail.data.total}
            noun={['message', 'messages']}
            canPrevious={page > 1}
            canNext={page < pageCount}
            onPrevious={() => onPageChange(page - 1)}
            onNext={() => onPageChange(page + 1)}
          />
        </>
      )}
    </div>
  );
}
