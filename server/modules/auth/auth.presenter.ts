import type { UserDto } from '#shared/schemas/auth';
import type { User } from '../../db/models';

export function presentUser(user: Pick<User, 'id' | 'email' | 'name'>): UserDto {
  return { id: user.id, email: user.email, name: user.name };
}
