// The one way services refuse: throw an HttpError; the error middleware writes
// { error: { code, message, fields } } with its status.
import type { ZodError } from 'zod';

export class HttpError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) =>
  new HttpError(400, 'invalid_input', message, fields);
export const unauthorized = (message = 'Sign in to continue.') => new HttpError(401, 'unauthenticated', message);
export const forbidden = (message = 'You do not have permission to do that.') => new HttpError(403, 'forbidden', message);
export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, fields?: Record<string, string>) =>
  new HttpError(409, 'conflict', message, fields);

/** First message per field path ("lines.0.cuttings"), for forms to show beside the field. */
export function zodFields(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

export function fromZod(error: ZodError, where: string): HttpError {
  const fields = zodFields(error);
  const list = Object.entries(fields)
    .map(([k, v]) => (k === '_' ? v : `${k}: ${v}`))
    .join('; ');
  return badRequest(`Check the ${where}: ${list}`, fields);
}
