import { tmpdir } from "node:os";
import { join } from "node:path";
import { defineConfig } from "vitest/config";
import base from "./vitest.config.js";

/**
 * The tests a mutation run (npm run mutation, stryker.config.mjs) executes against each mutant: the unit
 * tests of core and io and the reference tests, all of which import the sources. Left out: tests that run
 * the built packages in worker threads or child processes (test/differential, test/cli, test/cluster),
 * which cannot see a mutant in the sources and take minutes; the page in Chromium (test/browser); the
 * viewer's and the CLI's own unit tests, whose sources are not mutated.
 */
// Spread, not mergeConfig: merging would append to the base's include list instead of replacing it.
export default defineConfig({
  ...base,
  test: {
    ...base.test,
    include: [
      "packages/core/src/**/*.test.ts",
      "packages/io/src/**/*.test.ts",
      "test/reference/**/*.test.ts",
    ],
    // `*.large.test.ts`: cases over 2^27 words, seconds here but past the time limit under instrumentation;
    // `npm test` runs them, so the mutants they detect (applied by hand) are still detected by the suite.
    exclude: ["test/reference/viewer-*.test.ts", "**/*.large.test.ts", "**/node_modules/**"],
    setupFiles: ["test/support/fast-check-fixed-seed.ts"],
    // Python's reference answers do not depend on the mutant: asked once, then read back
    // (test/support/python.ts). Outside Stryker's sandbox, so later runs reuse them too.
    env: { CLIQUESCAPE_PYTHON_CACHE: join(tmpdir(), "cliquescape-python-cache") },
  },
});
