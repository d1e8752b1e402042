import type { LoginInput } from '#shared/schemas/auth';
import { User } from '../../db/models';
import { equaliseTiming, verifyPassword } from './password';

export const INVALID_CREDENTIALS = 'E-mail or password is incorrect.';

/** Unknown e-mail and wrong password take the same time and give the same answer. */
export async function checkCredentials(input: LoginInput): Promise<User | null> {
  const user = await User.findOne({ where: { email: input.email } });
  if (!user) {
    await equaliseTiming(input.password);
    return null;
  }
  return (await verifyPassword(input.password, user.passwordHash)) ? user : null;
}
