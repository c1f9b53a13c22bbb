import { describe, expect, it } from 'vitest';
import { MAIL_MAX_ATTEMPTS, isPermanentSmtpFailure, mailRetryDelaySeconds } from '../../server/modules/mail/mail-retry';

describe('mail retry backoff', () => {
  it('doubles from a minute and stops growing at two hours', () => {
    // common practice: capped exponential backoff
    expect([1, 2, 3, 4, 5, 6, 7, 8, 9].map(mailRetryDelaySeconds)).toEqual([60, 120, 240, 480, 960, 1920, 3840, 7200, 7200]);
  });

  it('keeps trying for most of a day before giving up', () => {
    const total = Array.from({ length: MAIL_MAX_ATTEMPTS - 1 }, (_, i) => mailRetryDelaySeconds(i + 1)).reduce((a, b) => a + b, 0);
    expect(total / 3600).toBeGreaterThan(12);
    expect(total / 3600).toBeLessThan(24);
  });

  it('treats SMTP 5xx answers as permanent and 4xx or network errors as passing', () => {
    // Source: RFC 5321, section 4.2.1 (5yz permanent negative completion reply, 4yz transient)
    expect(isPermanentSmtpFailure({ responseCode: 550 })).toBe(true);
    expect(isPermanentSmtpFailure({ responseCode: 451 })).toBe(false);
    expect(isPermanentSmtpFailure({ code: 'ECONNREFUSED' })).toBe(false);
    expect(isPermanentSmtpFailure(null)).toBe(false);
  });
});
