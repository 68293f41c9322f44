// Mother plants, species and varieties: what forms send and lists return. The server checks
// the same schemas the forms use.
import { z } from 'zod';
import {
  HEALTH_STATUSES,
  PLANT_ROLES,
  PROPAGATION_METHODS,
  PROVENANCES,
  type HealthStatus,
  type PlantRole,
  type PropagationMethod,
  type Provenance,
} from '../domain.js';
import { pageQuerySchema, uuidParam } from './common.js';

const thisYear = () => new Date().getUTCFullYear();

export const latSchema = z.number({ error: 'Latitude must be a number' }).min(-90, 'Latitude is between -90 and 90').max(90, 'Latitude is between -90 and 90');
export const lonSchema = z.number({ error: 'Longitude must be a number' }).min(-180, 'Longitude is between -180 and 180').max(180, 'Longitude is between -180 and 180');

const optionalText = (label: string, max: number) =>
  z.string({ error: `${label} must be text` }).trim().max(max, `${label} is at most ${max} characters`);

/** Create a mother plant. Position is optional (place it later on the map) but lat and lon come together. */
export const plantCreateSchema = z
  .object({
    farmId: uuidParam,
    speciesId: uuidParam,
    varietyId: uuidParam.nullable().optional(),
    code: z
      .string()
      .trim()
      .toUpperCase()
      .regex(/^[A-Z0-9]{2,6}-[A-Z0-9]{1,8}$/, 'Code looks like FARM-0042 (farm code, dash, up to 8 letters or digits)')
      .optional(),
    plantingYear: z
      .number({ error: 'Planting year must be a number' })
      .int('Planting year must be a whole year')
      .min(1900, 'Planting year must be 1900 or later')
      .refine((y) => y <= thisYear() + 1, 'Planting year cannot be in the future'),
    role: z.enum(PLANT_ROLES, { error: 'Role must be stock bed or fruiting bush' }),
    provenance: z.enum(PROVENANCES, { error: 'Provenance must be bought, seed or exchange' }),
    parentPlantId: uuidParam.nullable().optional(),
    supplier: optionalText('Supplier', 200).nullable().optional(),
    lat: latSchema.nullable().optional(),
    lon: lonSchema.nullable().optional(),
    bedRow: optionalText('Bed/row', 100).optional().default(''),
    notes: optionalText('Notes', 4000).optional().default(''),
  })
  .superRefine((v, ctx) => {
    if ((v.lat == null) !== (v.lon == null)) {
      ctx.addIssue({ code: 'custom', path: [v.lat == null ? 'lat' : 'lon'], message: 'Give both latitude and longitude, or neither' });
    }
    if (v.provenance === 'exchange' && !v.parentPlantId) {
      ctx.addIssue({ code: 'custom', path: ['parentPlantId'], message: 'A plant received through an exchange names its parent plant' });
    }
  });
export type PlantCreate = z.input<typeof plantCreateSchema>;

/** Edit: any field of create except the farm (moving farms is a coordinator's transfer). */
export const plantUpdateSchema = z
  .object({
    speciesId: uuidParam,
    varietyId: uuidParam.nullable(),
    plantingYear: z
      .number({ error: 'Planting year must be a number' })
      .int('Planting year must be a whole year')
      .min(1900, 'Planting year must be 1900 or later')
      .refine((y) => y <= thisYear() + 1, 'Planting year cannot be in the future'),
    role: z.enum(PLANT_ROLES, { error: 'Role must be stock bed or fruiting bush' }),
    provenance: z.enum(PROVENANCES, { error: 'Provenance must be bought, seed or exchange' }),
    parentPlantId: uuidParam.nullable(),
    supplier: optionalText('Supplier', 200).nullable(),
    lat: latSchema.nullable(),
    lon: lonSchema.nullable(),
    bedRow: optionalText('Bed/row', 100),
    notes: optionalText('Notes', 4000),
    /** Why, for the audit log, when role or ownership changes. */
    reason: optionalText('Reason', 500),
    farmId: uuidParam,
  })
  .partial()
  .strict()
  .superRefine((v, ctx) => {
    // One half of a position would pair with the stored other half: send both, or neither.
    if (('lat' in v) !== ('lon' in v)) {
      ctx.addIssue({ code: 'custom', path: ['lat' in v ? 'lon' : 'lat'], message: 'Send latitude and longitude together' });
      return;
    }
    const touched = 'lat' in v || 'lon' in v;
    if (touched && (v.lat == null) !== (v.lon == null)) {
      ctx.addIssue({ code: 'custom', path: [v.lat == null ? 'lat' : 'lon'], message: 'Give both latitude and longitude, or neither' });
    }
  });
