// The mother-plant CSV file: its columns and how one row is read. Shared so the client can
// offer the same template and wording the server checks against.
import { z } from 'zod';
import { HEALTH_STATUSES, PLANT_ROLES, PROVENANCES } from '../domain.js';
import { latSchema, lonSchema } from './register.js';

/** Column order of the export and of the blank template. */
export const PLANT_CSV_COLUMNS = [
  'code',
  'farm',
  'species',
  'variety',
  'planting_year',
  'role',
  'provenance',
  'parent_code',
  'supplier',
  'lat',
  'lon',
  'bed_row',
  'health_status',
  'last_inspected_on',
  'notes',
] as const;
export type PlantCsvColumn = (typeof PLANT_CSV_COLUMNS)[number];

/** A file without one of these headers cannot describe a plant at all. */
export const PLANT_CSV_REQUIRED: readonly PlantCsvColumn[] = ['farm', 'species', 'planting_year', 'role', 'provenance'];

/** What to write in each column, for the import page and the template. */
export const PLANT_CSV_HELP: Record<PlantCsvColumn, string> = {
  code: 'Optional. The farm code, a dash and up to 8 letters or digits (BRK-0042). Left empty, the next free number of that farm is given.',
  farm: 'Required. The farm code, e.g. BRK.',
  species: 'Required. Scientific name (Ribes nigrum) or common name (Blackcurrant).',
  variety: 'Optional. A variety of that species, as named in the variety list.',
  planting_year: 'Required. The year planted, e.g. 2019.',
  role: 'Required. stock_bed or fruiting_bush.',
  provenance: 'Required. bought, seed or exchange.',
  parent_code: 'Needed for exchange: the code of the plant the wood came from, already registered or in a row above.',
  supplier: 'Optional. Where a bought plant came from.',
  lat: 'Optional. Latitude in decimal degrees; give lat and lon together.',
  lon: 'Optional. Longitude in decimal degrees; give lat and lon together.',
  bed_row: 'Optional. Bed and row as the farm names them.',
  health_status: 'Coordinators only: clean, watch, hold or retired. Everyone else leaves it empty or clean.',
  last_inspected_on: 'Coordinators only: date of the last inspection, YYYY-MM-DD.',
  notes: 'Optional. Free text.',
};

/** Bigger files are refused whole: split them. */
export const PLANT_CSV_MAX_ROWS = 10_000;

/** One problem in the file. row is the spreadsheet row (the header is row 1); column is null for a whole-row problem. */
export type PlantCsvProblem = { row: number; column: PlantCsvColumn | string | null; message: string };

export type PlantCsvReport = {
  dryRun: boolean;
  /** Data rows read (empty lines are skipped). */
  rows: number;
  created: number;
  errors: PlantCsvProblem[];
  /** Values the file gave that were not used; the import still goes ahead. */
  warnings: PlantCsvProblem[];
  /** Codes of the plants, in file order: made on import, or that would be made on a dry run. */
  codes: string[];
};

// Export guards cells that a spreadsheet would run as formulas with a leading apostrophe;
// reading it back takes the apostrophe off, so an export imports unchanged.
const FORMULA_GUARDED = /^'[=+\-@\t\r]/;
export const unguardCell = (v: string) => (FORMULA_GUARDED.test(v) ? v.slice(1) : v);

const thisYear = () => new Date().getUTCFullYear();
const today = () => new Date().toISOString().slice(0, 10);

/** Every cell arrives as text; blank means "not given". */
const cell = z.string().transform((v) => unguardCell(v.trim()));
const required = (label: string) => cell.pipe(z.string().min(1, `${label} is required`));
const optional = <T extends z.ZodType<unknown, string>>(inner: T) =>
  cell.transform((v) => (v === '' ? undefined : v)).pipe(inner.optional());
/** "Stock bed", "stock-bed" and "stock_bed" all mean the same word. */
const word = (v: string) => v.toLowerCase().replace(/[\s-]+/g, '_');
const decimal = (label: string) =>
  z
    .string()
    .regex(/^[+-]?(\d+\.?\d*|\.\d+)$/, `${label} must be a number in decimal degrees, like 52.2053`)
    .transform(Number);

export const plantCsvRowSchema = z
  .object({
    code: optional(
      z
        .string()
        .toUpperCase()
        .regex(/^[A-Z0-9]{2,6}-[A-Z0-9]{1,8}$/, 'Code looks like BRK-0042 (farm code, dash, up to 8 letters or digits)'),
    ),
    farm: required('Farm').transform((v) => v.toUpperCase()),
    species: required('Species'),
    variety: optional(z.string().max(120, 'Variety is at most 120 characters')),
    planting_year: required('Planting year')
      .pipe(z.string().regex(/^\d{4}$/, 'Planting year must be a whole year like 2019'))
      .transform(Number)
      .pipe(
        z
          .number()
          .min(1900, 'Planting year must be 1900 or later')
          .refine((y) => y <= thisYear() + 1, `Planting year cannot be after next year`),
      ),
    role: required('Role')
      .transform(word)
      .pipe(z.enum(PLANT_ROLES, { error: 'Role must be stock_bed or fruiting_bush' })),
    provenance: required('Provenance')
      .transform(word)
      .pipe(z.enum(PROVENANCES, { error: 'Provenance must be bought, seed or exchange' })),
    parent_code: optional(z.string().toUpperCase()),
    supplier: optional(z.string().max(200, 'Supplier is at most 200 characters')),
    lat: optional(decimal('Latitude').pipe(latSchema)),
    lon: optional(decimal('Longitude').pipe(lonSchema)),
    bed_row: cell.pipe(z.string().max(100, 'Bed/row is at most 100 characters')),
    health_status: optional(
      z
        .string()
        .transform(word)
        .pipe(z.enum(HEALTH_STATUSES, { error: 'Health status must be clean, watch, hold or retired' })),
    ),
    last_inspected_on: optional(
      z.iso.date({ error: 'Last inspection must be a date like 2024-11-30' }).refine((d) => d <= today(), 'Last inspection cannot be in the future'),
    ),
    notes: cell.pipe(z.string().max(4000, 'Notes are at most 4000 characters')),
  })
  .superRefine((v, ctx) => {
    if ((v.lat == null) !== (v.lon == null)) {
      ctx.addIssue({ code: 'custom', path: [v.lat == null ? 'lat' : 'lon'], message: 'Give both lat and lon, or neither' });
    }
    if (v.provenance === 'exchange' && !v.parent_code) {
      ctx.addIssue({ code: 'custom', path: ['parent_code'], message: 'A plant received through an exchange names its parent plant' });
    }
    if (v.code && !v.code.startsWith(`${v.farm}-`)) {
      ctx.addIssue({ code: 'custom', path: ['code'], message: `Codes on farm ${v.farm} start with ${v.farm}-` });
    }
    if (v.code && v.parent_code === v.code) {
      ctx.addIssue({ code: 'custom', path: ['parent_code'], message: 'A plant cannot be its own parent' });
    }
  });
/** One row as the CSV holds it: every column is text. */
export type PlantCsvRowInput = Record<PlantCsvColumn, string>;
export type PlantCsvRow = z.output<typeof plantCsvRowSchema>;
