import { QuiescentAssertionError } from '../../src/testing/index.js';

/**
 * The error a failing assertion throws; any other error is rethrown, and an assertion that passes is
 * itself a failure of the test.
 */
export function failure(assertion: () => void): QuiescentAssertionError {
  try {
    assertion();
  } catch (e) {
    if (e instanceof QuiescentAssertionError) return e;
    throw e;
  }
  throw new Error('the assertion passed');
}
