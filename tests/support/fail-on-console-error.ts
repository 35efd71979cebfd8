import { afterEach, vi } from 'vitest';

/** A console.error during a test is a bug the test did not look for: fail the test. */
const spy = vi.spyOn(console, 'error');
afterEach(() => {
  const calls = spy.mock.calls.map((args) => args.map(String).join(' '));
  spy.mockClear();
  if (calls.length) throw new Error(`console.error was called during the test:\n${calls.join('\n')}`);
});
