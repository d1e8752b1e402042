import { z } from 'zod';
import { ROLES } from './gardens';
import type { Role } from './gardens';

export const roleSchema = z.enum(ROLES, { error: 'Role must be owner, grower or viewer.' });

export const memberRoleChangeSchema = z.object({ role: roleSchema }).strict();
export type MemberRoleChangeInput = z.infer<typeof memberRoleChangeSchema>;

export interface MemberDto {
  userId: number;
  name: string;
  /** Shown to the garden's owners only (they manage who is in); null for everyone else. */
  email: string | null;
  role: Role;
  joinedAt: string;
}

export interface MemberListDto {
  items: MemberDto[];
}

export const ROLE_LABELS: Record<Role, string> = { owner: 'Owner', grower: 'Grower', viewer: 'Viewer' };

/** "an owner", "a grower": the role inside a sentence. */
export const A_ROLE: Record<Role, string> = { owner: 'an owner', grower: 'a grower', viewer: 'a viewer' };

/** What each role may do, in the words the pages and the invitation use. */
export const ROLE_MEANINGS: Record<Role, string> = {
  owner: 'changes the garden’s settings, invites people and sets their roles',
  grower: 'adds and changes plantings, varieties, beds and seed lots',
  viewer: 'looks at everything but changes nothing',
};
