// Mutation testing of packages/core and packages/io (StrykerJS): `npm run mutation`, not part of `npm test`.
// How to run one folder or one changed file, and the scores: docs/testing.md.
// Reports go to .stryker/reports/NAME.{html,json}; MUTATION_REPORT=NAME keeps runs of different folders apart.
const report = process.env.MUTATION_REPORT ?? "mutation";

/** @type {import('@stryker-mutator/api/core').PartialStrykerOptions} */
export default {
  testRunner: "vitest",
  vitest: { configFile: "vitest.mutation.config.ts" },
  checkers: ["typescript"],
  // io's project references core, so one checker compiles both packages.
  tsconfigFile: "packages/io/tsconfig.json",
  typescriptChecker: { prioritizePerformanceOverAccuracy: true },
  coverageAnalysis: "perTest",
  mutate: [
    "packages/core/src/**/*.ts",
    "packages/io/src/**/*.ts",
    "!**/*.test.ts",
    "!**/*.fixture.ts",
    "!**/index.ts",
    // generated from packages/core/wasm/count-kernel.ts by npm run build:kernel
    "!packages/core/src/count/wasm/count-kernel-bytes.ts",
  ],
  // The machine's two cores are shared: one test process per core at most.
  concurrency: 2,
  // A wrong field inverse makes the reduction loop forever: such mutants end as timeouts (detected).
  // Each timeout costs timeoutMS + timeoutFactor × the covering tests' time; at 20 s × 3 they took half of a
  // homology run. The baseline is measured in the same run, under the same load.
  timeoutMS: 6000,
  timeoutFactor: 2,
  ignorePatterns: [
    "out",
    "runs",
    ".bench",
    "packages/*/dist",
    "packages/viewer",
    "test/browser",
    "test/bench",
  ],
  tempDirName: ".stryker/tmp",
  incrementalFile: ".stryker/incremental.json",
  reporters: ["clear-text", "progress", "html", "json"],
  htmlReporter: { fileName: `.stryker/reports/${report}.html` },
  jsonReporter: { fileName: `.stryker/reports/${report}.json` },
  clearTextReporter: { allowColor: false, logTests: false },
  thresholds: { high: 90, low: 75, break: null },
};
