import type { z } from 'zod';
import { AppError, validationError } from '../errors';

export function parseBody<S extends z.ZodType>(schema: S, body: unknown): z.output<S> {
  const result = schema.safeParse(body ?? {});
  if (!result.success) throw validationError(result.error, 'body');
  return result.data;
}

export function parseQuery<S extends z.ZodType>(schema: S, query: unknown): z.output<S> {
  const result = schema.safeParse(query ?? {});
  if (!result.success) throw validationError(result.error, 'query');
  return result.data;
}

export function nothingToChange(): AppError {
  return new AppError(400, 'nothing_to_change', 'There is nothing to change: send at least one field.');
}

/** A PATCH body: parsed like any body, and refused when it names no field at all (an empty change is a mistake, not a success). */
export function parseChange<S extends z.ZodType>(schema: S, body: unknown): z.output<S> {
  const data = parseBody(schema, body);
  if (data && typeof data === 'object' && Object.keys(data).length === 0) throw nothingToChange();
  return data;
}
