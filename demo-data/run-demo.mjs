#!/usr/bin/env node
// README command one (`npm run demo`, after the build): the batch job on the bundled, invented demo
// dataset. Runs `cliquescape extract demo-data/manifest.csv --out out/demo` with the default settings
// (20 thresholds between the 5 % and 95 % weight quantiles of the whole dataset, simplices to dimension 3,
// H0..H2 over Z/2), which ends by printing where the outputs are and the per-label means of a few
// headline features. Then the same from the demo's recordings (time series), into out/demo-recordings.
// Last, the first run as one HTML page (out/demo/report.html), and how to open it. The folders are made
// fresh each time so the runs shown are always whole ones.
import { spawnSync } from "node:child_process";
import { rmSync } from "node:fs";
import { dirname, join, relative } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, "..");
const out = join(root, "out", "demo");
const bin = join(root, "packages", "cli", "bin", "cliquescape.js");

// Two runs: the 36 networks; then 9 invented spike recordings of the same three kinds of culture, from time
// series to features in one command (co-activity by the spike time tiling coefficient, coincidences within
// ±2 bins; weakly negative co-activity is dropped).
const runs = [
  { out, args: ["extract", rel(join(here, "manifest.csv")), "--out", rel(out)] },
  {
    out: join(root, "out", "demo-recordings"),
    args: [
      "extract",
      rel(join(here, "recordings", "manifest.csv")),
      "--out",
      rel(join(root, "out", "demo-recordings")),
      "--measure",
      "coactivity",
      "--window",
      "2",
      "--negatives",
      "drop",
    ],
  },
];
for (const run of runs) {
  rmSync(run.out, { recursive: true, force: true });
  process.stderr.write(`$ cliquescape ${run.args.join(" ")}\n`);
  const child = spawnSync(process.execPath, [bin, ...run.args], { stdio: "inherit" });
  if (child.error) throw child.error;
  if (child.status !== 0) {
    process.exitCode = child.status ?? 1;
    break;
  }
}

if (!process.exitCode) {
  // The run as one page: the table, curves by label and feature map, every graph with its loops.
  const report = join(out, "report.html");
  const args = ["report", rel(out), "--out", rel(report)];
  process.stderr.write(`\n$ cliquescape ${args.join(" ")}\n`);
  const child = spawnSync(process.execPath, [bin, ...args], { stdio: ["ignore", "ignore", "inherit"] });
  if (child.error) throw child.error;
  process.exitCode = child.status ?? 1;
  if (child.status === 0) {
    process.stdout.write(
      `\nSee the demo run: open ${pathToFileURL(report).href} in a browser\n` +
        `(or serve it on this machine: npx cliquescape view ${rel(out)})\n`,
    );
  }
}

function rel(path) {
  return relative(process.cwd(), path);
}
