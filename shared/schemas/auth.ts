import { z } from 'zod';
import { nameSchema } from './records';

export const emailSchema = z
  .string({ error: 'E-mail is required.' })
  .trim()
  .toLowerCase()
  .min(1, 'E-mail is required.')
  .max(254, 'E-mail must be at most 254 characters.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.org.' }));

export const passwordSchema = z
  .string({ error: 'Password is required.' })
  .min(10, 'Password must be at least 10 characters.')
  .max(200, 'Password must be at most 200 characters.');

export const loginSchema = z
  .object({
    email: emailSchema,
    password: z.string({ error: 'Password is required.' }).min(1, 'Password is required.').max(200),
  })
  .strict();
export type LoginInput = z.infer<typeof loginSchema>;

export const registerSchema = z
  .object({
    email: emailSchema,
    password: passwordSchema,
    name: nameSchema('Your name', 120),
    gardenName: nameSchema('Garden name', 120),
  })
  .strict();
export type RegisterInput = z.infer<typeof registerSchema>;

export interface UserDto {
  id: number;
  email: string;
  name: string;
}
