import { describe, expect, it } from 'vitest';
import { decideAttempt, lockSecondsAfter, SIGN_IN_FREE_ATTEMPTS, type ThrottleState } from '../../server/auth/sign-in-throttle';
import { passwordProblem } from '../../server/auth/password-policy';
import { DEMO_PASSWORD } from '../../server/db/seed/demo-accounts';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';

describe('per-address sign-in backoff', () => {
  // common practice: exponential lockout backoff (OWASP Authentication Cheat Sheet, "Account Lockout")
  it('allows five attempts, then locks for one minute, doubling to an hour', () => {
    expect(SIGN_IN_FREE_ATTEMPTS).toBe(5);
    expect([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 30].map(lockSecondsAfter)).toEqual([0, 0, 0, 0, 60, 120, 240, 480, 960, 1920, 3600, 3600]);
  });

  it('refuses while locked, saying how long is left, and counts again once the lock is over', () => {
    const at = new Date('2026-03-02T10:00:00Z');
    const state: ThrottleState = { attempts: 5, lastAttemptAt: at, lockedUntil: new Date('2026-03-02T10:01:00Z') };
    expect(decideAttempt(state, new Date('2026-03-02T10:00:30Z'))).toEqual({ allowed: false, retryAfterSeconds: 30 });
    expect(decideAttempt(state, new Date('2026-03-02T10:01:00Z'))).toEqual({
      allowed: true,
      next: { attempts: 6, lastAttemptAt: new Date('2026-03-02T10:01:00Z'), lockedUntil: new Date('2026-03-02T10:03:00Z') },
    });
  });

  it('starts the count again after a quiet day', () => {
    const state: ThrottleState = { attempts: 9, lastAttemptAt: new Date('2026-03-01T09:00:00Z'), lockedUntil: new Date('2026-03-01T09:16:00Z') };
    expect(decideAttempt(state, new Date('2026-03-02T09:00:01Z'))).toEqual({
      allowed: true,
      next: { attempts: 1, lastAttemptAt: new Date('2026-03-02T09:00:01Z'), lockedUntil: null },
    });
  });
});

describe('password policy', () => {
  // Source: OWASP ASVS 5.0.0, V6.2.1 (length), V6.2.4 (common passwords), V6.2.5 (no composition rules), V6.2.9 (64+ allowed)
  it('refuses short and common passwords and takes long ones of any composition', async () => {
    expect(await passwordProblem('1234567890')).toMatch(/at least 12 characters/);
    expect(await passwordProblem('password1234')).toMatch(/most common passwords/);
    expect(await passwordProblem('PASSWORD1234')).toMatch(/most common passwords/);
    expect(await passwordProblem('qwertyuiop12')).toMatch(/most common passwords/);
    expect(await passwordProblem('brass valve under the stairs')).toBeNull();
    expect(await passwordProblem('all lower case and no digits at all')).toBeNull();
    expect(await passwordProblem('ü'.repeat(64))).toBeNull();
    expect(await passwordProblem('x'.repeat(129))).toMatch(/at most 128/);
  });

  it('lets the demo and test passwords through, so the seed and the tests can sign in', async () => {
    expect(await passwordProblem(DEMO_PASSWORD)).toBeNull();
    expect(await passwordProblem(DEFAULT_TEST_PASSWORD)).toBeNull();
  });
});
