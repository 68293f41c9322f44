import { z } from 'zod';
import { HEMISPHERES, SEASON_KINDS, SEASON_STAGES, TREATMENTS, type Hemisphere, type SeasonKind, type SeasonStage, type Treatment } from '../domain.js';
import { uuidParam } from './common.js';
import { latSchema, lonSchema } from './register.js';

const isoDate = z.string({ error: 'Date is required' }).regex(/^\d{4}-\d{2}-\d{2}$/, 'Date looks like 2027-01-15');

export const seasonCreateSchema = z
  .object({
    name: z.string({ error: 'Name is required' }).trim().min(3, 'Name is at least 3 characters').max(80, 'Name is at most 80 characters'),
    kind: z.enum(SEASON_KINDS, { error: 'Kind must be dormant hardwood, leafy cuttings or scion wood' }),
    hemisphere: z.enum(HEMISPHERES, { error: 'Hemisphere must be north or south' }),
    requestDeadline: z.iso.datetime({ offset: true, error: 'Deadline must be a date and time' }),
    collectionStart: isoDate,
    collectionEnd: isoDate,
    lookbackMonths: z.number({ error: 'Look-back must be a number of months' }).int().min(1, 'Look-back is at least 1 month').max(60, 'Look-back is at most 60 months').default(12),
    notes: z.string().trim().max(4000).default(''),
  })
  .superRefine((v, ctx) => {
    if (v.collectionEnd < v.collectionStart) ctx.addIssue({ code: 'custom', path: ['collectionEnd'], message: 'The collection window ends before it starts' });
    if (v.requestDeadline.slice(0, 10) > v.collectionStart) {
      ctx.addIssue({ code: 'custom', path: ['requestDeadline'], message: 'Requests must close before collections start' });
    }
  });
export type SeasonCreate = z.input<typeof seasonCreateSchema>;

export const seasonStageSchema = z.object({ stage: z.enum(SEASON_STAGES, { error: 'Unknown stage' }) });

export type Season = {
  id: string;
  name: string;
  kind: SeasonKind;
  hemisphere: Hemisphere;
  stage: SeasonStage;
  requestDeadline: string;
  collectionStart: string;
  collectionEnd: string;
  lookbackMonths: number;
  notes: string;
  offerCount: number;
  cuttingsOffered: number;
  requestCount: number;
  cuttingsAsked: number;
  /** What members may change now, in plain words. */
  rules: { offers: boolean; windows: boolean; requests: boolean; text: string };
};

// Wood offers ----------------------------------------------------------------------

export const offerInputSchema = z
  .object({
    shootCount: z.number({ error: 'Shoot count must be a number' }).int('Shoot count is a whole number').min(0, 'Shoot count cannot be negative').max(2000, 'Shoot count is at most 2000').nullable().optional(),
    meanShootLengthCm: z.number({ error: 'Mean shoot length must be a number' }).min(0, 'Length cannot be negative').max(500, 'Mean shoot length is at most 500 cm').nullable().optional(),
    directCount: z.number({ error: 'Count must be a number' }).int('Count is a whole number').min(0, 'Count cannot be negative').max(20000, 'Count is at most 20000').nullable().optional(),
    /** What the farm offers; at most the cap for the plant's role. Missing = the cap. */
    offered: z.number({ error: 'Offer must be a number' }).int('Offer is a whole number of cuttings').min(0, 'Offer cannot be negative').optional(),
  })
  .superRefine((v, ctx) => {
    const byShoots = v.shootCount != null || v.meanShootLengthCm != null;
    if (v.directCount == null && !byShoots) ctx.addIssue({ code: 'custom', path: ['shootCount'], message: 'Give shoot count and mean length, or a direct count' });
    if (v.directCount == null && byShoots) {
      if (v.shootCount == null) ctx.addIssue({ code: 'custom', path: ['shootCount'], message: 'Shoot count is required with a mean length' });
      if (v.meanShootLengthCm == null) ctx.addIssue({ code: 'custom', path: ['meanShootLengthCm'], message: 'Mean shoot length is required with a shoot count' });
    }
  });
export type OfferInput = z.input<typeof offerInputSchema>;

