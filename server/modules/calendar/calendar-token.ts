/**
 * Calendar feed tokens: 32 random bytes, base64url. The database keeps the SHA-256 (to find the
 * feed) and the token sealed with AES-256-GCM under a key derived from the session secret (to show
 * the owner their link again). A copy of the table alone opens no feed.
 */
import { createCipheriv, createDecipheriv, createHash, hkdfSync, randomBytes } from 'node:crypto';

const TOKEN = /^[A-Za-z0-9_-]{43}$/;

export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

export function isTokenShape(token: string): boolean {
  return TOKEN.test(token);
}

export function tokenHash(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

function keyOf(secret: string): Buffer {
  return Buffer.from(hkdfSync('sha256', secret, 'heatclock', 'calendar feed token', 32));
}

/** iv (12) + tag (16) + ciphertext, base64url. */
export function sealToken(token: string, secret: string): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', keyOf(secret), iv);
  const body = Buffer.concat([cipher.update(token, 'utf8'), cipher.final()]);
  return Buffer.concat([iv, cipher.getAuthTag(), body]).toString('base64url');
}

/** The token, or null when it was sealed under another secret (or the value is damaged). */
export function openToken(sealed: string, secret: string): string | null {
  try {
    const raw = Buffer.from(sealed, 'base64url');
    const decipher = createDecipheriv('aes-256-gcm', keyOf(secret), raw.subarray(0, 12));
    decipher.setAuthTag(raw.subarray(12, 28));
    const token = Buffer.concat([decipher.update(raw.subarray(28)), decipher.final()]).toString('utf8');
    return isTokenShape(token) ? token : null;
  } catch {
    return null;
  }
}
