// Small builders for CHECK constraints, so every table states its rules the same way.
import { sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';

/** A CHECK that a text column holds one of the product's words (see shared/domain.ts). */
export function oneOf(column: AnyPgColumn, values: readonly string[]): SQL {
  const list = values.map((v) => `'${v.replace(/'/g, "''")}'`).join(', ');
  return sql`${column} in (${sql.raw(list)})`;
}

/** A CHECK that a number, when present, lies in [min, max]. */
export function inRange(column: AnyPgColumn, min: number, max: number): SQL {
  return sql`${column} is null or (${column} >= ${sql.raw(String(min))} and ${column} <= ${sql.raw(String(max))})`;
}
