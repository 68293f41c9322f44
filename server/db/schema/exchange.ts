// Seasons, wood offers and requests, allocation rounds, bundles and strike reports.
import { sql } from 'drizzle-orm';
import {
  boolean,
  check,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  numeric,
  pgTable,
  text,
  timestamp,
  unique,
  uuid,
} from 'drizzle-orm/pg-core';
import {
  BUNDLE_STATUSES,
  HEMISPHERES,
  REQUEST_STATUSES,
  ROUND_STATUSES,
  SEASON_KINDS,
  SEASON_STAGES,
  TREATMENTS,
} from '../../../shared/domain.js';
import { user } from './auth.js';
import { farms } from './farms.js';
import { motherPlants, species, varieties } from './register.js';
import { inRange, oneOf } from './helpers.js';

export const seasons = pgTable(
  'seasons',
  {
    id: uuid().primaryKey().defaultRandom(),
    name: text().notNull().unique(),
    kind: text({ enum: SEASON_KINDS }).notNull(),
    hemisphere: text({ enum: HEMISPHERES }).notNull(),
    stage: text({ enum: SEASON_STAGES }).notNull().default('planning'),
    requestDeadline: timestamp({ withTimezone: true }).notNull(),
    collectionStart: date({ mode: 'string' }).notNull(),
    collectionEnd: date({ mode: 'string' }).notNull(),
    /** A plant must have a clean inspection within this many months to give wood. */
    lookbackMonths: integer().notNull().default(12),
    notes: text().notNull().default(''),
    createdBy: text().references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('seasons_kind_check', oneOf(t.kind, SEASON_KINDS)),
    check('seasons_hemisphere_check', oneOf(t.hemisphere, HEMISPHERES)),
    check('seasons_stage_check', oneOf(t.stage, SEASON_STAGES)),
    check('seasons_window_check', sql`${t.collectionEnd} >= ${t.collectionStart}`),
    check('seasons_lookback_check', sql`${t.lookbackMonths} between 1 and 60`),
  ],
);

export const woodOffers = pgTable(
  'wood_offers',
  {
    id: uuid().primaryKey().defaultRandom(),
    seasonId: uuid()
      .notNull()
      .references(() => seasons.id, { onDelete: 'cascade' }),
    plantId: uuid()
      .notNull()
      .references(() => motherPlants.id, { onDelete: 'restrict' }),
    shootCount: integer(),
    meanShootLengthCm: numeric({ precision: 6, scale: 1, mode: 'number' }),
    /** A direct count of cuttings, instead of shoots x length. */
    directCount: integer(),
    estimatedYield: integer().notNull(),
    /** Share of the yield the plant's role lets a farm offer, 0..1, as it was when offered. */
    capFraction: numeric({ precision: 4, scale: 3, mode: 'number' }).notNull(),
    offered: integer().notNull(),
    /** Cuttings reserved by approved bundles; the database refuses more than offered. */
    reserved: integer().notNull().default(0),
    withdrawnAt: timestamp({ withTimezone: true }),
    withdrawnReason: text(),
    createdBy: text().references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('wood_offers_season_plant_unique').on(t.seasonId, t.plantId),
    check('wood_offers_shoots_check', sql`${t.shootCount} is null or ${t.shootCount} >= 0`),
    check('wood_offers_length_check', sql`${t.meanShootLengthCm} is null or ${t.meanShootLengthCm} >= 0`),
    check('wood_offers_direct_check', sql`${t.directCount} is null or ${t.directCount} >= 0`),
    check(
      'wood_offers_basis_check',
      sql`${t.directCount} is not null or (${t.shootCount} is not null and ${t.meanShootLengthCm} is not null)`,
    ),
    check('wood_offers_cap_check', sql`${t.capFraction} > 0 and ${t.capFraction} <= 1`),
    check('wood_offers_offered_check', sql`${t.offered} >= 0 and ${t.offered} <= ${t.estimatedYield}`),
    check('wood_offers_reserved_check', sql`${t.reserved} >= 0 and ${t.reserved} <= ${t.offered}`),
    index('wood_offers_plant_idx').on(t.plantId),
  ],
);

export const pickupWindows = pgTable(
  'pickup_windows',
  {
    id: uuid().primaryKey().defaultRandom(),
    seasonId: uuid()
      .notNull()
      .references(() => seasons.id, { onDelete: 'cascade' }),
    farmId: uuid()
      .notNull()
      .references(() => farms.id, { onDelete: 'cascade' }),
    startsAt: timestamp({ withTimezone: true }).notNull(),
    endsAt: timestamp({ withTimezone: true }).notNull(),
    note: text().notNull().default(''),
  },
  (t) => [
    check('pickup_windows_order_check', sql`${t.endsAt} > ${t.startsAt}`),
    index('pickup_windows_season_farm_idx').on(t.seasonId, t.farmId),
  ],
);

export const woodRequests = pgTable(
  'wood_requests',
  {
    id: uuid().primaryKey().defaultRandom(),
    seasonId: uuid()
      .notNull()
      .references(() => seasons.id, { onDelete: 'cascade' }),
    growerId: text()
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    status: text({ enum: REQUEST_STATUSES }).notNull().default('draft'),
    destinationLat: doublePrecision().notNull(),
    destinationLon: doublePrecision().notNull(),
    destinationLabel: text().notNull().default(''),
    /** Furthest the grower will travel to collect, in km. */
    maxDistanceKm: numeric({ precision: 6, scale: 1, mode: 'number' }).notNull(),
    notes: text().notNull().default(''),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('wood_requests_season_grower_unique').on(t.seasonId, t.growerId),
    check('wood_requests_status_check', oneOf(t.status, REQUEST_STATUSES)),
    check('wood_requests_lat_check', inRange(t.destinationLat, -90, 90)),
    check('wood_requests_lon_check', inRange(t.destinationLon, -180, 180)),
    check('wood_requests_distance_check', sql`${t.maxDistanceKm} > 0 and ${t.maxDistanceKm} <= 1000`),
  ],
);