export type PlantUpdate = z.input<typeof plantUpdateSchema>;

export const retireSchema = z.object({
  reason: z.string({ error: 'Reason is required' }).trim().min(3, 'Say why the plant is retired (at least 3 characters)').max(500, 'Reason is at most 500 characters'),
});

export const liftHoldSchema = z.object({
  to: z.enum(['clean', 'watch'], { error: 'A hold is lifted to clean or watch' }),
  reason: z.string({ error: 'Reason is required' }).trim().min(3, 'Say why the hold is lifted (at least 3 characters)').max(500, 'Reason is at most 500 characters'),
});

export const PLANT_SORTS = ['code', 'species', 'variety', 'farm', 'plantingYear', 'lastInspectedOn', 'healthStatus', 'role'] as const;
export type PlantSort = (typeof PLANT_SORTS)[number];

const csvList = <T extends readonly [string, ...string[]]>(values: T, label: string) =>
  z
    .union([z.string(), z.array(z.string())])
    .transform((v) => (Array.isArray(v) ? v : v.split(',')).map((s) => s.trim()).filter(Boolean))
    .pipe(z.array(z.enum(values, { error: `${label} must be one of ${values.join(', ')}` })));

export const plantListQuerySchema = pageQuerySchema.extend({
  q: z.string().trim().max(100, 'Search is at most 100 characters').optional(),
  farmId: uuidParam.optional(),
  speciesId: uuidParam.optional(),
  varietyId: uuidParam.optional(),
  status: csvList(HEALTH_STATUSES, 'status').optional(),
  role: z.enum(PLANT_ROLES, { error: 'role must be stock_bed or fruiting_bush' }).optional(),
  yearFrom: z.coerce.number().int('yearFrom must be a year').min(1900).max(2200).optional(),
  yearTo: z.coerce.number().int('yearTo must be a year').min(1900).max(2200).optional(),
  /** Last inspection: 'never', 'stale' (older than the look-back or never), 'recent'. */
  inspected: z.enum(['never', 'stale', 'recent'], { error: 'inspected must be never, stale or recent' }).optional(),
  /** Only plants of farms I work on. */
  mine: z
    .enum(['true', 'false'])
    .transform((v) => v === 'true')
    .optional(),
  sort: z.enum(PLANT_SORTS, { error: `sort must be one of ${PLANT_SORTS.join(', ')}` }).default('code'),
  dir: z.enum(['asc', 'desc'], { error: 'dir must be asc or desc' }).default('asc'),
});
export type PlantListQuery = z.input<typeof plantListQuerySchema>;
export type PlantListFilters = z.output<typeof plantListQuerySchema>;

/** A row in the plant list. Fields a member may not see on another farm's plant are null. */
export type PlantListItem = {
  id: string;
  code: string;
  farmId: string;
  farmName: string;
  farmCode: string;
  speciesId: string;
  speciesName: string;
  scientificName: string;
  varietyId: string | null;
  varietyName: string | null;
  plantingYear: number;
  role: PlantRole;
  provenance: Provenance;
  healthStatus: HealthStatus;
  lastInspectedOn: string | null;
  lat: number | null;
  lon: number | null;
  bedRow: string | null;
  /** True when the caller sees the full record (own farm or coordinator). */
  full: boolean;
};

export type AuditItem = {
  id: string;
  at: string;
  actorName: string | null;
  action: string;
  reason: string | null;
  before: unknown;
  after: unknown;
};

export type FindingView = {
  id: string;
  pestId: string;
  pestName: string;
  travelsInWood: boolean;
  severity: 'minor' | 'moderate' | 'severe';
  notes: string;
};

export type InspectionView = {
  id: string;
  inspectedOn: string;
  inspectorName: string | null;
  notes: string;
  findings: FindingView[];
  statusAfter?: HealthStatus;
};

export type PhotoView = {
  id: string;
  url: string;
  thumbUrl: string;
  caption: string | null;
  width: number;
  height: number;
  gps: { lat: number; lon: number } | null;
  createdAt: string;
  findingId: string | null;
};

