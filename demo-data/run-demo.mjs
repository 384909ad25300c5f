#!/usr/bin/env node
// README command one (`npm run demo`, after the build): the batch job on the bundled, invented demo
// dataset. Runs `cliquescape extract demo-data/manifest.csv --out out/demo` with the default settings
// (20 thresholds between the 5 % and 95 % weight quantiles of the whole dataset, simplices to dimension 3,
// H0..H2 over Z/2), which ends by printing where the outputs are and the per-label means of a few
// headline features. The folder is made fresh each time so the run shown is always a whole one.
import { spawnSync } from "node:child_process";
import { rmSync } from "node:fs";
import { dirname, join, relative } from "node:path";
import { fileURLToPath } from "node:url";

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, "..");
const out = join(root, "out", "demo");
const bin = join(root, "packages", "cli", "bin", "cliquescape.js");

rmSync(out, { recursive: true, force: true });
const args = [
  "extract",
  relative(process.cwd(), join(here, "manifest.csv")),
  "--out",
  relative(process.cwd(), out),
];
process.stderr.write(`$ cliquescape ${args.join(" ")}\n`);
const run = spawnSync(process.execPath, [bin, ...args], { stdio: "inherit" });
if (run.error) throw run.error;
process.exitCode = run.status ?? 1;
