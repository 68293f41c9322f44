// Drizzle queries for photos of mother plants and of inspection findings.
import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client.js';
import { findings, inspections, photos } from '../../db/schema/index.js';

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
