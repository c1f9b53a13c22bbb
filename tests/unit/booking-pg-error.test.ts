import { describe, expect, it } from 'vitest';
import { isDeadlock, isExclusionViolation } from '../../server/modules/bookings/pg-error';

// SQLSTATEs from the PostgreSQL documentation, Appendix A "PostgreSQL Error Codes": 23P01 exclusion_violation,
// 40P01 deadlock_detected. Drizzle wraps the driver's error, so the code may sit on a `cause`.
describe('booking write errors', () => {
  it('finds the SQLSTATE on the error or on its causes', () => {
    expect(isExclusionViolation({ code: '23P01' })).toBe(true);
    expect(isExclusionViolation(new Error('Failed query', { cause: { code: '23P01' } }))).toBe(true);
    expect(isDeadlock(new Error('Failed query', { cause: new Error('x', { cause: { code: '40P01' } }) }))).toBe(true);
    expect(isDeadlock({ code: '23P01' })).toBe(false);
    expect(isExclusionViolation({ code: '40P01' })).toBe(false);
    expect(isExclusionViolation(null)).toBe(false);
  });
});
