// Strike reports (how many cuttings of a bundle rooted), plants raised from a bundle, and the
// strike-rate table. The report form and POST /api/bundles/:bundleId/strike-reports check the
// same schema; rules that need the bundle (cuttings, collection date) are checked by the
// server with strikeReportDateErrors, which the form may run too.
import { z } from 'zod';
import {
  PLANT_ROLES,
  TREATMENTS,
  type BundleStatus,
  type Hemisphere,
  type SeasonKind,
  type Treatment,
} from '../domain.js';
import { uuidParam } from './common.js';
import type { PhotoView } from './register.js';

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

/** A calendar date typed as yyyy-MM-dd that exists (no 31 April). */
export const isoDateSchema = z
  .string({ error: 'Enter a date' })
  .regex(ISO_DATE, 'Enter a date like 2026-09-14')
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, 'That date does not exist');

const count = (label: string) => z.number({ error: `${label} must be a number` }).int(`${label} must be a whole number`);

export const strikeReportCreateSchema = z
  .object({
    stuck: count('Cuttings stuck').min(1, 'At least one cutting was stuck').max(100_000, 'Cuttings stuck is at most 100,000'),
    rooted: count('Rooted').min(0, 'Rooted cannot be negative').max(100_000, 'Rooted is at most 100,000'),
    assessedOn: isoDateSchema,
    /** How the cuttings were treated; the request line's treatment when left out. */
    treatment: z.enum(TREATMENTS, { error: 'Treatment must be none, willow, hormone or both' }).optional(),
    notes: z.string({ error: 'Notes must be text' }).trim().max(2000, 'Notes are at most 2,000 characters').optional().default(''),
  })
  .superRefine((v, ctx) => {
    if (v.rooted > v.stuck) ctx.addIssue({ code: 'custom', path: ['rooted'], message: 'Rooted cannot be more than the cuttings stuck' });
  });
export type StrikeReportCreate = z.input<typeof strikeReportCreateSchema>;

/**
 * Date rules of a report: not before the day the bundle was collected, not after today
 * (both as calendar dates where the wood was collected).
 */
export function strikeReportDateErrors(v: { assessedOn: string; collectedOn: string; today: string }): Record<string, string> {
  if (v.assessedOn < v.collectedOn) return { assessedOn: `Cannot be before the bundle was collected (${v.collectedOn})` };
  if (v.assessedOn > v.today) return { assessedOn: 'Cannot be in the future' };
  return {};
}

export const raisePlantsSchema = z.object({
  /** A farm where the bundle's grower is farm lead or farm hand. */
  farmId: uuidParam,
  count: count('Number of plants').min(1, 'Register at least one plant').max(200, 'At most 200 plants at a time'),
  role: z.enum(PLANT_ROLES, { error: 'Role must be stock bed or fruiting bush' }),
  plantingYear: count('Planting year')
    .min(1900, 'Planting year must be 1900 or later')
    .refine((y) => y <= new Date().getUTCFullYear() + 1, 'Planting year cannot be in the future'),
  bedRow: z.string({ error: 'Bed/row must be text' }).trim().max(100, 'Bed/row is at most 100 characters').optional().default(''),
  notes: z.string({ error: 'Notes must be text' }).trim().max(4000, 'Notes are at most 4,000 characters').optional(),
});
export type RaisePlantsInput = z.input<typeof raisePlantsSchema>;

export const strikeRatesQuerySchema = z.object({
  speciesId: uuidParam.optional(),
  varietyId: uuidParam.optional(),
  treatment: z.enum(TREATMENTS, { error: 'treatment must be none, willow, hormone or both' }).optional(),
});
export type StrikeRatesQuery = z.input<typeof strikeRatesQuerySchema>;

/** A strike report has at most this many photos of its rooted cuttings. */
export const MAX_REPORT_PHOTOS = 3;

/**
 * A photo of a report's rooted cuttings, as a plant photo but with no position kept; the
 * files (/api/photos/:id/image and /thumb) are for the reporter and coordinators only.
 */
export type StrikeReportPhotoView = Omit<PhotoView, 'gps' | 'findingId'>;

export type StrikeReportView = {
  id: string;
  bundleId: string;
  stuck: number;
  rooted: number;
  assessedOn: string;
  treatment: Treatment;
  notes: string;
  reporterName: string | null;
  createdAt: string;
  /** The caller filed this report: only they may add or remove its photos. */
  mine: boolean;
  /** Its photos the caller may see (the reporter's and a coordinator's view), oldest first. */
  photos: StrikeReportPhotoView[];
};

/** A collected bundle on the grower's report page. */
export type MyBundle = {
  id: string;
  code: string | null;
  status: BundleStatus;
  seasonId: string;
  seasonName: string;
  seasonKind: SeasonKind;
  hemisphere: Hemisphere;
  collectedAt: string;
  /** Calendar date of collection where the wood was collected. */
  collectedOn: string;
  /** When a strike report is due (see server/modules/reminders/report-due.ts). */
  reportDueOn: string;
  cuttings: number;
  /** The treatment the request line planned; a report may say otherwise. */
  plannedTreatment: Treatment;
  plant: { id: string; code: string };
  farm: { id: string; name: string };
  species: { id: string; name: string };
  variety: { id: string; name: string } | null;
  reports: StrikeReportView[];
  reported: { stuck: number; rooted: number };
  /** Cuttings of the bundle not covered by a report yet. */
  unreported: number;
  raisedPlants: { id: string; code: string; farmName: string }[];
  /** Rooted cuttings not yet registered as plants. */
  mayRaise: number;
};

export type MyBundles = {
  items: MyBundle[];
  total: number;
  /** Farms where the caller may register raised plants. */
  farms: { id: string; name: string; code: string; farmRole: 'lead' | 'hand' }[];
};

export type RaisedPlant = { id: string; code: string; farmId: string; parentPlantId: string; sourceBundleId: string };

export type StrikeRateRow = {
  speciesId: string;
  speciesName: string;
  /** Null on a species row (every variety, and plants of no named variety, pooled). */
  varietyId: string | null;
  varietyName: string | null;
  level: 'species' | 'variety';
  treatment: Treatment;
  prior: { untreated: number; rate: number; strength: number };
  reports: number;
  stuck: number;
  rooted: number;
  /** Posterior mean and 90 % equal-tailed interval (shared/strike-rate.ts). */
  rate: number;
  low: number;
  high: number;
  source: 'prior' | 'reports';
};
