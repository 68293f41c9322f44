// The audit log: who changed what, when and why. Written in the same transaction as the
// change it records.
import { sql } from 'drizzle-orm';
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

/** Many audit rows at once (imports), as one JSON parameter. */
export async function insertAuditRows(tx: DbOrTx, values: { actorId: string; entity: string; entityId: string; action: string; after: unknown }[]) {
  const rows = values.map((v) => ({ actor_id: v.actorId, entity: v.entity, entity_id: v.entityId, action: v.action, after: v.after }));
  await tx.execute(sql`
    insert into audit_log (actor_id, entity, entity_id, action, after)
    select actor_id, entity, entity_id, action, after
    from json_populate_recordset(null::audit_log, ${JSON.stringify(rows)}::json)`);
}
