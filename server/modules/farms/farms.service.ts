import type { FarmRole } from '../../../shared/domain.js';
import type { Db } from '../../db/client.js';
import { conflict, notFound } from '../../lib/http-error.js';
import { writeAudit } from '../audit/audit.repo.js';
import { findMember } from '../members/members.repo.js';
import { deleteMembership, findFarm, findMembership, upsertMembership } from './farms.repo.js';

export async function setFarmRole(db: Db, actorId: string, farmId: string, userId: string, farmRole: FarmRole) {
  return db.transaction(async (tx) => {
    const farm = await findFarm(tx, farmId);
    if (!farm) throw notFound('That farm');
    const member = await findMember(tx, userId);
    if (!member) throw notFound('That member');
    if (member.status !== 'active') {
      throw conflict('Admit the member before adding them to a farm.', { userId: `status is ${member.status}` });
    }
    const before = await findMembership(tx, farmId, userId);
    await upsertMembership(tx, farmId, userId, farmRole);
    await writeAudit(tx, {
      actorId,
      entity: 'farm_membership',
      entityId: `${farmId}:${userId}`,
      action: before ? 'change_role' : 'add',
      before: before ? { farmRole: before.farmRole } : null,
      after: { farmRole },
    });
    return { farmId, userId, farmRole };
  });
}

export async function removeFromFarm(db: Db, actorId: string, farmId: string, userId: string) {
  await db.transaction(async (tx) => {
    const before = await findMembership(tx, farmId, userId);
    if (!before) throw notFound('That farm membership');
    await deleteMembership(tx, farmId, userId);
    await writeAudit(tx, {
      actorId,
      entity: 'farm_membership',
      entityId: `${farmId}:${userId}`,
      action: 'remove',
      before: { farmRole: before.farmRole },
    });
  });
}
