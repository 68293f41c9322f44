import { and, asc, count, desc, eq, ilike, inArray, or, type SQL } from 'drizzle-orm';
import type { FarmLink, Member, MemberListQuery } from '../../../shared/schemas/members.js';
import type { DbOrTx } from '../../db/client.js';
import { farmMemberships, farms, user } from '../../db/schema/index.js';

const memberColumns = {
  id: user.id,
  name: user.name,
  email: user.email,
  role: user.role,
  status: user.status,
  placeName: user.placeName,
  application: user.application,
  createdAt: user.createdAt,
};

export async function farmLinksFor(db: DbOrTx, userIds: string[]): Promise<Map<string, FarmLink[]>> {
  const map = new Map<string, FarmLink[]>();
  if (!userIds.length) return map;
  const rows = await db
    .select({
      userId: farmMemberships.userId,
      farmId: farms.id,
      farmName: farms.name,
      farmCode: farms.code,
      farmRole: farmMemberships.farmRole,
    })
    .from(farmMemberships)
    .innerJoin(farms, eq(farms.id, farmMemberships.farmId))
    .where(inArray(farmMemberships.userId, userIds))
    .orderBy(asc(farms.name));
  for (const { userId, ...link } of rows) {
    const list = map.get(userId) ?? [];
    list.push(link);
    map.set(userId, list);
  }
  return map;
}

/** The signed-in person and their farms, read on every guarded request: one query. */
export async function findActor(db: DbOrTx, id: string) {
  const rows = await db
    .select({
      id: user.id,
      name: user.name,
      email: user.email,
      role: user.role,
      status: user.status,
      farmId: farms.id,
      farmName: farms.name,
      farmCode: farms.code,
      farmRole: farmMemberships.farmRole,
    })
    .from(user)
    .leftJoin(farmMemberships, eq(farmMemberships.userId, user.id))
    .leftJoin(farms, eq(farms.id, farmMemberships.farmId))
    .where(eq(user.id, id))
    .orderBy(asc(farms.name));
  if (!rows.length) return undefined;
  const { name, email, role, status } = rows[0];
  const links: FarmLink[] = [];
  for (const r of rows) {
    if (r.farmId !== null && r.farmName !== null && r.farmCode !== null && r.farmRole !== null) {
      links.push({ farmId: r.farmId, farmName: r.farmName, farmCode: r.farmCode, farmRole: r.farmRole });
    }
  }
  return { id: rows[0].id, name, email, role, status, farms: links };
}

export async function findMember(db: DbOrTx, id: string): Promise<Member | undefined> {
  const [row] = await db.select(memberColumns).from(user).where(eq(user.id, id));
  if (!row) return undefined;
  const links = await farmLinksFor(db, [id]);
  return { ...row, createdAt: row.createdAt.toISOString(), farms: links.get(id) ?? [] };
}

export async function listMembers(db: DbOrTx, q: MemberListQuery) {
  const conds: SQL[] = [];
  if (q.status) conds.push(eq(user.status, q.status));
  if (q.q) {
    const like = `%${q.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    conds.push(or(ilike(user.name, like), ilike(user.email, like), ilike(user.placeName, like))!);
  }
  const where = conds.length ? and(...conds) : undefined;
  const [rows, [{ total }]] = await Promise.all([
    db
      .select(memberColumns)
      .from(user)
      .where(where)
      // Applicants first, then by name: the coordinator's work is at the top.
      .orderBy(desc(eq(user.status, 'pending')), asc(user.name), asc(user.id))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize),
    db.select({ total: count() }).from(user).where(where),
  ]);
  const links = await farmLinksFor(
    db,
    rows.map((r) => r.id),
  );
  const items: Member[] = rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), farms: links.get(r.id) ?? [] }));
  return { items, total };
}

export async function countActiveCoordinators(db: DbOrTx) {
  const [{ n }] = await db
    .select({ n: count() })
    .from(user)
    .where(and(eq(user.role, 'coordinator'), eq(user.status, 'active')));
  return n;
}

export function updateUser(db: DbOrTx, id: string, patch: Partial<typeof user.$inferInsert>) {
  return db
    .update(user)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(user.id, id));
}
