/**
 * Mutation runs only (vitest.mutation.config.ts): the property tests draw fixed inputs, so that every mutant
 * meets the same tests and a survivor can be re-run. `npm test` keeps fresh seeds to keep exploring.
 */
import fc from "fast-check";

fc.configureGlobal({ seed: 20261202 });
