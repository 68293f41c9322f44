// The wood-offer row's form: what the person typed, the body the server checks, and the live
// estimate. The numbers come from shared/yield.ts, the same functions the server runs on save.
import type { FieldErrors as RhfErrors, Resolver } from 'react-hook-form';
import { offerInputSchema, type OfferInput, type OfferRow } from '../../../../shared/schemas/seasons';
import { offerCap, plantYield } from '../../../../shared/yield';

export type OfferMode = 'shoots' | 'direct';

/** Inputs hold text as typed; an empty box means "not given". */
export type OfferFormValues = {
  mode: OfferMode;
  shootCount: string;
  meanShootLengthCm: string;
  directCount: string;
  offered: string;
};

export type OfferEstimate = { estimatedYield: number; cap: number };

function toNumber(text: string): number | null {
  const trimmed = text.trim().replace(',', '.');
  return trimmed === '' ? null : Number(trimmed);
}

export function defaultOfferValues(row: OfferRow): OfferFormValues {
  const o = row.offer;
  const text = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(n));
  return {
    mode: o && o.directCount !== null ? 'direct' : 'shoots',
    shootCount: text(o?.shootCount),
    meanShootLengthCm: text(o?.meanShootLengthCm),
    directCount: text(o?.directCount),
    offered: o ? String(o.offered) : '',
  };
}

/** The request body for PUT /offers/:plantId; the offered number is left out to mean "the cap". */
export function offerBody(values: OfferFormValues): OfferInput {
  const offered = toNumber(values.offered);
  const base = values.mode === 'direct' ? { directCount: toNumber(values.directCount) } : { shootCount: toNumber(values.shootCount), meanShootLengthCm: toNumber(values.meanShootLengthCm) };
  return offered === null ? base : { ...base, offered };
}

/** Estimated yield and the cap for the plant's role, or null until the inputs make sense. */
export function estimateOffer(row: Pick<OfferRow, 'cuttingLengthCm' | 'softTipCm' | 'capFraction'>, input: OfferInput): OfferEstimate | null {
  try {
    const estimatedYield =
      input.directCount != null
        ? plantYield({ directCount: input.directCount })
        : input.shootCount != null && input.meanShootLengthCm != null
          ? plantYield({ shootCount: input.shootCount, meanShootLengthCm: input.meanShootLengthCm, softTipCm: row.softTipCm, cuttingLengthCm: row.cuttingLengthCm })
          : null;
    if (estimatedYield === null) return null;
    return { estimatedYield, cap: offerCap(estimatedYield, row.capFraction) };
  } catch {
    return null;
  }
}

export type OfferCheck = { body: OfferInput; errors: Partial<Record<keyof OfferFormValues, string>>; estimate: OfferEstimate | null };

/** Checks the inputs with the server's schema and the cap, and works out the estimate. */
export function checkOffer(row: OfferRow, values: OfferFormValues): OfferCheck {
  const body = offerBody(values);
  const errors: OfferCheck['errors'] = {};
  const parsed = offerInputSchema.safeParse(body);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      let field = String(issue.path[0] ?? 'shootCount') as keyof OfferFormValues;
      // "Give a count" lands on shootCount in the schema; in direct mode that box is hidden.
      if (values.mode === 'direct' && field === 'shootCount') field = 'directCount';
      errors[field] ??= issue.message;
    }
  }
  const estimate = parsed.success ? estimateOffer(row, body) : null;
  if (estimate && body.offered !== undefined && body.offered > estimate.cap) {
    errors.offered = `Cuttings offered is at most ${estimate.cap} for this plant (its estimate ${estimate.estimatedYield}, capped by its role)`;
  }
  return { body, errors, estimate };
}

export function offerResolver(row: OfferRow): Resolver<OfferFormValues> {
  return async (values) => {
    const { errors } = checkOffer(row, values);
    const entries = Object.entries(errors);
    if (entries.length === 0) return { values, errors: {} };
    const rhf: RhfErrors<OfferFormValues> = {};
    for (const [field, message] of entries) rhf[field as keyof OfferFormValues] = { type: 'validation', message };
    return { values: {}, errors: rhf };
  };
}
