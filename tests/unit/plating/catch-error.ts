// Runs fn and returns what it threw; fails the test if it threw nothing.
export function catchError(fn: () => unknown): Error {
  try {
    fn();
  } catch (e) {
    return e as Error;
  }
  throw new Error('expected the call to throw, but it returned normally');
}
