// Inspections, the catalogue of pests and diseases, and district-wide health notes.
import { sql } from 'drizzle-orm';
import { boolean, check, date, doublePrecision, index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { FINDING_KINDS, SEVERITIES } from '../../../shared/domain.js';
import { user } from './auth.js';
import { motherPlants } from './register.js';
import { inRange, oneOf } from './helpers.js';

export const pests = pgTable(
  'pests',
  {
    id: uuid().primaryKey().defaultRandom(),
    code: text().notNull().unique(),
    name: text().notNull(),
    scientificName: text(),
    kind: text({ enum: FINDING_KINDS }).notNull(),
    /** Does it travel in cutting wood? A finding of such a pest puts the plant on hold. */
    travelsInWood: boolean().notNull(),
    /** Genera it affects, e.g. {Ribes}; empty means any. */
    genera: text().array().notNull().default(sql`'{}'::text[]`),
    signs: text().notNull().default(''),
    advice: text().notNull().default(''),
    source: text().notNull().default(''),
  },
  (t) => [check('pests_kind_check', oneOf(t.kind, FINDING_KINDS))],
);

export const inspections = pgTable(
  'inspections',
  {
    id: uuid().primaryKey().defaultRandom(),
    plantId: uuid()
      .notNull()
      .references(() => motherPlants.id, { onDelete: 'cascade' }),
    inspectedOn: date({ mode: 'string' }).notNull(),
    inspectorId: text().references(() => user.id, { onDelete: 'set null' }),
    notes: text().notNull().default(''),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('inspections_plant_idx').on(t.plantId, t.inspectedOn)],
);

export const findings = pgTable(
  'findings',
  {
    id: uuid().primaryKey().defaultRandom(),
    inspectionId: uuid()
      .notNull()
      .references(() => inspections.id, { onDelete: 'cascade' }),
    pestId: uuid()
      .notNull()
      .references(() => pests.id, { onDelete: 'restrict' }),
    severity: text({ enum: SEVERITIES }).notNull(),
    notes: text().notNull().default(''),
  },
  (t) => [
    check('findings_severity_check', oneOf(t.severity, SEVERITIES)),
    index('findings_inspection_idx').on(t.inspectionId),
    index('findings_pest_idx').on(t.pestId),
  ],
);

export const districtNotes = pgTable(
  'district_notes',
  {
    id: uuid().primaryKey().defaultRandom(),
    authorId: text().references(() => user.id, { onDelete: 'set null' }),
    body: text().notNull(),
    lat: doublePrecision(),
    lon: doublePrecision(),
    notedOn: date({ mode: 'string' }).notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('district_notes_body_check', sql`length(trim(${t.body})) > 0`),
    check('district_notes_lat_check', inRange(t.lat, -90, 90)),
    check('district_notes_lon_check', inRange(t.lon, -180, 180)),
  ],
);
