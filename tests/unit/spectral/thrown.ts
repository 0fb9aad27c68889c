/** A test helper (not a test file): the error a call throws, of the class the test expects. */

/**
 * Calls `fn` and returns the error it throws when that is an instance of `type`; rethrows any other
 * error, and fails when `fn` throws nothing. For checking an error's fields (path, line, reason).
 */
export function thrown<E extends Error>(type: abstract new (...args: never[]) => E, fn: () => unknown): E {
  try {
    fn();
  } catch (e) {
    if (e instanceof type) return e;
    throw e;
  }
  throw new Error(`expected a ${type.name}`);
}
