// Drizzle queries for photos of mother plants, of inspection findings and of strike reports.
import { asc, count, eq, inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client.js';
import { findings, inspections, photos, strikeReports } from '../../db/schema/index.js';

export type PhotoRow = typeof photos.$inferSelect;
export type NewPhotoRow = typeof photos.$inferInsert;

export async function insertPhoto(db: DbOrTx, values: NewPhotoRow): Promise<PhotoRow> {
  const [row] = await db.insert(photos).values(values).returning();
  return row;
}

export async function findPhoto(db: DbOrTx, id: string): Promise<PhotoRow | undefined> {
  const [row] = await db.select().from(photos).where(eq(photos.id, id));
  return row;
}

export async function deletePhotoRow(db: DbOrTx, id: string): Promise<PhotoRow | undefined> {
  const [row] = await db.delete(photos).where(eq(photos.id, id)).returning();
  return row;
}

/** The plant a finding was recorded on, through its inspection. */
export async function plantOfFinding(db: DbOrTx, findingId: string): Promise<string | undefined> {
  const [row] = await db
    .select({ plantId: inspections.plantId })
    .from(findings)
    .innerJoin(inspections, eq(inspections.id, findings.inspectionId))
    .where(eq(findings.id, findingId));
  return row?.plantId;
}

/** The strike report a photo may be added to, locked for the rest of the transaction when asked. */
export async function findReportForPhotos(db: DbOrTx, reportId: string, lock = false) {
  const q = db.select({ id: strikeReports.id, reporterId: strikeReports.reporterId }).from(strikeReports).where(eq(strikeReports.id, reportId));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function countReportPhotos(db: DbOrTx, reportId: string): Promise<number> {
  const [row] = await db.select({ n: count() }).from(photos).where(eq(photos.strikeReportId, reportId));
  return Number(row.n);
}

/** Photos of these strike reports, oldest first. */
export function photosOfReports(db: DbOrTx, reportIds: string[]): Promise<PhotoRow[]> {
  if (!reportIds.length) return Promise.resolve([]);
  return db.select().from(photos).where(inArray(photos.strikeReportId, reportIds)).orderBy(asc(photos.createdAt), asc(photos.id));
}
