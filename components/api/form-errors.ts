import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';

import { ApiError, errorMessage } from './client';

/**
 * Puts a server error beside its field when the server names one of the form's fields; otherwise
 * returns the message for a banner above the form. The form keeps what the person typed either way.
 */
export function applyServerError<T extends FieldValues>(error: unknown, fields: readonly Path<T>[], setError: UseFormSetError<T>): string | null {
  if (error instanceof ApiError && error.field && (fields as readonly string[]).includes(error.field)) {
    setError(error.field as Path<T>, { type: 'server', message: error.message }, { shouldFocus: true });
    return null;
  }
  return errorMessage(error);
}
