/**
 * E-mail preferences per member and garden, the unsubscribe page, the owner's failed-mail view
 * and the local test mailbox. A digest hour is in the garden's own time zone.
 */
import { z } from 'zod';
import { ALERT_TYPES } from './alerts';
import type { AlertType } from './alerts';

export const DELIVERIES = ['immediate', 'digest', 'off'] as const;
export type Delivery = (typeof DELIVERIES)[number];
export const DELIVERY_WORDS: Record<Delivery, string> = {
  immediate: 'Right away, one e-mail per new alert',
  digest: 'A daily summary at the hour I choose',
  off: 'No e-mail',
};
export const DEFAULT_DIGEST_HOUR = 7;

export const notificationPreferenceInputSchema = z.strictObject({
  gardenId: z.number({ error: 'Choose a garden.' }).int().positive(),
  delivery: z.enum(DELIVERIES, { error: 'Delivery must be immediate, digest or off.' }),
  digestHour: z.number({ error: 'The digest hour must be a whole hour from 0 to 23.' }).int().min(0).max(23, 'The digest hour must be a whole hour from 0 to 23.'),
  types: z
    .array(z.enum(ALERT_TYPES, { error: 'Unknown alert type.' }))
    .refine((t) => new Set(t).size === t.length, 'Each alert type can be listed once.'),
});
export type NotificationPreferenceInput = z.infer<typeof notificationPreferenceInputSchema>;

export const notificationPreferencesUpdateSchema = z.strictObject({
  items: z
    .array(notificationPreferenceInputSchema)
    .min(1, 'Send at least one garden.')
    .max(500)
    .refine((items) => new Set(items.map((i) => i.gardenId)).size === items.length, 'Each garden can be listed once.'),
});
export type NotificationPreferencesUpdate = z.infer<typeof notificationPreferencesUpdateSchema>;

export interface NotificationPreferenceDto {
  gardenId: number;
  gardenName: string;
  delivery: Delivery;
  digestHour: number;
  types: AlertType[];
}

export interface NotificationPreferencesDto {
  items: NotificationPreferenceDto[];
}

/** GET /api/unsubscribe/:token — who and what a link is for; the address is partly hidden. */
export interface UnsubscribeInfoDto {
  gardenName: string;
  memberName: string;
  maskedEmail: string;
  delivery: Delivery;
}

export interface FailedMailDto {
  id: number;
  to: string;
  subject: string;
  attempts: number;
  lastError: string | null;
  createdAt: string;
}

export interface CapturedMailDto {
  to: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}