export const requestLines = pgTable(
  'request_lines',
  {
    id: uuid().primaryKey().defaultRandom(),
    requestId: uuid()
      .notNull()
      .references(() => woodRequests.id, { onDelete: 'cascade' }),
    speciesId: uuid()
      .notNull()
      .references(() => species.id, { onDelete: 'restrict' }),
    /** Null means any variety of the species. */
    varietyId: uuid().references(() => varieties.id, { onDelete: 'restrict' }),
    cuttings: integer().notNull(),
    substitutesAllowed: boolean().notNull().default(false),
    treatment: text({ enum: TREATMENTS }).notNull().default('none'),
    /** Weight in the fairness goal; 1 is normal. */
    priority: numeric({ precision: 4, scale: 2, mode: 'number' }).notNull().default(1),
    /** The planner inputs that produced this line, kept so the grower can see why. */
    plan: jsonb(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('request_lines_cuttings_check', sql`${t.cuttings} > 0 and ${t.cuttings} <= 100000`),
    check('request_lines_treatment_check', oneOf(t.treatment, TREATMENTS)),
    check('request_lines_priority_check', sql`${t.priority} > 0 and ${t.priority} <= 10`),
    index('request_lines_request_idx').on(t.requestId),
  ],
);

export const allocationRounds = pgTable(
  'allocation_rounds',
  {
    id: uuid().primaryKey().defaultRandom(),
    seasonId: uuid()
      .notNull()
      .references(() => seasons.id, { onDelete: 'cascade' }),
    number: integer().notNull(),
    status: text({ enum: ROUND_STATUSES }).notNull().default('draft'),
    /** Everything the solver saw, so the round can be reproduced. */
    inputs: jsonb(),
    /** Solver figures: stage values, times, gap. */
    solverStats: jsonb(),
    createdBy: text().references(() => user.id, { onDelete: 'set null' }),
    approvedBy: text().references(() => user.id, { onDelete: 'set null' }),
    approvedAt: timestamp({ withTimezone: true }),
    notifiedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('allocation_rounds_season_number_unique').on(t.seasonId, t.number),
    check('allocation_rounds_status_check', oneOf(t.status, ROUND_STATUSES)),
    check('allocation_rounds_approved_check', sql`${t.status} not in ('approved', 'notified') or ${t.approvedAt} is not null`),
  ],
);

export const bundles = pgTable(
  'bundles',
  {
    id: uuid().primaryKey().defaultRandom(),
    /** Printed on the bundle label; made on approval. */
    code: text().unique(),
    roundId: uuid()
      .notNull()
      .references(() => allocationRounds.id, { onDelete: 'cascade' }),
    offerId: uuid()
      .notNull()
      .references(() => woodOffers.id, { onDelete: 'restrict' }),
    lineId: uuid()
      .notNull()
      .references(() => requestLines.id, { onDelete: 'restrict' }),
    plantId: uuid()
      .notNull()
      .references(() => motherPlants.id, { onDelete: 'restrict' }),
    farmId: uuid()
      .notNull()
      .references(() => farms.id, { onDelete: 'restrict' }),
    growerId: text()
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    cuttings: integer().notNull(),
    status: text({ enum: BUNDLE_STATUSES }).notNull().default('reserved'),
    /** Kept by a re-run of the round; set when the coordinator edits a bundle by hand. */
    locked: boolean().notNull().default(false),
    pickupWindowId: uuid().references(() => pickupWindows.id, { onDelete: 'set null' }),
    distanceM: doublePrecision(),
    collectedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('bundles_cuttings_check', sql`${t.cuttings} > 0`),
    check('bundles_status_check', oneOf(t.status, BUNDLE_STATUSES)),
    check('bundles_collected_check', sql`(${t.status} = 'collected') = (${t.collectedAt} is not null)`),
    index('bundles_round_idx').on(t.roundId),
    index('bundles_offer_idx').on(t.offerId),
    index('bundles_plant_idx').on(t.plantId),
    index('bundles_grower_idx').on(t.growerId),
  ],
);

export const strikeReports = pgTable(
  'strike_reports',
  {
    id: uuid().primaryKey().defaultRandom(),
    bundleId: uuid()
      .notNull()
      .references(() => bundles.id, { onDelete: 'cascade' }),
    reporterId: text().references(() => user.id, { onDelete: 'set null' }),
    stuck: integer().notNull(),
    rooted: integer().notNull(),
    assessedOn: date({ mode: 'string' }).notNull(),
    treatment: text({ enum: TREATMENTS }).notNull(),
    notes: text().notNull().default(''),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('strike_reports_counts_check', sql`${t.stuck} > 0 and ${t.rooted} >= 0 and ${t.rooted} <= ${t.stuck}`),
    check('strike_reports_treatment_check', oneOf(t.treatment, TREATMENTS)),
    index('strike_reports_bundle_idx').on(t.bundleId),
  ],
);
