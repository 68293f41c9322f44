export type MailAttachmentInfo = { index: number; filename: string; contentType: string; size: number };

/** One message in the coordinator's mailbox (the local catcher's store). */
export type MailMessage = {
  id: string;
  from: string;
  to: string[];
  subject: string;
  receivedAt: string;
  textBody: string;
  htmlBody: string | null;
  attachments: MailAttachmentInfo[];
};

export type MailboxStatus = { catcher: boolean; smtpHost: string };
