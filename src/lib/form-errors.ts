import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '@/lib/api-client';

/**
 * Puts each server field message under its own input. Reports how many found a home, and
 * returns the messages that belong to no input on this form so the caller can still show them.
 */
export function applyServerFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: readonly Path<T>[],
): { placed: number; leftover: string[] } {
  if (!(error instanceof ApiError)) return { placed: 0, leftover: [] };
  const leftover: string[] = [];
  let placed = 0;
  for (const [field, message] of Object.entries(error.fields)) {
    const name = fieldNames.find((candidate) => candidate === field);
    if (name) {
      setError(name, { type: 'server', message }, { shouldFocus: placed === 0 });
      placed += 1;
    } else {
      leftover.push(message);
    }
  }
  return { placed, leftover };
}
