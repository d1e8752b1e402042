import { z } from 'zod';
import { idParamSchema } from '#shared/schemas/records';
import { validationError } from '../../errors';

/** Path ids of the garden's records: malformed ones are a 400 naming the parameter, unknown ones a 404 later. */
export function recordId(params: Record<string, unknown>, name: string): number {
  const result = z.strictObject({ [name]: idParamSchema }).safeParse({ [name]: params[name] });
  if (!result.success) throw validationError(result.error, 'params');
  return result.data[name];
}
