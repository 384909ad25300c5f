/** The error of class `kind` that `run` throws; fails the test if it throws nothing or something else. */
export function errorOf<E extends Error>(run: () => unknown, kind: abstract new (...args: never[]) => E): E {
  try {
    run();
  } catch (error) {
    if (error instanceof kind) return error;
    throw error;
  }
  throw new Error(`expected a ${kind.name}`);
}
