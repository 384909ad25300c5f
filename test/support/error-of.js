/** The error of class `kind` that `run` throws; fails the test if it throws nothing or something else. */
export function errorOf(run, kind) {
    try {
        run();
    }
    catch (error) {
        if (error instanceof kind)
            return error;
        throw error;
    }
    throw new Error(`expected a ${kind.name}`);
}
//# sourceMappingURL=error-of.js.map