import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const src = (pkg: string) => fileURLToPath(new URL(`./packages/${pkg}/src/index.ts`, import.meta.url));

// Tests import the packages by name; point those names at the sources so no build is needed to test.
export default defineConfig({
  resolve: {
    alias: {
      "@cliquescape/core": src("core"),
      "@cliquescape/io": src("io"),
    },
  },
  test: {
    include: ["packages/*/src/**/*.test.ts", "test/**/*.test.ts"],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: "forks",
  },
});
