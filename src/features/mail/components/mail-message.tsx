import { useId, useState } from 'react';
import type { MailMessage } from '../../../../shared/schemas/mail';
import { Button } from '../../../components/ui/button';
import { formatAgo, formatBytes, formatDateTime } from '../../../lib/format';
import { attachmentUrl } from '../api/get-mail';
import { HtmlPreview } from './html-preview';
import { LinkifiedText } from './linkified-text';

export function MailMessageItem({ message }: { message: MailMessage }) {
  const [open, setOpen] = useState(false);
  const [formatted, setFormatted] = useState(false);
  const bodyId = useId();
  const subject = message.subject.trim() || '(no subject)';

  return (
    <li className="rounded-card border border-paper-edge bg-white/70">
      <h2 className="text-base font-normal">
        <button
          type="button"
          aria-expanded={open}
          aria-controls={bodyId}
          onClick={() => setOpen((value) => !value)}
          className="flex min-h-touch w-full flex-col gap-1 rounded-card px-4 py-3 text-left hover:bg-paper-deep sm:flex-row sm:items-baseline sm:gap-4"
        >
          <span aria-hidden="true" className="hidden w-4 shrink-0 text-ink-faint sm:inline">
            {open ? '▾' : '▸'}
          </span>
          <span className="min-w-0 flex-1">
            <span className="block font-semibold text-ink">{subject}</span>
            <span className="block truncate text-sm text-ink-soft">
              From {message.from} · to {message.to.join(', ')}
            </span>
          </span>
          <span className="shrink-0 text-sm text-ink-soft">
            <time dateTime={message.receivedAt} title={formatAgo(message.receivedAt)}>
              {formatDateTime(message.receivedAt)}
            </time>
            {message.attachments.length > 0 ? ` · ${message.attachments.length} attached` : null}
          </span>
        </button>
      </h2>
      <div id={bodyId} hidden={!open} className="border-t border-paper-edge px-4 py-4">
        {open ? (
          <>
            <dl className="mb-4 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
              <dt className="font-semibold">From</dt>
              <dd className="break-all">{message.from}</dd>
              <dt className="font-semibold">To</dt>
              <dd className="break-all">{message.to.join(', ')}</dd>
              <dt className="font-semibold">Received</dt>
              <dd>{formatDateTime(message.receivedAt)}</dd>
            </dl>
            {message.htmlBody ? (
              <div className="mb-3">
                <Button size="sm" variant="secondary" aria-pressed={formatted} onClick={() => setFormatted((value) => !value)}>
                  {formatted ? 'Show plain text' : 'Show formatted version'}
                </Button>
              </div>
            ) : null}
            {formatted && message.htmlBody ? (
              <HtmlPreview html={message.htmlBody} title={`Formatted version of “${subject}”`} />
            ) : (
              <pre className="whitespace-pre-wrap break-words rounded-lg bg-paper-deep p-4 font-sans text-base">
                {message.textBody.trim() ? <LinkifiedText text={message.textBody} /> : <span className="text-ink-faint">This message has no plain-text part.</span>}
              </pre>
            )}
            {message.attachments.length > 0 ? (
              <div className="mt-4">
                <h3 className="mb-2 font-semibold">Attachments</h3>
                <ul className="flex flex-col gap-1">
                  {message.attachments.map((attachment) => (
                    <li key={attachment.index}>
                      <a href={attachmentUrl(message.id, attachment.index)} download={attachment.filename || undefined} className="inline-flex min-h-touch items-center">
                        {attachment.filename || `Attachment ${attachment.index + 1}`}
                      </a>{' '}
                      <span className="text-sm text-ink-soft">
                        ({attachment.contentType}, {formatBytes(attachment.size)})
                      </span>
                    </li>
                  ))}
                </ul>
              </div>
            ) : null}
          </>
        ) : null}
      </div>
    </li>
  );
}
