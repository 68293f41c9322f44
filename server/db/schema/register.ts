// Species, varieties and the mother plants that farms hold.
import { sql } from 'drizzle-orm';
import {
  type AnyPgColumn,
  boolean,
  check,
  date,
  doublePrecision,
  index,
  integer,
  numeric,
  pgTable,
  text,
  timestamp,
  unique,
  uuid,
} from 'drizzle-orm/pg-core';
import { HEALTH_STATUSES, PLANT_ROLES, PROVENANCES, PROPAGATION_METHODS } from '../../../shared/domain.js';
import { user } from './auth.js';
import { farms } from './farms.js';
import { bundles, strikeReports } from './exchange.js';
import { inRange, oneOf } from './helpers.js';

export const species = pgTable(
  'species',
  {
    id: uuid().primaryKey().defaultRandom(),
    scientificName: text().notNull().unique(),
    commonName: text().notNull(),
    genus: text().notNull(),
    propagationMethods: text({ enum: PROPAGATION_METHODS }).array().notNull(),
    defaultCuttingLengthCm: numeric({ precision: 5, scale: 1, mode: 'number' }).notNull(),
    defaultCuttingDiameterMm: numeric({ precision: 4, scale: 1, mode: 'number' }).notNull(),
    /** Soft tip cut off and thrown away before the shoot is cut into lengths. */
    softTipCm: numeric({ precision: 5, scale: 1, mode: 'number' }).notNull().default(10),
    /** Reference strike rate with no treatment, 0..1 (CHECK-VALUES.md). */
    strikeRatePrior: numeric({ precision: 4, scale: 3, mode: 'number' }).notNull(),
    /** Weight of the prior, in cuttings, when reports update it. */
    priorStrength: integer().notNull().default(20),
    shadeTolerant: boolean().notNull().default(false),
    /** Years from cutting to first crop. */
    firstCropYears: integer().notNull().default(3),
    /** Plant-health rules that apply to moving this species, shown wherever it is offered. */
    restrictionNote: text(),
    notes: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('species_cutting_length_check', sql`${t.defaultCuttingLengthCm} > 0 and ${t.defaultCuttingLengthCm} <= 200`),
    check('species_cutting_diameter_check', sql`${t.defaultCuttingDiameterMm} > 0`),
    check('species_soft_tip_check', sql`${t.softTipCm} >= 0`),
    check('species_prior_check', sql`${t.strikeRatePrior} > 0 and ${t.strikeRatePrior} < 1`),
    check('species_prior_strength_check', sql`${t.priorStrength} > 0`),
    check('species_first_crop_check', sql`${t.firstCropYears} between 1 and 15`),
    check('species_methods_check', sql`cardinality(${t.propagationMethods}) > 0`),
  ],
);

export const varieties = pgTable(
  'varieties',
  {
    id: uuid().primaryKey().defaultRandom(),
    speciesId: uuid()
      .notNull()
      .references(() => species.id, { onDelete: 'restrict' }),
    name: text().notNull(),
    description: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique('varieties_species_name_unique').on(t.speciesId, t.name), index('varieties_species_idx').on(t.speciesId)],
);

export const motherPlants = pgTable(
  'mother_plants',
  {
    id: uuid().primaryKey().defaultRandom(),
    /** Short printable code, e.g. "BRK-0042". */
    code: text().notNull().unique(),
    farmId: uuid()
      .notNull()
      .references(() => farms.id, { onDelete: 'restrict' }),
    speciesId: uuid()
      .notNull()
      .references(() => species.id, { onDelete: 'restrict' }),
    varietyId: uuid().references(() => varieties.id, { onDelete: 'restrict' }),
    plantingYear: integer().notNull(),
    lat: doublePrecision(),
    lon: doublePrecision(),
    bedRow: text().notNull().default(''),
    role: text({ enum: PLANT_ROLES }).notNull(),
    provenance: text({ enum: PROVENANCES }).notNull(),
    parentPlantId: uuid().references((): AnyPgColumn => motherPlants.id, { onDelete: 'set null' }),
    sourceBundleId: uuid().references((): AnyPgColumn => bundles.id, { onDelete: 'set null' }),
    supplier: text(),
    healthStatus: text({ enum: HEALTH_STATUSES }).notNull().default('clean'),
    lastInspectedOn: date({ mode: 'string' }),
    notes: text().notNull().default(''),
    createdBy: text().references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    retiredAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    check('mother_plants_role_check', oneOf(t.role, PLANT_ROLES)),
    check('mother_plants_provenance_check', oneOf(t.provenance, PROVENANCES)),
    check('mother_plants_health_check', oneOf(t.healthStatus, HEALTH_STATUSES)),
    check('mother_plants_year_check', sql`${t.plantingYear} between 1900 and 2200`),
    check('mother_plants_lat_check', inRange(t.lat, -90, 90)),
    check('mother_plants_lon_check', inRange(t.lon, -180, 180)),
    check('mother_plants_position_check', sql`(${t.lat} is null) = (${t.lon} is null)`),
    check('mother_plants_not_own_parent_check', sql`${t.parentPlantId} is null or ${t.parentPlantId} <> ${t.id}`),
    check(
      'mother_plants_retired_check',
      sql`(${t.healthStatus} = 'retired') = (${t.retiredAt} is not null)`,
    ),
    index('mother_plants_farm_idx').on(t.farmId),
    index('mother_plants_species_idx').on(t.speciesId, t.varietyId),
    index('mother_plants_health_idx').on(t.healthStatus),
    index('mother_plants_parent_idx').on(t.parentPlantId),
    index('mother_plants_source_bundle_idx').on(t.sourceBundleId),
  ],
);

export const photos = pgTable(
  'photos',
  {
    id: uuid().primaryKey().defaultRandom(),
    plantId: uuid().references(() => motherPlants.id, { onDelete: 'cascade' }),
    /** Set when the photo belongs to an inspection finding. */
    findingId: uuid(),
    /** Set when the photo shows how the cuttings of a strike report rooted (then no plant or finding). */
    strikeReportId: uuid().references((): AnyPgColumn => strikeReports.id, { onDelete: 'cascade' }),
    fileName: text().notNull(),
    thumbName: text().notNull(),
    mimeType: text().notNull(),
    width: integer().notNull(),
    height: integer().notNull(),
    bytes: integer().notNull(),
    gpsLat: doublePrecision(),
    gpsLon: doublePrecision(),
    takenAt: timestamp({ withTimezone: true }),
    caption: text(),
    uploadedBy: text().references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('photos_mime_check', oneOf(t.mimeType, ['image/jpeg', 'image/png', 'image/webp'])),
    check('photos_size_check', sql`${t.width} > 0 and ${t.height} > 0 and ${t.bytes} > 0`),
    check('photos_owner_check', sql`${t.strikeReportId} is null or (${t.plantId} is null and ${t.findingId} is null)`),
    index('photos_plant_idx').on(t.plantId),
    index('photos_strike_report_idx').on(t.strikeReportId),
  ],
);
