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

/**
 * PostgreSQL text cannot hold a NUL character, and half of a surrogate pair (which JSON can
 * carry as "\ud800") is not Unicode at all: the database would refuse either with an error
 * that names no field, or store a replacement character. Checked on everything route() parses.
 */
const UNSTORABLE = /\u0000|\p{Cs}/u;
const UNSTORABLE_MESSAGE = 'contains a character that cannot be stored (a NUL or a broken Unicode character)';
export const isStorableText = (s: string) => !UNSTORABLE.test(s);

type Where = { up: Where | null; key: string | number } | null;
const pathOf = (w: Where) => {
  const keys: (string | number)[] = [];
  for (let x = w; x; x = x.up) keys.push(x.key);
  return keys.length ? keys.reverse().join('.') : '_';
};

export function unstorableTextFields(value: unknown): Record<string, string> {
  const fields: Record<string, string> = {};
  // Iterative, with paths built only for what is reported: a JSON value may nest deeper than the call stack goes.
  const stack: { v: unknown; at: Where }[] = [{ v: value, at: null }];
  while (stack.length) {
    const { v, at } = stack.pop()!;
    if (typeof v === 'string') {
      if (UNSTORABLE.test(v)) fields[pathOf(at)] ??= UNSTORABLE_MESSAGE;
    } else if (Array.isArray(v)) {
      v.forEach((x, i) => stack.push({ v: x, at: { up: at, key: i } }));
    } else if (v && typeof v === 'object' && [Object.prototype, null].includes(Object.getPrototypeOf(v))) {
      for (const [k, x] of Object.entries(v)) {
        if (UNSTORABLE.test(k)) fields[pathOf({ up: at, key: k })] ??= UNSTORABLE_MESSAGE;
        stack.push({ v: x, at: { up: at, key: k } });
      }
    }
  }
  return fields;
}

/** A 400 naming each field whose text cannot be stored, or undefined when all can. */
export function unstorableTextError(value: unknown, where: string): HttpError | undefined {
  const fields = unstorableTextFields(value);
  const keys = Object.keys(fields);
  return keys.length ? badRequest(`Check the ${where}: ${keys.join(', ')} ${UNSTORABLE_MESSAGE}`, fields) : undefined;
}

export function assertStorableText(value: unknown, where: string): void {
  const e = unstorableTextError(value, where);
  if (e) throw e;
}
