// The planner's question and answer. The form and POST /api/planner/estimate check the same
// schema; the field rules themselves live in shared/planner.ts so the messages are one set.
//
// The body is flat, as a form sends it: a layout, either { lengthM, spacingM, rows } or
// { positions }; cuttings per position; a strike rate, either typed (strikeRate) or
// estimated from a species, an optional variety and a treatment; optionally a target of
// N rooted plants with a confidence. Missing values may be absent or null.
import { z } from 'zod';
import { TREATMENTS, type Treatment } from '../domain.js';
import {
  cuttingsPerPositionErrors,
  DEFAULT_CUTTINGS_PER_POSITION,
  type FieldErrors,
  type Layout,
  positionsErrors,
  rowLayoutErrors,
  strikeRateErrors,
  targetErrors,
} from '../planner.js';
import type { StrikeRateEstimate } from '../strike-rate.js';
import { uuidParam } from './common.js';

const num = (label: string) => z.number({ error: `${label} must be a number` });

export const plannerEstimateSchema = z
  .object({
    lengthM: num('Row length').nullish(),
    spacingM: num('Spacing').nullish(),
    rows: num('Rows').nullish(),
    positions: num('Positions').nullish(),
    cuttingsPerPosition: num('Cuttings per position').nullish(),
    strikeRate: num('Strike rate').nullish(),
    speciesId: uuidParam.nullish(),
    varietyId: uuidParam.nullish(),
    treatment: z.enum(TREATMENTS, { error: 'Treatment must be none, willow, hormone or both' }).nullish(),
    target: z
      .object({ rooted: num('Rooted plants wanted'), confidence: num('Confidence') }, { error: 'Target is { rooted, confidence }' })
      .nullish(),
  })
  .superRefine((v, ctx) => {
    const add = (errors: FieldErrors, prefix: string[] = []) => {
      for (const [field, message] of Object.entries(errors)) ctx.addIssue({ code: 'custom', path: [...prefix, field], message });
    };

    const rowShape = v.lengthM != null || v.spacingM != null || v.rows != null;
    if (rowShape && v.positions != null) {
      add({ positions: 'Give either a number of positions or a row length, spacing and rows, not both' });
    } else if (v.positions != null) {
      add(positionsErrors(v.positions));
    } else if (rowShape) {
      if (v.lengthM == null) add({ lengthM: 'Enter the row length in metres' });
      if (v.spacingM == null) add({ spacingM: 'Enter the spacing in metres' });
      if (v.lengthM != null && v.spacingM != null) add(rowLayoutErrors({ lengthM: v.lengthM, spacingM: v.spacingM, rows: v.rows ?? 1 }));
    } else {
      add({ lengthM: 'Give a row length, spacing and rows, or a number of positions' });
    }

    if (v.cuttingsPerPosition != null) add(cuttingsPerPositionErrors(v.cuttingsPerPosition));

    const speciesShape = v.speciesId != null || v.varietyId != null || v.treatment != null;
    if (v.strikeRate != null && speciesShape) {
      add({ strikeRate: 'Give either a strike rate or a species and treatment, not both: a strike rate you type already includes any treatment' });
    } else if (v.strikeRate != null) {
      add(strikeRateErrors(v.strikeRate));
    } else if (v.speciesId == null) {
      add({ speciesId: v.varietyId != null ? 'Choose the species of that variety' : 'Choose a species, or give a strike rate' });
    }

    if (v.target != null) add(targetErrors(v.target), ['target']);
  })
  .transform((v): PlannerEstimateInput => {
    const layout: Layout = v.positions != null ? { positions: v.positions } : { lengthM: v.lengthM!, spacingM: v.spacingM!, rows: v.rows ?? 1 };
    const rate: PlannerRateInput =
      v.strikeRate != null
        ? { strikeRate: v.strikeRate }
        : { speciesId: v.speciesId!, varietyId: v.varietyId ?? null, treatment: v.treatment ?? 'none' };
    return {
      layout,
      cuttingsPerPosition: v.cuttingsPerPosition ?? DEFAULT_CUTTINGS_PER_POSITION,
      rate,
      ...(v.target != null ? { target: v.target } : {}),
    };
  });

/** What the form sends. */
export type PlannerEstimateBody = z.input<typeof plannerEstimateSchema>;

export type PlannerRateInput = { strikeRate: number } | { speciesId: string; varietyId: string | null; treatment: Treatment };

/** The checked question, shaped for the service. */
export type PlannerEstimateInput = {
  layout: Layout;
  cuttingsPerPosition: number;
  rate: PlannerRateInput;
  target?: { rooted: number; confidence: number };
};

/** Where the strike rate came from: typed by the grower, or estimated at some level. */
export type PlannerStrikeRate = Omit<StrikeRateEstimate, 'source'> & {
  source: StrikeRateEstimate['source'] | 'given';
  /** Which reports the estimate used: the variety's, the whole species', or none. */
  scope: 'given' | 'variety' | 'species' | 'prior';
  treatment?: Treatment;
};

/** The answer of POST /api/planner/estimate. */
export type PlannerEstimate = {
  positions: number;
  cuttingsPerPosition: number;
  cuttings: number;
  fillProbability: number;
  expectedEmptyPositions: number;
  strikeRate: PlannerStrikeRate;
  /** With a target: cuttings for N rooted plants at the confidence, and the chance they give. */
  cuttingsForTarget?: number;
  targetChance?: number;
};
