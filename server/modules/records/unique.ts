import { ForeignKeyConstraintError, UniqueConstraintError } from 'sequelize';
import { AppError } from '../../errors';

/** Turns a natural-key clash into a 409 the grower can act on. */
export async function uniqueOr409<T>(work: () => Promise<T>, message: string, field?: string): Promise<T> {
  try {
    return await work();
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw new AppError(409, 'conflict', message, field ? { [field]: message } : undefined);
    throw err;
  }
}

/** A delete that lost a race to a new reference (the foreign key refuses it) is the same 409 as the count check. */
export async function unreferencedOr409<T>(work: () => Promise<T>, message: string): Promise<T> {
  try {
    return await work();
  } catch (err) {
    if (err instanceof ForeignKeyConstraintError) throw new AppError(409, 'in_use', message);
    throw err;
  }
}
