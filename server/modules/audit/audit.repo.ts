// The audit log: who changed what, when and why. Written in the same transaction as the
// change it records.
import type { DbOrTx } from '../../db/client.js';
import { auditLog } from '../../db/schema/index.js';

export type AuditEntry = {
  actorId: string | null;
  entity: string;
  entityId: string;
  action: string;
  reason?: string | null;
  before?: unknown;
  after?: unknown;
};

export function writeAudit(db: DbOrTx, entry: AuditEntry) {
  return db.insert(auditLog).values({ ...entry, reason: entry.reason ?? null, before: entry.before ?? null, after: entry.after ?? null });
}
