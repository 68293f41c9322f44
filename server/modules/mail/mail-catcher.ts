// A local SMTP server on loopback that keeps every message it receives in the database,
// so a cooperative without a mail server (and every test) still has real e-mail:
// nodemailer speaks SMTP to this, and the coordinator reads the result in the mailbox page.
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../../db/client.js';
import { insertMailboxMessage } from './mail.repo.js';

export type MailCatcher = { host: string; port: number; close(): Promise<void> };

const MAX_MESSAGE_BYTES = 15 * 1024 * 1024;

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(a) ? a : a ? [a] : [];
  return list.flatMap((o) => o.value.map((v) => v.address ?? v.name ?? '')).filter(Boolean);
}

export async function startMailCatcher(db: Db, port = 0): Promise<MailCatcher> {
  const server = new SMTPServer({
    secure: false,
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    size: MAX_MESSAGE_BYTES,
    banner: 'Heelwood local mail catcher',
    logger: false,
    onData(stream, session, callback) {
      const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
      const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
      simpleParser(stream)
        .then(async (mail) => {
          const to = addresses(mail.to);
          await insertMailboxMessage(db, {
            messageId: mail.messageId ?? null,
            fromAddress: mail.from?.text || envelopeFrom,
            toAddresses: to.length ? to : envelopeTo,
            subject: mail.subject ?? '',
            textBody: mail.text ?? '',
            htmlBody: typeof mail.html === 'string' ? mail.html : null,
            attachments: mail.attachments.map((att) => ({
              filename: att.filename ?? 'attachment',
              contentType: att.contentType,
              size: att.size,
              contentBase64: att.content.toString('base64'),
            })),
            sizeBytes: (mail.text?.length ?? 0) + mail.attachments.reduce((n, a) => n + a.size, 0),
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const boundPort = typeof address === 'object' && address ? address.port : port;
  return {
    host: '127.0.0.1',
    port: boundPort,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
