import { count, desc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client.js';
import { emailLog, mailbox } from '../../db/schema/index.js';

export function insertMailboxMessage(db: DbOrTx, row: typeof mailbox.$inferInsert) {
  return db.insert(mailbox).values(row);
}

export async function listMailbox(db: DbOrTx, page: number, pageSize: number) {
  const [items, [{ total }]] = await Promise.all([
    db
      .select()
      .from(mailbox)
      .orderBy(desc(mailbox.receivedAt), desc(mailbox.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db.select({ total: count() }).from(mailbox),
  ]);
  return { items, total };
}

export async function getMailboxMessage(db: DbOrTx, id: string) {
  const [row] = await db.select().from(mailbox).where(eq(mailbox.id, id));
  return row;
}

export async function findLogByKey(db: DbOrTx, dedupeKey: string) {
  const [row] = await db.select().from(emailLog).where(eq(emailLog.dedupeKey, dedupeKey));
  return row;
}

/** Claims a dedupe key; returns undefined when another send already holds it. */
export async function claimLogRow(db: DbOrTx, row: typeof emailLog.$inferInsert) {
  const [created] = await db.insert(emailLog).values(row).onConflictDoNothing({ target: emailLog.dedupeKey }).returning();
  return created;
}

export function updateLogRow(db: DbOrTx, id: string, patch: Partial<typeof emailLog.$inferInsert>) {
  return db.update(emailLog).set(patch).where(eq(emailLog.id, id));
}
