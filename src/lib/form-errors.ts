import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/** Puts the server's field messages on the matching fields, and anything else on the form as a whole. */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>): void {
  if (!(error instanceof ApiError)) {
    setError('root.server' as Path<T>, { message: 'The server could not be reached. Check your connection and try again.' });
    return;
  }
  const fields = Object.entries(error.fields);
  for (const [field, message] of fields) setError(field as Path<T>, { message });
  if (fields.length === 0) setError('root.server' as Path<T>, { message: error.message });
}
