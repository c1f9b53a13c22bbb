import { afterEach, beforeEach, vi, type MockInstance } from 'vitest';

// A console.error during a test is a bug somewhere (React warnings, unhandled failures): fail the test on it.
let spy: MockInstance<typeof console.error>;
beforeEach(() => {
  spy = vi.spyOn(console, 'error');
});
afterEach(() => {
  const calls = spy.mock.calls;
  spy.mockRestore();
  if (calls.length) throw new Error(`console.error was called:\n${calls.map((c) => c.map(String).join(' ')).join('\n')}`);
});
