// Admitting, suspending and re-roling members. A coordinator cannot lock the cooperative
// out of itself: the last active coordinator keeps that role and status.
import type { MemberPatch } from '../../../shared/schemas/members.js';
import type { Db } from '../../db/client.js';
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
