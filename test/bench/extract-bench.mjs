// Benchmark of the batch job (not a test): `cliquescape extract` on 1,000 seeded dense similarity
// matrices of 100 nodes with the default features (quantile grid, simplices to dimension 3, H0..H2),
// once with 1 worker and once with 2. Reports graphs per second and the peak memory of the whole process
// (main thread and workers: /usr/bin/time's maximum resident set size), and writes them into a section of
// docs/benchmarks.md (other sections of that file are left as they are). Needs `npm run build` first.
//
//   node test/bench/extract-bench.mjs [--graphs 1000] [--nodes 100] [--workers 1,2] [--no-docs]
//                                     [--also "--quantiles 0.5:0.95"]   one more run (2 workers) with these options
import { readFileSync, rmSync } from "node:fs";
import { cpus, tmpdir, totalmem } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { makeDataset } from "./bench-dataset.mjs";
import { writeDocsSection } from "./docs-section.mjs";
import { optionReader, timedCommand } from "./timed-command.mjs";

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, "..", "..");
const bin = join(root, "packages", "cli", "bin", "cliquescape.js");
const args = process.argv.slice(2);
const option = optionReader(args);
const graphs = Number(option("--graphs", "1000"));
const nodes = Number(option("--nodes", "100"));
const workerCounts = option("--workers", "1,2").split(",").map(Number);
const writeDocs = !args.includes("--no-docs");
const also = option("--also", "--quantiles 0.5:0.95").split(" ").filter(Boolean);

function run(dataset, out, workers, extra = []) {
  rmSync(out, { recursive: true, force: true });
  let measured;
  try {
    measured = timedCommand(
      process.execPath,
      [bin, "extract", dataset, "--out", out, "--workers", String(workers), ...extra],
      `${out}.time`,
    );
  } catch (error) {
    throw new Error(`extract failed with ${workers} worker(s): ${error.message}`);
  }
  const rows = readFileSync(join(out, "features.csv"), "utf8").trimEnd().split("\n").length - 1;
  return {
    workers,
    label: extra.length > 0 ? `${workers}, \`${extra.join(" ")}\`` : String(workers),
    seconds: measured.seconds,
    cpuSeconds: measured.cpuSeconds,
    graphsPerSecond: graphs / measured.seconds,
    peakMiB: measured.peakMiB,
    rows,
    load: measured.load,
  };
}

const base = join(tmpdir(), "cliquescape-extract-bench");
const dataset = join(base, `data-${graphs}x${nodes}`);
console.error(`generating ${graphs} matrices of ${nodes} nodes in ${dataset} (kept for later runs)…`);
makeDataset(dataset, graphs, nodes);
const results = [];
for (const workers of workerCounts) {
  const r = run(join(dataset, "manifest.csv"), join(base, `out-w${workers}`), workers);
  if (r.rows !== graphs) throw new Error(`only ${r.rows} of ${graphs} graphs in the table`);
  console.error(
    `${workers} worker(s): ${r.seconds.toFixed(1)} s, ${r.graphsPerSecond.toFixed(2)} graphs/s, peak ${r.peakMiB.toFixed(0)} MiB`,
  );
  results.push(r);
}
const variant = also.length > 0 ? run(join(dataset, "manifest.csv"), join(base, "out-also"), 2, also) : null;
if (variant)
  console.error(
    `2 workers, ${also.join(" ")}: ${variant.seconds.toFixed(1)} s, CPU ${variant.cpuSeconds.toFixed(1)} s`,
  );
const identical =
  results.length > 1 &&
  results.every(
    (r) =>
      readFileSync(join(base, `out-w${r.workers}`, "features.csv"), "utf8") ===
      readFileSync(join(base, `out-w${results[0].workers}`, "features.csv"), "utf8"),
  );
const one = results.find((r) => r.workers === 1);
const two = results.find((r) => r.workers === 2);
const speedup = one && two ? one.seconds / two.seconds : null;
const spec = JSON.parse(readFileSync(join(base, `out-w${results[0].workers}`, "spec.json"), "utf8"));
const features =
  readFileSync(join(base, `out-w${results[0].workers}`, "features.csv"), "utf8")
    .split("\n")[0]
    .split(",").length - 4;

const section = [
  "<!-- extract-bench:start -->",
  "## Batch job: `cliquescape extract`",
  "",
  `Measured by \`node test/bench/extract-bench.mjs\` on ${new Date().toISOString().slice(0, 10)}: ${graphs} seeded dense similarity`,
  `matrices of ${nodes} nodes (every pair an edge, CSV files, a manifest with two labels), default settings:`,
  `${spec.resolvedGrid.values.length} thresholds between the 5 % and 95 % weight quantiles, simplices to dimension ${spec.complex.topDim},`,
  `homology H0..H${spec.complex.topDim - 1} over Z/${spec.complex.prime} (barcode up to the grid's end), ${features} features per graph, a GNN`,
  "bundle and a barcode per graph. Wall time of the whole command (first pass, all graphs, tables);",
  "CPU time is user + system of the process and peak memory its maximum resident set size (main thread and",
  "workers), both from /usr/bin/time; the 1-minute load average right after each run shows whether other work",
  "shared the CPUs.",
  `Machine: ${cpus().length} × ${cpus()[0]?.model ?? "unknown CPU"}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}.`,
  "",
  "| workers | wall time (s) | graphs/s | CPU time (s) | peak memory (MiB) | load average after |",
  "|---:|---:|---:|---:|---:|---:|",
  ...[...results, ...(variant ? [variant] : [])].map(
    (r) =>
      `| ${r.label} | ${r.seconds.toFixed(1)} | ${r.graphsPerSecond.toFixed(2)} | ${r.cpuSeconds.toFixed(1)} | ${r.peakMiB.toFixed(0)} | ${r.load.toFixed(1)} |`,
  ),
  "",
  speedup === null
    ? ""
    : `Wall-time speed-up with 2 workers: ${speedup.toFixed(2)}× (goal ≥ 1.8×); CPU time ${one.cpuSeconds.toFixed(1)} s with 1 worker, ` +
      `${two.cpuSeconds.toFixed(1)} s with 2 (the parallel overhead); features.csv identical across worker counts: ${identical ? "yes" : "NO"}.`,
  ...(speedup !== null && Math.max(one.load, two.load) > cpus().length
    ? [
        "",
        `The load average above ${cpus().length} says other programs shared the CPUs, unevenly between the runs: the wall times and`,
        "their ratio are then not a measure of scaling. With both CPUs free, 2 workers would take about half the",
        `CPU time (${(two.cpuSeconds / 2).toFixed(0)} s): an estimate from the CPU time, not a measurement.`,
      ]
    : []),
  "<!-- extract-bench:end -->",
].join("\n");
console.log(section);

if (writeDocs) writeDocsSection("extract-bench", section);
