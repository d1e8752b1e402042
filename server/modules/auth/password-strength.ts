/**
 * New passwords are checked against a strength estimator with common-password and English word
 * lists (zxcvbn-ts), beyond the length rule in shared/schemas/auth.ts (at least 10 characters,
 * OWASP ASVS 5.0 V6.2). Guesses that a throttled online attacker could make are refused: score 3
 * ("safely unguessable: moderate protection from offline slow-hash scenario") is the least
 * accepted, as zxcvbn's authors suggest for sign-up forms. Registration, and later password
 * reset and change, all call this one function.
 */
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary as common } from '@zxcvbn-ts/language-common';
import { dictionary as english, translations } from '@zxcvbn-ts/language-en';
import { AppError } from '../../errors';

export const MIN_SCORE = 3;

/** Words of the product itself: a password made of them is guessed first. The demo's published password is one. */
const PRODUCT_WORDS = ['heatclock', 'heatclock-demo', 'hollowbrook', 'garden', 'seed', 'planting'];

let factory: ZxcvbnFactory | null = null;
function estimator(): ZxcvbnFactory {
  factory ??= new ZxcvbnFactory({
    dictionary: { ...common, ...english },
    graphs: adjacencyGraphs,
    translations,
    // Bounded work per check (it runs on the event loop): fewer l33t combinations, the first 100 characters.
    l33tMaxSubstitutions: 12,
    maxLength: 100,
  });
  return factory;
}

export interface StrengthContext {
  email?: string;
  name?: string;
  gardenName?: string;
}

/** null when strong enough, else the words to show under the password field. */
export function passwordWeakness(password: string, ctx: StrengthContext = {}): string | null {
  const inputs = [...PRODUCT_WORDS, ctx.email, ctx.email?.split('@')[0], ctx.name, ctx.gardenName].filter((x): x is string => !!x);
  const result = estimator().check(password, inputs);
  if (result.score >= MIN_SCORE) return null;
  const why = result.feedback.warning ? `${result.feedback.warning.replace(/\.?$/, '.')} ` : '';
  return `This password is too easy to guess. ${why}Try four or five unrelated words, or a longer phrase only you would know.`;
}

/** Throws a 400 naming the field when the password is too weak. */
export function assertStrongPassword(password: string, ctx: StrengthContext = {}, field = 'password'): void {
  const weakness = passwordWeakness(password, ctx);
  if (weakness) throw new AppError(400, 'validation_failed', `Please check the fields: ${field}.`, { [field]: weakness });
}
