import { afterAll, beforeAll, vi } from 'vitest';

/**
 * Runs a test file as if the clocks read `at`, still ticking: only `Date` is faked, so timers, pg and supertest keep
 * real time. Call it at the top of the file, before any hook that writes data. The database's own now() is not
 * moved: compare with dates the app works out in JavaScript (the company's today), never with the server's clock.
 */
export function runFileAt(at: string) {
  beforeAll(() => {
    vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true, now: new Date(at) });
  });
  afterAll(() => {
    vi.useRealTimers();
  });
}
