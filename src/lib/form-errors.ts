import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * Puts a 400's field details on the matching form fields. Returns the details no field took (shown as a
 * form-level message), so no server complaint is dropped silently.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
  rename: Partial<Record<string, Path<T>>> = {},
): string[] {
  if (!(error instanceof ApiError)) return [];
  const leftover: string[] = [];
  for (const detail of error.details) {
    const field = rename[detail.path] ?? (fields as readonly string[]).find((name) => name === detail.path);
    if (field) setError(field as Path<T>, { type: 'server', message: detail.message });
    else leftover.push(`${detail.path}: ${detail.message}`);
  }
  return leftover;
}
