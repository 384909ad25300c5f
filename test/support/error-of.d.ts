/** The error of class `kind` that `run` throws; fails the test if it throws nothing or something else. */
export declare function errorOf<E extends Error>(run: () => unknown, kind: abstract new (...args: never[]) => E): E;
//# sourceMappingURL=error-of.d.ts.map