// Member farms and who works on them.
import { sql } from 'drizzle-orm';
import {
  check,
  doublePrecision,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uuid,
  index,
} from 'drizzle-orm/pg-core';
import { FARM_ROLES } from '../../../shared/domain.js';
import { user } from './auth.js';
import { inRange, oneOf } from './helpers.js';

export const farms = pgTable(
  'farms',
  {
    id: uuid().primaryKey().defaultRandom(),
    /** Short code printed on labels and bundle codes, e.g. "BRK". */
    code: text().notNull().unique(),
    name: text().notNull(),
    address: text().notNull().default(''),
    directions: text().notNull().default(''),
    lat: doublePrecision().notNull(),
    lon: doublePrecision().notNull(),
    timezone: text().notNull().default('Europe/London'),
    contactEmail: text(),
    /** Most cuttings one grower may take from this farm in one season; null means no limit. */
    perGrowerLimit: integer(),
    /** GeoJSON FeatureCollection: farm outline and beds drawn on the map. */
    outline: jsonb(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('farms_lat_check', inRange(t.lat, -90, 90)),
    check('farms_lon_check', inRange(t.lon, -180, 180)),
    check('farms_code_check', sql`${t.code} ~ '^[A-Z0-9]{2,6}$'`),
    check('farms_per_grower_limit_check', sql`${t.perGrowerLimit} is null or ${t.perGrowerLimit} > 0`),
  ],
);

export const farmMemberships = pgTable(
  'farm_memberships',
  {
    farmId: uuid()
      .notNull()
      .references(() => farms.id, { onDelete: 'cascade' }),
    userId: text()
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    farmRole: text({ enum: FARM_ROLES }).notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.farmId, t.userId] }),
    check('farm_memberships_role_check', oneOf(t.farmRole, FARM_ROLES)),
    index('farm_memberships_user_idx').on(t.userId),
  ],
);
