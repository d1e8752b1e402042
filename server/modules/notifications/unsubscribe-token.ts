import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';

/**
 * An unsubscribe link is `<userId>.<gardenId>.<nonce>.<mac>`, the MAC an HMAC-SHA256 over the
 * first three parts. The nonce is stored on the member's preference row and replaced when the
 * link is used, so a link acts once and only for the member and garden it names.
 */
export interface UnsubscribeClaim {
  userId: number;
  gardenId: number;
  nonce: string;
}

export const newNonce = () => randomBytes(16).toString('base64url');

const mac = (key: Buffer, payload: string) => createHmac('sha256', key).update(payload).digest();

export function signUnsubscribe(key: Buffer, c: UnsubscribeClaim): string {
  const payload = `${c.userId}.${c.gardenId}.${c.nonce}`;
  return `${payload}.${mac(key, payload).toString('base64url')}`;
}

/** null for anything not made by signUnsubscribe with this key. */
export function verifyUnsubscribe(key: Buffer, token: string): UnsubscribeClaim | null {
  const m = /^([1-9]\d{0,9})\.([1-9]\d{0,9})\.([A-Za-z0-9_-]{22})\.([A-Za-z0-9_-]{43})$/.exec(token);
  if (!m) return null;
  const given = Buffer.from(m[4], 'base64url');
  const expected = mac(key, `${m[1]}.${m[2]}.${m[3]}`);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  return { userId: Number(m[1]), gardenId: Number(m[2]), nonce: m[3] };
}
