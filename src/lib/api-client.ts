// The one HTTP client for Heelwood's own API. Every request goes through `request` so
// that the server's error shape becomes an ApiError and a lost session is handled here
// only, rather than in each screen.
import type { ApiErrorBody } from '../../shared/schemas/common';

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;

  constructor(status: number, code: string, message: string, fields: Record<string, string> = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** Words for a person, whatever went wrong. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong. Try again.';
}

type QueryValue = string | number | boolean | null | undefined;
export type RequestOptions = {
  query?: Record<string, QueryValue>;
  body?: unknown;
  signal?: AbortSignal;
};

const NETWORK_MESSAGE = 'Heelwood could not reach its server. Check your connection and try again.';

// /api/me answers 401 simply to say "nobody is signed in"; that is not a lost session.
const SESSION_PROBE_PATHS = ['/api/me'];

let onUnauthorized: () => void = () => {
  window.location.assign('/sign-in');
};
let unauthorizedHandled = false;

/** The app decides where a lost session leads (it knows the router and the cache). */
export function setUnauthorizedHandler(handler: () => void): void {
  onUnauthorized = handler;
}

/** Called after a successful sign-in so that a later expiry redirects again. */
export function resetUnauthorizedRedirect(): void {
  unauthorizedHandled = false;
}

function handleUnauthorized(path: string): void {
  if (!path.startsWith('/api/') || SESSION_PROBE_PATHS.includes(path)) return;
  // Several queries can fail at once when a session ends; send the person away once.
  if (unauthorizedHandled) return;
  unauthorizedHandled = true;
  onUnauthorized();
}

export function buildUrl(path: string, query?: Record<string, QueryValue>): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '') continue;
    params.set(key, String(value));
  }
  const qs = params.toString();
  return qs ? `${path}?${qs}` : path;
}

function isErrorBody(value: unknown): value is ApiErrorBody {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const inner = (value as { error: unknown }).error;
  return typeof inner === 'object' && inner !== null && typeof (inner as { message?: unknown }).message === 'string';
}

function fallbackMessage(status: number): string {
  if (status === 401) return 'You are signed out. Sign in again to continue.';
  if (status === 403) return 'Your account may not do this.';
  if (status === 404) return 'That was not found. It may have been removed.';
  if (status >= 500) return 'The Heelwood server had a problem. Try again in a moment.';
  return `The request failed (HTTP ${status}).`;
}

/** Turns any non-2xx response into an ApiError, whatever its body. */
export async function toApiError(response: Response): Promise<ApiError> {
  let body: unknown = null;
  const text = await response.text().catch(() => '');
  if (text) {
    try {
      body = JSON.parse(text);
    } catch {
      body = null;
    }
  }
  if (isErrorBody(body)) {
    const { code, message, fields } = body.error;
    return new ApiError(response.status, code || `HTTP_${response.status}`, message, fields ?? {});
  }
  return new ApiError(response.status, `HTTP_${response.status}`, fallbackMessage(response.status));
}

export async function request<T>(method: string, path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const init: RequestInit = { method, credentials: 'include', headers, signal: options.signal };
  if (options.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    init.body = JSON.stringify(options.body);
  }

  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), init);
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'NETWORK', NETWORK_MESSAGE);
  }

  if (!response.ok) {
    const error = await toApiError(response);
    if (response.status === 401) handleUnauthorized(path);
    throw error;
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, 'body'>) => request<T>('GET', path, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('POST', path, { ...options, body }),
  put: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PUT', path, { ...options, body }),
  patch: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PATCH', path, { ...options, body }),
  delete: <T = void>(path: string, options?: RequestOptions) => request<T>('DELETE', path, options),
};
