/**
 * The compiled core (packages/core/dist), for tests that run it outside vitest's module graph (worker
 * threads, child processes). `npm test` builds first; this rebuilds it incrementally when a test is run on
 * its own, so such tests never check stale code.
 */
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));

export const BUILT_CORE_URL = new URL("../../packages/core/dist/index.js", import.meta.url).href;

export function buildCore(): void {
  buildKernel();
  const tsc = fileURLToPath(new URL("../../node_modules/typescript/bin/tsc", import.meta.url));
  const run = spawnSync(process.execPath, [tsc, "-b", "packages/core"], { cwd: ROOT, encoding: "utf8" });
  if (run.status !== 0) throw new Error(`building packages/core failed:\n${run.stdout}${run.stderr}`);
}

/** Regenerates the core's embedded WebAssembly kernel module when its source changed (else a no-op). */
export function buildKernel(): void {
  const script = fileURLToPath(new URL("../../packages/core/wasm/build-kernel.mjs", import.meta.url));
  const run = spawnSync(process.execPath, [script], { cwd: ROOT, encoding: "utf8" });
  if (run.status !== 0) throw new Error(`building the counting kernel failed:\n${run.stdout}${run.stderr}`);
}
