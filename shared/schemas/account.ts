import { z } from 'zod';
import { emailSchema, passwordSchema } from './auth';
import { nameSchema } from './records';

export const passwordResetRequestSchema = z.object({ email: emailSchema }).strict();
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetSchema = z.object({ password: passwordSchema }).strict();
export type PasswordResetInput = z.infer<typeof passwordResetSchema>;

export const currentPasswordSchema = z
  .string({ error: 'Your current password is required.' })
  .min(1, 'Your current password is required.')
  .max(200, 'Password must be at most 200 characters.');

export const nameChangeSchema = z.object({ name: nameSchema('Your name', 120) }).strict();
export type NameChangeInput = z.infer<typeof nameChangeSchema>;

export const emailChangeSchema = z.object({ email: emailSchema, password: currentPasswordSchema }).strict();
export type EmailChangeInput = z.infer<typeof emailChangeSchema>;

export const passwordChangeSchema = z.object({ currentPassword: currentPasswordSchema, password: passwordSchema }).strict();
export type PasswordChangeInput = z.infer<typeof passwordChangeSchema>;

/** The one answer to every accepted reset request, whether or not the address has an account. */
export interface ResetRequestedDto {
  status: 'check-email';
  message: string;
}

/** A signed-in browser of the account. `id` is derived from the session, never the session's own id. */
export interface AccountSessionDto {
  id: string;
  device: string;
  signedInAt: string | null;
  lastSeenAt: string | null;
  current: boolean;
}
