/**
 * Catching the library's errors in tests: the thrown QuiescentError itself, or a check of its code
 * and of a name its message must mention.
 */
import { expect } from 'vitest';
import { QuiescentError } from '../../src/index.js';

/**
 * The QuiescentError `run` throws; any other outcome fails the test.
 *
 * @param run - the call expected to throw
 * @returns the error, for checks on its code and details
 */
export function thrown(run: () => unknown): QuiescentError {
  try {
    run();
  } catch (e) {
    if (e instanceof QuiescentError) return e;
    throw e;
  }
  throw new Error('expected a QuiescentError');
}

/**
 * Check that `run` throws a QuiescentError with `code` whose message contains `mentions`.
 *
 * @param run - the call expected to throw
 * @param code - the expected error code
 * @param mentions - text the message must contain (an element or node name, an option)
 */
export function expectQuiescentError(run: () => unknown, code: string, mentions: string): void {
  let caught: unknown;
  try {
    run();
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(QuiescentError);
  expect((caught as QuiescentError).code).toBe(code);
  expect((caught as QuiescentError).message).toContain(mentions);
}
