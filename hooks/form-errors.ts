/**
 * Puts a failed request's messages where the person filling in a form will see them.
 */
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * Sets a react-hook-form error on every field of `fieldNames` that the server's `fields` names, and returns the
 * message to show above the form: the server's message when no field took it (e.g. BAD_CREDENTIALS,
 * RATE_LIMITED, a network failure), otherwise `null`. Non-ApiError values get a generic message naming the error.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  fieldNames: readonly Path<T>[],
  setError: UseFormSetError<T>,
): string | null {
  if (!(error instanceof ApiError)) {
    return `Something went wrong in the app: ${error instanceof Error ? error.message : String(error)}`;
  }
  let placed = 0;
  for (const name of fieldNames) {
    const message = error.fields[name];
    if (message) {
      setError(name, { type: 'server', message }, { shouldFocus: placed === 0 });
      placed += 1;
    }
  }
  const unplaced = Object.keys(error.fields).filter((k) => !(fieldNames as readonly string[]).includes(k));
  if (placed > 0 && unplaced.length === 0) return null;
  if (unplaced.length > 0) {
    return `${error.message} (${unplaced.map((k) => `${k}: ${error.fields[k]}`).join('; ')})`;
  }
  return error.message;
}
