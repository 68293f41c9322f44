// One error middleware: every refusal leaves the API as { error: { code, message, fields } }.
import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import { fromZod, HttpError } from './http-error.js';

type PgError = { code?: string; constraint?: string; detail?: string; cause?: unknown };

/** Drizzle wraps driver errors; the PostgreSQL code sits on the error or its cause. */
function pgError(err: unknown): PgError | undefined {
  let e: unknown = err;
  for (let i = 0; i < 3 && e && typeof e === 'object'; i++) {
    const c = (e as PgError).code;
    if (typeof c === 'string' && /^[0-9A-Z]{5}$/.test(c)) return e as PgError;
    e = (e as PgError).cause;
  }
  return undefined;
}

export function toHttpError(err: unknown): HttpError | undefined {
  if (err instanceof HttpError) return err;
  if (err instanceof ZodError) return fromZod(err, 'input');
  const anyErr = err as { type?: string; status?: number };
  if (anyErr?.type === 'entity.parse.failed') return new HttpError(400, 'malformed_json', 'The request body is not valid JSON.');
  if (anyErr?.type === 'entity.too.large') return new HttpError(413, 'body_too_large', 'The request body is too large.');
  if (anyErr?.type === 'encoding.unsupported' || anyErr?.type === 'charset.unsupported')
    return new HttpError(415, 'unsupported_encoding', 'The request body encoding is not supported.');
  const pg = pgError(err);
  if (pg?.code === '23505') return new HttpError(409, 'conflict', 'That would duplicate something already stored.', constraintField(pg));
  if (pg?.code === '23503') return new HttpError(409, 'conflict', 'That refers to something that does not exist or is still in use.', constraintField(pg));
  if (pg?.code === '23514' || pg?.code === '23502')
    return new HttpError(400, 'invalid_input', 'A value is outside what is allowed.', constraintField(pg));
  if (pg?.code === '40001' || pg?.code === '40P01')
    return new HttpError(409, 'retry', 'Someone else changed the same records at the same time; try again.');
  return undefined;
}

/** Database constraints named after the form field they protect. */
const CONSTRAINT_FIELDS: Record<string, [string, string]> = {
  user_email_unique: ['email', 'already registered'],
  farms_code_unique: ['code', 'already used by another farm'],
  // drizzle names a .unique() column's constraint after the property, camelCase and all.
  species_scientificName_unique: ['scientificName', 'already in the list'],
  varieties_species_name_unique: ['name', 'already a variety of this species'],
  mother_plants_code_unique: ['code', 'already used'],
  pests_code_unique: ['code', 'already in the catalogue'],
  seasons_name_unique: ['name', 'already used by another season'],
  wood_offers_season_plant_unique: ['plantId', 'already offered this season'],
  wood_requests_season_grower_unique: ['seasonId', 'you already have a request this season'],
  wood_offers_reserved_check: ['cuttings', 'more than the plant offers'],
  // Checks a value can still break after the form's own check: numeric columns round (0.04 km is
  // stored as 0.0), and an edit may send one half of a pair the stored row completes.
  wood_requests_distance_check: ['maxDistanceKm', 'must be at least 0.1 km (it is kept to one decimal) and at most 1000 km'],
  species_cutting_length_check: ['defaultCuttingLengthCm', 'must be at least 0.1 cm (it is kept to one decimal) and at most 200 cm'],
  species_cutting_diameter_check: ['defaultCuttingDiameterMm', 'must be at least 0.1 mm (it is kept to one decimal)'],
  species_soft_tip_check: ['softTipCm', 'cannot be negative'],
  species_prior_check: ['strikeRatePrior', 'must be between 0.001 and 0.999 (it is kept to three decimals)'],
  species_prior_strength_check: ['priorStrength', 'must be more than 0'],
  species_first_crop_check: ['firstCropYears', 'must be between 1 and 15'],
  mother_plants_position_check: ['lat', 'give both latitude and longitude, or neither'],
  mother_plants_year_check: ['plantingYear', 'must be between 1900 and 2200'],
  strike_reports_counts_check: ['rooted', 'cannot be more than the cuttings stuck'],
  pickup_windows_order_check: ['to', 'the window ends before it starts'],
};

function constraintField(pg: PgError): Record<string, string> | undefined {
  if (!pg.constraint) return undefined;
  const known = CONSTRAINT_FIELDS[pg.constraint];
  return known ? { [known[0]]: known[1] } : { _: `constraint ${pg.constraint}` };
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const http = toHttpError(err);
  if (!http) {
    console.error(`[heelwood] ${req.method} ${req.originalUrl} failed:`, err);
  }
  const e = http ?? new HttpError(500, 'internal', 'Something went wrong on the server; the error was logged.');
  if (res.headersSent) return;
  res.status(e.status).json({ error: { code: e.code, message: e.message, ...(e.fields ? { fields: e.fields } : {}) } });
};
