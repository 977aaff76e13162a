import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

const UNEXPECTED = 'Something unexpected went wrong. Please try again.';

/**
 * Puts a failed request's reasons per field (`ApiError.fields`, keyed by the field's path) on the
 * form's own fields, focusing the first, and returns what is left to say about the form as a
 * whole: `undefined` when every reason found its field.
 */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, fieldNames: readonly Path<T>[]): string | undefined {
  if (!(error instanceof ApiError)) return UNEXPECTED;
  const known = new Set<string>(fieldNames);
  let placed = 0;
  let unplaced = false;
  for (const [path, reason] of Object.entries(error.fields ?? {})) {
    if (known.has(path)) {
      setError(path as Path<T>, { type: 'server', message: reason }, { shouldFocus: placed === 0 });
      placed += 1;
    } else {
      unplaced = true;
    }
  }
  return placed > 0 && !unplaced ? undefined : error.message;
}
