import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client.js';
import { settings } from '../../db/schema/index.js';

export async function getSetting<T>(db: DbOrTx, key: string): Promise<T | undefined> {
  const [row] = await db.select().from(settings).where(eq(settings.key, key));
  return row?.value as T | undefined;
}
