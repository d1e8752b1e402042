import type { Role } from '#shared/schemas/gardens';
import type { MemberDto } from '#shared/schemas/members';
import type { MemberRow } from './members.service';

/**
 * Addresses are shown to owners only: they are the ones who invite and remove people, and
 * growers and viewers have no need to collect the other members' e-mails.
 */
export function presentMember(m: MemberRow, readerRole: Role): MemberDto {
  return { userId: m.userId, name: m.name, email: readerRole === 'owner' ? m.email : null, role: m.role, joinedAt: new Date(m.joinedAt).toISOString() };
}
