import { z } from 'zod';
import { emailSchema, passwordSchema } from './auth';
import { nameSchema } from './records';
import { roleSchema } from './members';
import type { Role } from './gardens';

export const invitationCreateSchema = z.object({ email: emailSchema, role: roleSchema }).strict();
export type InvitationCreateInput = z.infer<typeof invitationCreateSchema>;

/** A new account joins with a name and password; a signed-in member joins with an empty body. */
export const newAccountAcceptSchema = z.object({ name: nameSchema('Your name', 120), password: passwordSchema }).strict();
export type NewAccountAcceptInput = z.infer<typeof newAccountAcceptSchema>;

/** How long an invitation link works. */
export const INVITATION_DAYS = 7;

export interface InvitationDto {
  id: number;
  email: string;
  role: Role;
  invitedBy: string;
  createdAt: string;
  expiresAt: string;
}

export interface InvitationListDto {
  items: InvitationDto[];
}

/** What the link's page shows before anyone joins. */
export interface InvitationPreviewDto {
  garden: { name: string };
  role: Role;
  email: string;
  invitedBy: string;
  expiresAt: string;
  accountExists: boolean;
  signedInMatches: boolean;
}
