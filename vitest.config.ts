import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";
import { PythonSkipsReporter } from "./test/support/python-skips-reporter.js";

const src = (pkg: string) => fileURLToPath(new URL(`./packages/${pkg}/src/index.ts`, import.meta.url));

// Test files log the Python modules they miss here; the last reporter names the skipped checks.
const pythonSkips = join(tmpdir(), `cliquescape-python-skips-${process.pid}.jsonl`);

// Tests import the packages by name; point those names at the sources so no build is needed to test.
export default defineConfig({
  resolve: {
    alias: {
      "@cliquescape/core": src("core"),
      // Before the package name, which would otherwise match the subpath as a prefix.
      "@cliquescape/io/browser": fileURLToPath(new URL("./packages/io/src/browser.ts", import.meta.url)),
      "@cliquescape/io": src("io"),
    },
  },
  test: {
    include: ["packages/*/src/**/*.test.ts", "test/**/*.test.ts"],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: "forks",
    env: { CLIQUESCAPE_PYTHON_SKIPS: pythonSkips },
    reporters: ["default", new PythonSkipsReporter(pythonSkips)],
    // the core imports the generated WebAssembly kernel module: rebuild it first if its source changed
    globalSetup: ["test/support/kernel-setup.ts"],
  },
});
