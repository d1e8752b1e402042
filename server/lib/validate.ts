import type { z } from 'zod';
import { validationError } from '../errors';

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
