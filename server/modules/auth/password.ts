import { randomBytes, scrypt as scryptCb, timingSafeEqual } from 'node:crypto';
import type { ScryptOptions } from 'node:crypto';
import { Bounded } from '../../lib/bounded';

// OWASP Password Storage Cheat Sheet lists scrypt N=2^15, r=8, p=3 as a minimum configuration.
const PARAMS = { N: 2 ** 15, r: 8, p: 3 };
const KEYLEN = 64;

/**
 * scrypt runs on libuv's thread pool (4 threads by default), shared with file reads (photos,
 * static files) and DNS. At most 2 hashes at once leaves the other threads free; 16 more wait,
 * so a normal sign-in behind a flood waits for at most 8 hashes' time (about 1 s), and a flood
 * beyond that is answered 503 at once.
 */
const HASH_CONCURRENCY = 2;
export const hashing = new Bounded(HASH_CONCURRENCY, 16, 'sign-ins and sign-ups');

function scrypt(password: string, salt: Buffer, opts: ScryptOptions): Promise<Buffer> {
  return hashing.run(() => scryptNow(password, salt, opts));
}

function scryptNow(password: string, salt: Buffer, opts: ScryptOptions): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    scryptCb(password.normalize('NFKC'), salt, KEYLEN, { ...opts, maxmem: 128 * opts.N! * opts.r! * 2 }, (err, key) =>
      err ? reject(err) : resolve(key),
    ),
  );
}

/** Format: scrypt$N$r$p$salt$hash (base64), so parameters can be raised later without breaking old hashes. */
export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const key = await scrypt(password, salt, PARAMS);
  return ['scrypt', PARAMS.N, PARAMS.r, PARAMS.p, salt.toString('base64'), key.toString('base64')].join('$');
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [kind, n, r, p, salt, hash] = stored.split('$');
  if (kind !== 'scrypt' || !salt || !hash) return false;
  const expected = Buffer.from(hash, 'base64');
  const key = await scrypt(password, Buffer.from(salt, 'base64'), { N: Number(n), r: Number(r), p: Number(p) });
  return key.length === expected.length && timingSafeEqual(key, expected);
}

/** Spent on unknown e-mails so they take as long as a wrong password. */
let dummyHash: Promise<string> | null = null;
export function equaliseTiming(password: string): Promise<boolean> {
  // Made once outside the hashing queue, so a busy moment can never leave a refused promise here.
  dummyHash ??= dummyOf('heatclock-timing-equaliser');
  return dummyHash.then((h) => verifyPassword(password, h)).then(() => false);
}

async function dummyOf(password: string): Promise<string> {
  const salt = randomBytes(16);
  const key = await scryptNow(password, salt, PARAMS);
  return ['scrypt', PARAMS.N, PARAMS.r, PARAMS.p, salt.toString('base64'), key.toString('base64')].join('$');
}

export function hashParams(stored: string): { N: number; r: number; p: number } {
  const [, n, r, p] = stored.split('$');
  return { N: Number(n), r: Number(r), p: Number(p) };
}