export type OfferRow = {
  plantId: string;
  code: string;
  farmId: string;
  farmName: string;
  speciesName: string;
  varietyName: string | null;
  role: 'stock_bed' | 'fruiting_bush';
  healthStatus: 'clean' | 'watch' | 'hold' | 'retired';
  lastInspectedOn: string | null;
  /** Clean and inspected within the season's look-back. */
  eligible: boolean;
  whyNot: string | null;
  cuttingLengthCm: number;
  softTipCm: number;
  capFraction: number;
  offer: {
    id: string;
    shootCount: number | null;
    meanShootLengthCm: number | null;
    directCount: number | null;
    estimatedYield: number;
    offered: number;
    reserved: number;
    withdrawnAt: string | null;
    withdrawnReason: string | null;
  } | null;
};

// Pickup windows ---------------------------------------------------------------------

const hhmm = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Time looks like 09:30');

/** Times are local to the farm (its time zone), as the farm lead thinks of them. */
export const pickupWindowSchema = z
  .object({
    date: isoDate,
    from: hhmm,
    to: hhmm,
    note: z.string().trim().max(500).default(''),
  })
  .refine((v) => v.to > v.from, { message: 'The window ends before it starts', path: ['to'] });

export type PickupWindow = { id: string; farmId: string; startsAt: string; endsAt: string; note: string; timezone: string };

// Wood requests ----------------------------------------------------------------------

export const requestLineSchema = z.object({
  speciesId: uuidParam,
  varietyId: uuidParam.nullable().default(null),
  cuttings: z.number({ error: 'Cuttings must be a number' }).int('Cuttings is a whole number').min(1, 'Ask for at least 1 cutting').max(100000, 'At most 100000 cuttings on one line'),
  substitutesAllowed: z.boolean().default(false),
  treatment: z.enum(TREATMENTS, { error: 'Treatment must be none, willow, hormone or both' }).default('none'),
  /** The planner's figures behind the line (planRecord in the client): a few named numbers and words. */
  plan: z
    .record(z.string(), z.unknown())
    .refine(
      (p) =>
        Object.keys(p).length <= 20 &&
        Object.entries(p).every(([k, v]) => k.length <= 40 && (v === null || typeof v === 'number' || typeof v === 'boolean' || (typeof v === 'string' && v.length <= 200))),
      'A plan holds at most 20 named numbers or short words',
    )
    .nullable()
    .optional(),
});

export const woodRequestSchema = z.object({
  destinationLat: latSchema,
  destinationLon: lonSchema,
  destinationLabel: z.string().trim().max(200).default(''),
  maxDistanceKm: z.number({ error: 'Distance must be a number' }).gt(0, 'Distance must be more than 0 km').max(1000, 'Distance is at most 1000 km'),
  notes: z.string().trim().max(4000).default(''),
  status: z.enum(['draft', 'filed'], { error: 'Status is draft or filed' }).default('filed'),
  lines: z.array(requestLineSchema).min(1, 'Add at least one line').max(50, 'At most 50 lines'),
});
export type WoodRequestInput = z.input<typeof woodRequestSchema>;

export type WoodRequestLine = {
  id: string;
  speciesId: string;
  speciesName: string;
  varietyId: string | null;
  varietyName: string | null;
  cuttings: number;
  substitutesAllowed: boolean;
  treatment: Treatment;
  plan: Record<string, unknown> | null;
  restrictionNote: string | null;
};

export type WoodRequest = {
  id: string;
  seasonId: string;
  growerId: string;
  growerName: string;
  status: 'draft' | 'filed' | 'withdrawn';
  destinationLat: number;
  destinationLon: number;
  destinationLabel: string;
  maxDistanceKm: number;
  notes: string;
  updatedAt: string;
  lines: WoodRequestLine[];
  editable: boolean;
};

export type BoardRow = {
  speciesId: string;
  speciesName: string;
  varietyId: string | null;
  varietyName: string | null;
  offered: number;
  farms: number;
  plants: number;
  asked: number;
  /** Asked over offered; above 1 the wood is scarce. */
  pressure: number | null;
  nearestKm: number | null;
  restrictionNote: string | null;
};