export type WoodHistoryItem = {
  seasonId: string;
  seasonName: string;
  offered: number | null;
  bundles: { id: string; code: string | null; cuttings: number; status: string; growerName: string }[];
};

export type PlantDetail = PlantListItem & {
  supplier: string | null;
  notes: string | null;
  parent: { id: string; code: string } | null;
  sourceBundle: { id: string; code: string | null; seasonName: string } | null;
  children: { id: string; code: string; farmName: string }[];
  restrictionNote: string | null;
  createdAt: string;
  updatedAt: string;
  retiredAt: string | null;
  photos: PhotoView[];
  inspections: InspectionView[];
  woodHistory: WoodHistoryItem[];
  audit: AuditItem[];
  /** What the caller may do here. */
  can: { edit: boolean; inspect: boolean; retire: boolean; liftHold: boolean; transfer: boolean };
};

// Species and varieties -------------------------------------------------------------

/** A species' fields without defaults: an edit must not put back a default for a field it leaves out. */
const speciesFields = z.object({
  scientificName: z.string({ error: 'Scientific name is required' }).trim().min(3, 'Scientific name is at least 3 characters').max(120),
  commonName: z.string({ error: 'Common name is required' }).trim().min(2, 'Common name is at least 2 characters').max(120),
  genus: z.string({ error: 'Genus is required' }).trim().min(2, 'Genus is at least 2 characters').max(60),
  propagationMethods: z
    .array(z.enum(PROPAGATION_METHODS, { error: `Method must be one of ${PROPAGATION_METHODS.join(', ')}` }), { error: 'Choose at least one propagation method' })
    .min(1, 'Choose at least one propagation method'),
  defaultCuttingLengthCm: z.number({ error: 'Cutting length must be a number' }).gt(0, 'Cutting length must be more than 0').max(200, 'Cutting length is at most 200 cm'),
  defaultCuttingDiameterMm: z.number({ error: 'Cutting diameter must be a number' }).gt(0, 'Diameter must be more than 0').max(50, 'Diameter is at most 50 mm'),
  softTipCm: z.number({ error: 'Soft tip must be a number' }).min(0, 'Soft tip cannot be negative').max(100),
  strikeRatePrior: z.number({ error: 'Strike rate must be a number' }).gt(0, 'Strike rate is between 0 and 1').lt(1, 'Strike rate is between 0 and 1'),
  priorStrength: z.number().int().min(1).max(1000),
  shadeTolerant: z.boolean(),
  firstCropYears: z.number().int().min(1).max(15),
  restrictionNote: z.string().trim().max(2000).nullable().optional(),
  notes: z.string().trim().max(4000).nullable().optional(),
});

export const speciesSchema = speciesFields.extend({
  softTipCm: speciesFields.shape.softTipCm.default(10),
  priorStrength: speciesFields.shape.priorStrength.default(20),
  shadeTolerant: speciesFields.shape.shadeTolerant.default(false),
  firstCropYears: speciesFields.shape.firstCropYears.default(3),
});
export type SpeciesInput = z.input<typeof speciesSchema>;

const somethingToChange = (v: object) => Object.keys(v).length > 0;

/** Edit a species: any of its fields, at least one. */
export const speciesPatchSchema = speciesFields.partial().strict().refine(somethingToChange, 'Send at least one field to change');

export const varietySchema = z.object({
  speciesId: uuidParam,
  name: z.string({ error: 'Variety name is required' }).trim().min(2, 'Variety name is at least 2 characters').max(120, 'Variety name is at most 120 characters'),
  description: z.string().trim().max(2000).nullable().optional(),
});

/** Edit a variety: name or description (a variety stays with its species), at least one. */
export const varietyPatchSchema = varietySchema.omit({ speciesId: true }).partial().strict().refine(somethingToChange, 'Send at least one field to change');

export type Variety = { id: string; speciesId: string; name: string; description: string | null; plantCount: number };

export type Species = {
  id: string;
  scientificName: string;
  commonName: string;
  genus: string;
  propagationMethods: PropagationMethod[];
  defaultCuttingLengthCm: number;
  defaultCuttingDiameterMm: number;
  softTipCm: number;
  strikeRatePrior: number;
  priorStrength: number;
  shadeTolerant: boolean;
  firstCropYears: number;
  restrictionNote: string | null;
  notes: string | null;
  varieties: Variety[];
};
