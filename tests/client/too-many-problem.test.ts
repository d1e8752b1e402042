import { describe, expect, it } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { tooManyProblem } from '@/lib/problems';

const refused = (message: string, retryAfterSeconds?: number) => new ApiError({ status: 429, code: 'rate_limited', message, retryAfterSeconds });

describe('too many tries, in words', () => {
  it('names what was counted (the form’s words, else the server’s) and the wait; other errors are not its business', () => {
    expect(tooManyProblem(refused('Too many attempts.', 90), 'Too many sign-in attempts')).toBe('Too many sign-in attempts. Please wait 2 minutes, then try again.');
    expect(tooManyProblem(refused('Too many e-mail change requests from your account. Try again in 3600 seconds.', 3600))).toBe(
      'Too many e-mail change requests from your account. Please wait 60 minutes, then try again.',
    );
    expect(tooManyProblem(refused('Slow down'))).toBe('Too many tries. Please wait a few minutes, then try again.');
    expect(tooManyProblem(new ApiError({ status: 400, code: 'validation_failed', message: 'Please check the fields.' }))).toBeNull();
    expect(tooManyProblem(new Error('network'))).toBeNull();
  });
});
