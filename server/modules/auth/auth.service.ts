import type { Sequelize } from 'sequelize';
import { UniqueConstraintError } from 'sequelize';
import type { RegisterInput, LoginInput } from '#shared/schemas/auth';
import { AppError } from '../../errors';
import { Garden, Membership, User } from '../../db/models';
import { equaliseTiming, hashPassword, verifyPassword } from './password';
import { inTransaction } from '../../lib/transaction';

export const INVALID_CREDENTIALS = 'E-mail or password is incorrect.';

export async function registerUser(sequelize: Sequelize, input: RegisterInput) {
  const passwordHash = await hashPassword(input.password);
  try {
    return await inTransaction(sequelize, async (transaction) => {
      const user = await User.create({ email: input.email, name: input.name, passwordHash }, { transaction });
      const garden = await Garden.create({ name: input.gardenName, timeZone: 'UTC', units: 'F' }, { transaction });
      await Membership.create({ userId: user.id, gardenId: garden.id, role: 'owner' }, { transaction });
      return { user, garden };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      throw new AppError(409, 'email_taken', 'An account with this e-mail already exists.', {
        email: 'An account with this e-mail already exists. Sign in instead.',
      });
    }
    throw err;
  }
}

/** Unknown e-mail and wrong password take the same time and give the same answer. */
export async function checkCredentials(input: LoginInput): Promise<User | null> {
  const user = await User.findOne({ where: { email: input.email } });
  if (!user) {
    await equaliseTiming(input.password);
    return null;
  }
  return (await verifyPassword(input.password, user.passwordHash)) ? user : null;
}
