// Admitting, suspending and re-roling members. A coordinator cannot lock the cooperative
// out of itself: the last active coordinator keeps that role and status.
import type { MemberPatch } from '../../../shared/schemas/members.js';
import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client.js';
import { session } from '../../db/schema/index.js';
import { conflict, notFound } from '../../lib/http-error.js';
import { writeAudit } from '../audit/audit.repo.js';
import { countActiveCoordinators, findMember, updateUser } from './members.repo.js';

export async function patchMember(db: Db, actorId: string, id: string, patch: MemberPatch) {
  return db.transaction(async (tx) => {
    const before = await findMember(tx, id);
    if (!before) throw notFound('That member');
    const losesCoordinator =
      before.role === 'coordinator' &&
      before.status === 'active' &&
      ((patch.role && patch.role !== 'coordinator') || (patch.status && patch.status !== 'active'));
    if (losesCoordinator && (await countActiveCoordinators(tx)) <= 1) {
      throw conflict('The cooperative needs at least one active coordinator; appoint another first.', {
        [patch.role ? 'role' : 'status']: 'last active coordinator',
      });
    }
    await updateUser(tx, id, {
      ...(patch.status ? { status: patch.status } : {}),
      ...(patch.role ? { role: patch.role } : {}),
    });
    // Suspending signs the member out everywhere: their sessions go with the same commit.
    // (Our routes refuse a suspended member at once anyway, guards.ts; this ends the sessions
    // for better-auth's own endpoints too, which trust its signed cookie for at most a minute.)
    if (patch.status === 'suspended' && before.status !== 'suspended') {
      await tx.delete(session).where(eq(session.userId, id));
    }
    await writeAudit(tx, {
      actorId,
      entity: 'user',
      entityId: id,
      action: patch.status === 'active' && before.status === 'pending' ? 'admit' : 'update',
      reason: patch.reason,
      before: { role: before.role, status: before.status },
      after: { role: patch.role ?? before.role, status: patch.status ?? before.status },
    });
    return (await findMember(tx, id))!;
  });
}
