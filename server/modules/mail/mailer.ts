// Outgoing e-mail: nodemailer over SMTP (a real server from SMTP_URL, or the local catcher),
// with every send logged, retried a few times, and made idempotent by a dedupe key.
import nodemailer, { type Transporter } from 'nodemailer';
import type Mail from 'nodemailer/lib/mailer';
import type { Db } from '../../db/client.js';
import { claimLogRow, findLogByKey, updateLogRow } from './mail.repo.js';

export type OutgoingMail = {
  kind: string;
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: Mail.Attachment[];
  icalEvent?: Mail.IcalAttachment;
  /** Same key, same message: sent at most once. */
  dedupeKey?: string;
  related?: Record<string, unknown>;
};

export type SendResult = { status: 'sent' | 'failed' | 'duplicate'; logId?: string; error?: string };

export type Mailer = {
  send(mail: OutgoingMail): Promise<SendResult>;
  /** Where mail goes, for the mailbox page. */
  describe(): { catcher: boolean; smtpHost: string };
  close(): void;
};

export function createMailer(
  db: Db,
  opts: { smtpUrl?: string; catcher?: { host: string; port: number }; from: string; retries?: number; retryDelayMs?: number },
): Mailer {
  let transport: Transporter;
  let smtpHost: string;
  if (opts.smtpUrl) {
    transport = nodemailer.createTransport(opts.smtpUrl);
    smtpHost = new URL(opts.smtpUrl).hostname;
  } else if (opts.catcher) {
    transport = nodemailer.createTransport({
      host: opts.catcher.host,
      port: opts.catcher.port,
      secure: false,
      ignoreTLS: true,
    });
    smtpHost = `${opts.catcher.host}:${opts.catcher.port}`;
  } else {
    throw new Error('createMailer needs an SMTP URL or a catcher');
  }
  const retries = opts.retries ?? 3;
  const retryDelayMs = opts.retryDelayMs ?? 500;

  async function send(mail: OutgoingMail): Promise<SendResult> {
    const row = await claimLogRow(db, {
      kind: mail.kind,
      dedupeKey: mail.dedupeKey ?? null,
      toAddress: mail.to,
      subject: mail.subject,
      related: mail.related ?? null,
    });
    if (!row) {
      const existing = mail.dedupeKey ? await findLogByKey(db, mail.dedupeKey) : undefined;
      // A failed earlier attempt may be sent again under the same key; a sent one never.
      if (!existing || existing.status === 'sent' || existing.status === 'queued') {
        return { status: 'duplicate', logId: existing?.id };
      }
      return deliver(existing.id, mail, existing.attempts);
    }
    return deliver(row.id, mail, 0);
  }

  async function deliver(logId: string, mail: OutgoingMail, priorAttempts: number): Promise<SendResult> {
    let lastError = '';
    for (let attempt = 1; attempt <= retries; attempt++) {
      try {
        await transport.sendMail({
          from: opts.from,
          to: mail.to,
          subject: mail.subject,
          text: mail.text,
          html: mail.html,
          attachments: mail.attachments,
          icalEvent: mail.icalEvent,
        });
        await updateLogRow(db, logId, { status: 'sent', attempts: priorAttempts + attempt, sentAt: new Date(), lastError: null });
        return { status: 'sent', logId };
      } catch (err) {
        lastError = err instanceof Error ? err.message : String(err);
        if (attempt < retries) await new Promise((r) => setTimeout(r, retryDelayMs * attempt));
      }
    }
    await updateLogRow(db, logId, { status: 'failed', attempts: priorAttempts + retries, lastError });
    return { status: 'failed', logId, error: lastError };
  }

  return {
    send,
    describe: () => ({ catcher: !opts.smtpUrl, smtpHost }),
    close: () => transport.close(),
  };
}
