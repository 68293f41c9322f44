// better-auth's browser client. The server mounts better-auth at /api/auth (its default
// base path), so only the origin is needed here.
import { createAuthClient } from 'better-auth/react';
import { inferAdditionalFields } from 'better-auth/client/plugins';
import { ApiError } from './api-client';

export const authClient = createAuthClient({
  baseURL: window.location.origin,
  plugins: [
    // The application fields a grower fills in when applying; the server declares the same.
    inferAdditionalFields({
      user: {
        placeName: { type: 'string', required: false },
        application: { type: 'string', required: false },
      },
    }),
  ],
});

type AuthFailure = { status?: number; statusText?: string; code?: string; message?: string } | null | undefined;

/** better-auth answers `{ data, error }`; screens deal in ApiError only. */
export function unwrapAuth<T>(result: { data: T; error: AuthFailure } | { data: null; error: AuthFailure }): T {
  const { data, error } = result as { data: T; error: AuthFailure };
  if (error) {
    const status = error.status ?? 0;
    throw new ApiError(
      status,
      error.code ?? `HTTP_${status}`,
      error.message || error.statusText || 'Signing in did not work. Try again.',
    );
  }
  return data;
}
