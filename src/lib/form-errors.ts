import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * Puts the server's per-field messages on the form's own fields, so a rule the server
 * enforces (a taken e-mail, say) shows where the person typed. Returns true when at least
 * one field took a message; the caller shows the general message otherwise.
 */
export function applyServerFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  knownFields: ReadonlyArray<Path<T>>,
): boolean {
  if (!(error instanceof ApiError)) return false;
  let applied = false;
  for (const [name, message] of Object.entries(error.fields)) {
    if ((knownFields as ReadonlyArray<string>).includes(name)) {
      setError(name as Path<T>, { type: 'server', message });
      applied = true;
    }
  }
  return applied;
}
