// Tables that better-auth reads and writes (its core schema), plus our own user fields.
import { boolean, doublePrecision, index, pgTable, text, timestamp, check } from 'drizzle-orm/pg-core';
import { USER_ROLES, USER_STATUSES } from '../../../shared/domain.js';
import { inRange, oneOf } from './helpers.js';

export const user = pgTable(
  'user',
  {
    id: text().primaryKey(),
    name: text().notNull(),
    email: text().notNull().unique(),
    emailVerified: boolean().notNull().default(false),
    image: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    role: text({ enum: USER_ROLES }).notNull().default('member'),
    status: text({ enum: USER_STATUSES }).notNull().default('pending'),
    /** What a new grower wrote when applying: where they grow, what they plan. */
    application: text(),
    placeName: text(),
    homeLat: doublePrecision(),
    homeLon: doublePrecision(),
  },
  (t) => [
    check('user_role_check', oneOf(t.role, USER_ROLES)),
    check('user_status_check', oneOf(t.status, USER_STATUSES)),
    check('user_home_lat_check', inRange(t.homeLat, -90, 90)),
    check('user_home_lon_check', inRange(t.homeLon, -180, 180)),
  ],
);

export const session = pgTable(
  'session',
  {
    id: text().primaryKey(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    token: text().notNull().unique(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    ipAddress: text(),
    userAgent: text(),
    userId: text()
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
  },
  (t) => [index('session_user_id_idx').on(t.userId)],
);

export const account = pgTable(
  'account',
  {
    id: text().primaryKey(),
    accountId: text().notNull(),
    providerId: text().notNull(),
    userId: text()
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    accessToken: text(),
    refreshToken: text(),
    idToken: text(),
    accessTokenExpiresAt: timestamp({ withTimezone: true }),
    refreshTokenExpiresAt: timestamp({ withTimezone: true }),
    scope: text(),
    password: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('account_user_id_idx').on(t.userId)],
);

export const verification = pgTable(
  'verification',
  {
    id: text().primaryKey(),
    identifier: text().notNull(),
    value: text().notNull(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('verification_identifier_idx').on(t.identifier)],
);
