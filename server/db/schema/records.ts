// E-mail (received by the local catcher, and our own send log), the audit log and
// cooperative-wide settings.
import { sql } from 'drizzle-orm';
import { check, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { EMAIL_STATUSES } from '../../../shared/domain.js';
import { user } from './auth.js';
import { oneOf } from './helpers.js';

/** One attachment as the catcher stored it. */
export type StoredAttachment = { filename: string; contentType: string; size: number; contentBase64: string };

/** Messages the local SMTP catcher received (only when no SMTP_URL is set). */
export const mailbox = pgTable(
  'mailbox',
  {
    id: uuid().primaryKey().defaultRandom(),
    messageId: text(),
    fromAddress: text().notNull(),
    toAddresses: text().array().notNull(),
    subject: text().notNull().default(''),
    textBody: text().notNull().default(''),
    htmlBody: text(),
    attachments: jsonb().$type<StoredAttachment[]>().notNull().default(sql`'[]'::jsonb`),
    sizeBytes: integer().notNull(),
    receivedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('mailbox_received_idx').on(t.receivedAt)],
);

/** Every e-mail Heelwood sends: one row per message, retried until sent. */
export const emailLog = pgTable(
  'email_log',
  {
    id: uuid().primaryKey().defaultRandom(),
    /** What the message is for, e.g. password_reset, pickup_slip, farm_collections. */
    kind: text().notNull(),
    /** Makes a send idempotent: one approval sends one slip per grower, never two. */
    dedupeKey: text().unique(),
    toAddress: text().notNull(),
    subject: text().notNull(),
    status: text({ enum: EMAIL_STATUSES }).notNull().default('queued'),
    attempts: integer().notNull().default(0),
    lastError: text(),
    related: jsonb(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp({ withTimezone: true }),
  },
  (t) => [check('email_log_status_check', oneOf(t.status, EMAIL_STATUSES)), index('email_log_status_idx').on(t.status)],
);

export const auditLog = pgTable(
  'audit_log',
  {
    id: uuid().primaryKey().defaultRandom(),
    actorId: text().references(() => user.id, { onDelete: 'set null' }),
    entity: text().notNull(),
    entityId: text().notNull(),
    action: text().notNull(),
    reason: text(),
    before: jsonb(),
    after: jsonb(),
    at: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('audit_log_entity_idx').on(t.entity, t.entityId, t.at)],
);

/** Cooperative-wide settings: name, hemisphere, role caps, value per plant. */
export const settings = pgTable('settings', {
  key: text().primaryKey(),
  value: jsonb().notNull(),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});
