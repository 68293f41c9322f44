// Request lines on the page: defaults for the form, a line arriving from the planner, and a
// plan in words.
import { TREATMENTS, type Treatment } from '../../../../shared/domain';
import type { WoodRequest, WoodRequestInput } from '../../../../shared/schemas/seasons';

export type RequestLineValues = WoodRequestInput['lines'][number];
export type RequestFormValues = WoodRequestInput;

/** A line handed over by the planner through the page address. */
export type IncomingLine = {
  speciesId: string;
  varietyId: string | null;
  treatment: Treatment;
  cuttings: number | undefined;
  plan: Record<string, unknown> | null;
};

export const DEFAULT_MAX_DISTANCE_KM = 25;

export function emptyLine(): RequestLineValues {
  return { speciesId: '', varietyId: null, cuttings: undefined as unknown as number, substitutesAllowed: false, treatment: 'none', plan: null };
}

/** Reads a planner line from the address, ignoring anything malformed. */
export function readIncomingLine(params: URLSearchParams): IncomingLine | null {
  const speciesId = params.get('speciesId');
  if (!speciesId) return null;
  const treatment = params.get('treatment');
  const cuttings = Number(params.get('cuttings'));
  let plan: Record<string, unknown> | null = null;
  try {
    const parsed: unknown = JSON.parse(params.get('plan') ?? 'null');
    if (parsed && typeof parsed === 'object' && !Array.isArray(parsed)) plan = parsed as Record<string, unknown>;
  } catch {
    plan = null;
  }
  return {
    speciesId,
    varietyId: params.get('varietyId') || null,
    treatment: (TREATMENTS as readonly string[]).includes(treatment ?? '') ? (treatment as Treatment) : 'none',
    cuttings: Number.isSafeInteger(cuttings) && cuttings > 0 ? cuttings : undefined,
    plan,
  };
}

export function formDefaults(request: WoodRequest | null): RequestFormValues {
  if (!request) {
    return {
      destinationLat: undefined as unknown as number,
      destinationLon: undefined as unknown as number,
      destinationLabel: '',
      maxDistanceKm: DEFAULT_MAX_DISTANCE_KM,
      notes: '',
      status: 'filed',
      lines: [],
    };
  }
  return {
    destinationLat: request.destinationLat,
    destinationLon: request.destinationLon,
    destinationLabel: request.destinationLabel,
    maxDistanceKm: request.maxDistanceKm,
    notes: request.notes,
    status: request.status === 'draft' ? 'draft' : 'filed',
    lines: request.lines.map((l) => ({
      speciesId: l.speciesId,
      varietyId: l.varietyId,
      cuttings: l.cuttings,
      substitutesAllowed: l.substitutesAllowed,
      treatment: l.treatment,
      plan: l.plan,
    })),
  };
}

export type MergeResult = { lines: RequestLineValues[]; note: string | null; index: number | null };

/**
 * Puts the planner's line into the request: a new line, or, when the request already has a
 * line for the same species, variety and treatment, that line takes the planner's number
 * (the server refuses two such lines).
 */
export function mergeIncoming(lines: RequestLineValues[], incoming: IncomingLine | null): MergeResult {
  if (!incoming) return { lines, note: null, index: null };
  const line: RequestLineValues = {
    speciesId: incoming.speciesId,
    varietyId: incoming.varietyId,
    cuttings: incoming.cuttings as number,
    substitutesAllowed: false,
    treatment: incoming.treatment,
    plan: incoming.plan,
  };
  const at = lines.findIndex((l) => l.speciesId === line.speciesId && (l.varietyId ?? null) === line.varietyId && (l.treatment ?? 'none') === line.treatment);
  if (at >= 0) {
    const next = lines.slice();
    next[at] = { ...lines[at], cuttings: line.cuttings ?? lines[at].cuttings, plan: line.plan ?? lines[at].plan };
    return {
      lines: next,
      index: at,
      note: `Line ${at + 1} already asked for this wood; it now asks for ${line.cuttings ?? lines[at].cuttings} cuttings, from the planner. Save to keep the change.`,
    };
  }
  return { lines: [...lines, line], index: lines.length, note: `The planner added line ${lines.length + 1}. Check it, then save the request.` };
}

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/** A plan kept on a line, in words: "30 m hedgerow, 1 row, every 1.2 m: 26 positions, 2 cuttings each". */
export function planText(plan: Record<string, unknown> | null | undefined): string | null {
  if (!plan) return null;
  const k = num(plan.cuttingsPerPosition);
  const each = k ? `, ${k} cutting${k === 1 ? '' : 's'} each` : '';
  const purpose = typeof plan.purpose === 'string' && plan.purpose ? `${plan.purpose}: ` : '';
  const positions = num(plan.positions);
  if (plan.kind === 'hedgerow') {
    const rows = num(plan.rows) ?? 1;
    return `${purpose}${num(plan.lengthM)} m hedgerow, ${rows} row${rows === 1 ? '' : 's'}, every ${num(plan.spacingM)} m: ${positions} positions${each}`;
  }
  if (plan.kind === 'positions' && positions !== null) return `${purpose}${positions} planting positions${each}`;
  if (plan.kind === 'rooted') {
    const confidence = num(plan.confidence);
    return `${purpose}${num(plan.rooted)} rooted plants wanted${confidence !== null ? `, ${Math.round(confidence * 100)} % sure` : ''}`;
  }
  return purpose ? purpose.replace(/: $/, '') : null;
}
