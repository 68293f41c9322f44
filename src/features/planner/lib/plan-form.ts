// The planner form: what the grower typed, the body POST /api/planner/estimate checks, and
// the figures. Every number comes from shared/planner.ts (the server runs the same
// functions); this file only turns typed text into the shared shapes.
import type { FieldErrors as RhfErrors, Resolver } from 'react-hook-form';
import { TREATMENTS, type Treatment } from '../../../../shared/domain';
import { DEFAULT_CUTTINGS_PER_POSITION, planFigures, plantingPositions, type PlanFigures } from '../../../../shared/planner';
import { plannerEstimateSchema, type PlannerEstimateBody, type PlannerEstimateInput } from '../../../../shared/schemas/planner';

export type PlanMode = 'hedgerow' | 'positions' | 'rooted';

export type PlanFormValues = {
  mode: PlanMode;
  lengthM: string;
  spacingM: string;
  rows: string;
  positions: string;
  cuttingsPerPosition: string;
  speciesId: string;
  varietyId: string;
  treatment: Treatment;
  /** Rooted plants wanted; in the row and position modes, empty means one per position. */
  rooted: string;
  confidence: string;
};

export const CONFIDENCE_CHOICES = ['0.8', '0.9', '0.95', '0.99'] as const;

/** In-row spacing suggested until the grower types one: 1.2 m suits currants and gooseberries (CHECK-VALUES: 0.9-1.2 m and 1.2-1.5 m). */
export const DEFAULT_SPACING_M = '1.2';

export type PlanStart = { lengthM?: number; speciesId?: string; varietyId?: string | null; treatment?: string };

export function defaultPlanValues(start: PlanStart = {}): PlanFormValues {
  return {
    mode: 'hedgerow',
    lengthM: start.lengthM !== undefined && Number.isFinite(start.lengthM) ? String(start.lengthM) : '',
    spacingM: DEFAULT_SPACING_M,
    rows: '1',
    positions: '',
    cuttingsPerPosition: String(DEFAULT_CUTTINGS_PER_POSITION),
    speciesId: start.speciesId ?? '',
    varietyId: start.varietyId ?? '',
    treatment: (TREATMENTS as readonly string[]).includes(start.treatment ?? '') ? (start.treatment as Treatment) : 'none',
    rooted: '',
    confidence: '0.9',
  };
}

function toNumber(text: string): number | null {
  const trimmed = text.trim().replace(',', '.');
  return trimmed === '' ? null : Number(trimmed);
}

/** Positions of the typed layout, or null while it is incomplete or wrong. */
function layoutPositions(values: PlanFormValues): number | null {
  try {
    if (values.mode === 'positions') {
      const positions = toNumber(values.positions);
      return positions === null ? null : plantingPositions({ positions });
    }
    const lengthM = toNumber(values.lengthM);
    const spacingM = toNumber(values.spacingM);
    const rows = toNumber(values.rows) ?? 1;
    return lengthM === null || spacingM === null ? null : plantingPositions({ lengthM, spacingM, rows });
  } catch {
    return null;
  }
}

/** The body for POST /api/planner/estimate. */
export function planBody(values: PlanFormValues): PlannerEstimateBody {
  const rate = { speciesId: values.speciesId || null, varietyId: values.varietyId || null, treatment: values.treatment };
  const k = toNumber(values.cuttingsPerPosition);
  const confidence = toNumber(values.confidence);
  const rooted = toNumber(values.rooted);
  if (values.mode === 'rooted') {
    return {
      // The schema wants a layout; for "N rooted plants" the planting has N positions.
      positions: rooted,
      cuttingsPerPosition: k,
      ...rate,
      target: rooted === null || confidence === null ? null : { rooted, confidence },
    };
  }
  const layout =
    values.mode === 'positions'
      ? { positions: toNumber(values.positions) }
      : { lengthM: toNumber(values.lengthM), spacingM: toNumber(values.spacingM), rows: toNumber(values.rows) };
  const wanted = rooted ?? layoutPositions(values);
  return { ...layout, cuttingsPerPosition: k, ...rate, target: wanted === null || confidence === null ? null : { rooted: wanted, confidence } };
}

export type PlanCheck = {
  body: PlannerEstimateBody;
  /** The checked question, when every field is right. */
  input: PlannerEstimateInput | null;
  errors: Partial<Record<keyof PlanFormValues, string>>;
  /** Species, variety and treatment: the strike rate depends on these only. */
  rateKey: string;
};

function fieldOf(path: PropertyKey[], mode: PlanMode): keyof PlanFormValues {
  const [first, second] = path.map(String);
  if (first === 'target') return second === 'confidence' ? 'confidence' : 'rooted';
  if (mode === 'rooted' && first === 'positions') return 'rooted';
  if (mode === 'rooted' && first === 'lengthM') return 'rooted';
  if (mode === 'positions' && first === 'lengthM') return 'positions';
  return (first || 'lengthM') as keyof PlanFormValues;
}

/** Species, variety and treatment of a body: plans with the same key share one strike rate. */
export function rateKeyOf(body: PlannerEstimateBody): string {
  return `${body.speciesId ?? ''}|${body.varietyId ?? ''}|${body.treatment ?? 'none'}`;
}

export function checkPlan(values: PlanFormValues): PlanCheck {
  const body = planBody(values);
  const rateKey = rateKeyOf(body);
  const parsed = plannerEstimateSchema.safeParse(body);
  if (parsed.success) return { body, input: parsed.data, errors: {}, rateKey };
  const errors: PlanCheck['errors'] = {};
  for (const issue of parsed.error.issues) errors[fieldOf(issue.path, values.mode)] ??= issue.message;
  // The page has no box for a typed strike rate, so the schema's "or give a strike rate" would puzzle.
  if (errors.speciesId && !values.speciesId) errors.speciesId = 'Choose a species';
  if (values.mode === 'rooted' && toNumber(values.rooted) === null) errors.rooted = 'Enter the number of rooted plants you want';
  return { body, input: null, errors, rateKey };
}

/** The same figures the server computes, from the same shared function, for a strike rate. */
export function localFigures(input: PlannerEstimateInput, strikeRate: number): PlanFigures | null {
  try {
    return planFigures({ layout: input.layout, cuttingsPerPosition: input.cuttingsPerPosition, strikeRate, target: input.target });
  } catch {
    return null;
  }
}

export function planResolver(): Resolver<PlanFormValues> {
  return async (values) => {
    const { errors } = checkPlan(values);
    const entries = Object.entries(errors);
    if (entries.length === 0) return { values, errors: {} };
    const rhf: RhfErrors<PlanFormValues> = {};
    for (const [field, message] of entries) rhf[field as keyof PlanFormValues] = { type: 'validation', message };
    return { values: {}, errors: rhf };
  };
}

/** The plan kept on a request line, so the request page can say where its number came from. */
export function planRecord(values: PlanFormValues, figures: { positions: number; cuttingsPerPosition: number }): Record<string, unknown> {
  const k = figures.cuttingsPerPosition;
  if (values.mode === 'rooted') return { kind: 'rooted', rooted: toNumber(values.rooted), confidence: toNumber(values.confidence) };
  if (values.mode === 'positions') return { kind: 'positions', positions: figures.positions, cuttingsPerPosition: k };
  return { kind: 'hedgerow', lengthM: toNumber(values.lengthM), spacingM: toNumber(values.spacingM), rows: toNumber(values.rows) ?? 1, positions: figures.positions, cuttingsPerPosition: k };
}
