// Benchmark of comparing graphs (not a test), through the command line as a user runs it:
//
// 1. `cliquescape distances`: pairwise 1-Wasserstein and bottleneck distances between the H1 diagrams of
//    200 barcodes of about 300 bars each (complete 90-node graphs with seeded uniform distances: short,
//    clustered bars, many deaths tied at one edge), made by `cliquescape extract` (setup, timed apart);
// 2. `cliquescape nullmodel`: 100 degree-preserving rewiring samples of a 300-node graph (seeded points in
//    the unit square, Gaussian similarity with noise, the strongest 10 % of pairs kept), simplices counted to
//    dimension 3 and Betti numbers H0–H2 at edge density 0.05, Betti-curve areas over 20 thresholds from the
//    strongest edge to that threshold.
//
// Each command runs with 1 and with 2 workers under /usr/bin/time: wall time, CPU time (user + system of
// the whole process, main thread and workers) and peak memory (maximum resident set size). The outputs of
// 1 and 2 workers are compared byte for byte. Writes a section of docs/benchmarks.md (other sections are
// left as they are). Needs `npm run build` first (`npm run bench:compare` does both).
//
//   node test/bench/compare-bench.mjs [--graphs 200] [--nodes 90] [--samples 100] [--workers 1,2]
//                                     [--only distances|nullmodel] [--no-docs]
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { cpus, tmpdir, totalmem } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { densityGrid, fromDenseMatrix } from "../../packages/core/dist/index.js";
import { writeDocsSection } from "./docs-section.mjs";
import { seededRandom } from "./random.mjs";
import { optionReader, timedCommand } from "./timed-command.mjs";

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, "..", "..");
const bin = join(root, "packages", "cli", "bin", "cliquescape.js");
const args = process.argv.slice(2);
const option = optionReader(args);
const graphs = Number(option("--graphs", "200"));
const nodes = Number(option("--nodes", "90"));
const samples = Number(option("--samples", "100"));
const workerCounts = option("--workers", "1,2").split(",").map(Number);
const only = option("--only", "");
const writeDocs = !args.includes("--no-docs");
const NULL_NODES = 300;
const NULL_KEEP = 0.1;
const NULL_DENSITY = 0.05;

const base = join(tmpdir(), "cliquescape-compare-bench");

/** Runs the command line under /usr/bin/time (see timedCommand) and says how it went. */
function timed(label, cliArgs, workers) {
  let measured;
  try {
    measured = timedCommand(process.execPath, [bin, ...cliArgs], join(base, "time.txt"));
  } catch (error) {
    throw new Error(`${label} failed with ${workers} worker(s): ${error.message}`);
  }
  const result = { label, workers, ...measured };
  console.error(
    `${label}, ${workers} worker(s): ${result.seconds.toFixed(1)} s wall, ${result.cpuSeconds.toFixed(1)} s CPU, ` +
      `${result.peakMiB.toFixed(0)} MiB, load ${result.load.toFixed(1)}`,
  );
  return result;
}

/** Complete graphs, every pair an edge with a seeded uniform(0, 1) distance; dense CSV files and a manifest. */
function makeDistanceDataset(dir) {
  const stamp = join(dir, "made.json");
  const wanted = JSON.stringify({ graphs, nodes, version: 1 });
  if (existsSync(stamp) && readFileSync(stamp, "utf8") === wanted) return;
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const lines = ["id,file"];
  for (let g = 0; g < graphs; g++) {
    const random = seededRandom(5000 + g);
    const m = Array.from({ length: nodes }, () => new Array(nodes).fill(0));
    for (let i = 0; i < nodes; i++) for (let j = i + 1; j < nodes; j++) m[i][j] = m[j][i] = random();
    const id = `u${String(g).padStart(3, "0")}`;
    writeFileSync(join(dir, `${id}.csv`), `${m.map((row) => row.join(",")).join("\n")}\n`);
    lines.push(`${id},${id}.csv`);
  }
  writeFileSync(join(dir, "manifest.csv"), `${lines.join("\n")}\n`);
  writeFileSync(stamp, wanted);
}

function distancesBenchmark() {
  const data = join(base, `distance-data-${graphs}x${nodes}`);
  console.error(`generating ${graphs} complete graphs of ${nodes} nodes in ${data} (kept for later runs)…`);
  makeDistanceDataset(data);
  const run = join(base, "distance-run");
  rmSync(run, { recursive: true, force: true });
  const setup = timed(
    "extract (setup: the barcodes)",
    [
      "extract",
      join(data, "manifest.csv"),
      "--out",
      run,
      "--weights",
      "distance",
      "--top-dim",
      "2",
      "--barcode-range",
      "full",
      "--families",
      "betti",
      "--no-bundles",
      "--workers",
      "2",
    ],
    2,
  );
  const bars = readdirSync(join(run, "barcodes")).map(
    (file) =>
      JSON.parse(readFileSync(join(run, "barcodes", file), "utf8")).bars.filter((b) => b.dim === 1).length,
  );
  const meanBars = bars.reduce((a, b) => a + b, 0) / bars.length;
  console.error(
    `${bars.length} barcodes, H1 bars per barcode: mean ${meanBars.toFixed(0)}, ${Math.min(...bars)}–${Math.max(...bars)}`,
  );
  const results = [];
  let identical = true;
  for (const metric of ["wasserstein", "bottleneck"]) {
    const outputs = [];
    for (const workers of workerCounts) {
      const prefix = join(base, `distances-${metric}-w${workers}`);
      const label = metric === "wasserstein" ? "1-Wasserstein" : "bottleneck";
      const r = timed(
        label,
        ["distances", run, "--metric", metric, "--dim", "1", "--workers", String(workers), "--out", prefix],
        workers,
      );
      results.push({ ...r, pairs: (graphs * (graphs - 1)) / 2 });
      outputs.push(readFileSync(`${prefix}.npy`));
    }
    identical &&= outputs.every((bytes) => bytes.equals(outputs[0]));
  }
  return { setup, results, identical, meanBars, minBars: Math.min(...bars), maxBars: Math.max(...bars) };
}

/** The null-model graph: a dense similarity matrix with the strongest NULL_KEEP of pairs kept, as CSV. */
function makeNullGraph(file) {
  const random = seededRandom(300);
  const points = Array.from({ length: NULL_NODES }, () => [random(), random()]);
  const pairs = [];
  for (let i = 0; i < NULL_NODES; i++) {
    for (let j = i + 1; j < NULL_NODES; j++) {
      const dx = points[i][0] - points[j][0];
      const dy = points[i][1] - points[j][1];
      const w = Math.exp(-(dx * dx + dy * dy) / (2 * 0.09)) * (0.85 + 0.3 * random()) + 0.05 * random();
      pairs.push([i, j, Math.round(w * 1e6) / 1e6]);
    }
  }
  pairs.sort((a, b) => b[2] - a[2]);
  const m = Array.from({ length: NULL_NODES }, () => new Array(NULL_NODES).fill(0));
  for (const [i, j, w] of pairs.slice(0, Math.round(NULL_KEEP * pairs.length))) m[i][j] = m[j][i] = w;
  writeFileSync(file, `${m.map((row) => row.join(",")).join("\n")}\n`);
  return m;
}

function nullmodelBenchmark() {
  mkdirSync(base, { recursive: true });
  const file = join(base, `null-graph-${NULL_NODES}.csv`);
  const m = makeNullGraph(file);
  const graph = fromDenseMatrix(
    NULL_NODES,
    m.flat().map((w) => (w === 0 ? Number.NaN : w)),
    { directed: false },
  );
  const edges = graph.targets.length / 2;
  let strongest = -Infinity;
  for (const w of graph.weights) strongest = Math.max(strongest, w);
  const threshold = densityGrid(graph, [NULL_DENSITY], "similarity").thresholds[0];
  const results = workerCounts.map((workers) =>
    timed(
      "rewiring null model",
      [
        "nullmodel",
        file,
        "--model",
        "rewire",
        "--samples",
        String(samples),
        "--density",
        String(NULL_DENSITY),
        "--range",
        `${strongest}:${threshold}`,
        "--steps",
        "20",
        "--top-dim",
        "3",
        "--workers",
        String(workers),
        "--format",
        "json",
      ],
      workers,
    ),
  );
  const identical = results.every((r) => r.stdout.equals(results[0].stdout));
  return { results, edges, threshold, identical, report: JSON.parse(results[0].stdout.toString("utf8")) };
}

const row = (r) =>
  `| ${r.label} | ${r.workers} | ${r.seconds.toFixed(1)} | ${r.cpuSeconds.toFixed(1)} | ${r.peakMiB.toFixed(0)} | ${r.load.toFixed(1)} |`;

mkdirSync(base, { recursive: true });
const distances = only === "nullmodel" ? null : distancesBenchmark();
const nulls = only === "distances" ? null : nullmodelBenchmark();
// The commit measured (the build in packages/*/dist is assumed to be of it).
const commit = (() => {
  try {
    return execFileSync("git", ["rev-parse", "--short", "HEAD"], { cwd: root, encoding: "utf8" }).trim();
  } catch {
    return "unknown";
  }
})();
const crowded = [...(distances?.results ?? []), ...(nulls?.results ?? [])].some(
  (r) => r.load > cpus().length,
);

const lines = [
  "<!-- compare-bench:start -->",
  "## Comparing graphs: `cliquescape distances` and `cliquescape nullmodel`",
  "",
  `Measured by \`npm run bench:compare\` (\`node test/bench/compare-bench.mjs\`) on ${new Date().toISOString().slice(0, 10)}, commit ${commit}, through the`,
  "command line as a user runs it. Wall time of the whole command; CPU time is user + system of the process",
  "(main thread and workers) and peak memory its maximum resident set size, both from /usr/bin/time; the",
  "1-minute load average right after each run shows whether other work shared the CPUs.",
  `Machine: ${cpus().length} × ${cpus()[0]?.model ?? "unknown CPU"}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}; **shared**: other`,
  "engineers' jobs ran on the same two cores during the runs, so wall times and their ratios say little about",
  "scaling; compare CPU times.",
  "",
];
if (distances) {
  const pairs = (graphs * (graphs - 1)) / 2;
  lines.push(
    `**Distances.** ${graphs} barcodes of complete ${nodes}-node graphs with seeded uniform(0, 1) distances (H0–H1 of`,
    `the whole filtration, made by \`extract --weights distance --top-dim 2 --barcode-range full\` in`,
    `${distances.setup.seconds.toFixed(1)} s wall, not counted below): H1 diagrams of ${distances.meanBars.toFixed(0)} bars on average`,
    `(${distances.minBars}–${distances.maxBars}), short and clustered, many dying at the same edge. All ${pairs.toLocaleString("en-US")} pairs,`,
    "`distances RUN --dim 1 --metric wasserstein` (p = 1) and `--metric bottleneck`:",
    "",
    "| distance | workers | wall time (s) | CPU time (s) | peak memory (MiB) | load average after | CPU per pair (ms) |",
    "|---|---:|---:|---:|---:|---:|---:|",
    ...distances.results.map((r) => `${row(r)} ${((1000 * r.cpuSeconds) / pairs).toFixed(1)} |`),
    "",
    `Matrices (.npy) identical with 1 and 2 workers: ${distances.identical ? "yes" : "NO"}.`,
    "",
  );
}
if (nulls) {
  const swaps = nulls.report.swaps;
  lines.push(
    `**Null model.** One graph of ${NULL_NODES} nodes (seeded points in the unit square, Gaussian similarity with noise, the`,
    `strongest ${NULL_KEEP * 100} % of pairs kept: ${nulls.edges.toLocaleString("en-US")} edges). \`nullmodel --model rewire --samples ${samples} --density ${NULL_DENSITY}`,
    "--top-dim 3 --steps 20 --range STRONGEST:THRESHOLD`: each sample is a degree-preserving rewiring (degrees kept at",
    "every grid threshold), then simplices counted to dimension 3 and Betti numbers H0–H2 at density",
    `${NULL_DENSITY} (weight ${nulls.threshold.toPrecision(4)}), and Betti-curve areas over 20 thresholds from the strongest edge to that`,
    `threshold; the observed graph once more. Swaps over all samples: ${swaps.done.toLocaleString("en-US")} done, ${swaps.refused.toLocaleString("en-US")} refused.`,
    "",
    "| run | workers | wall time (s) | CPU time (s) | peak memory (MiB) | load average after | CPU per sample (s) |",
    "|---|---:|---:|---:|---:|---:|---:|",
    ...nulls.results.map((r) => `${row(r)} ${(r.cpuSeconds / (samples + 1)).toFixed(2)} |`),
    "",
    `Reports identical with 1 and 2 workers: ${nulls.identical ? "yes" : "NO"}.`,
    "",
  );
}
if (crowded)
  lines.push(
    `A load average above ${cpus().length} means other programs were running: the second worker then competed with them`,
    "for a core, and the wall time with 2 workers is not a measure of what the machine alone would do.",
    "",
  );
lines.push("<!-- compare-bench:end -->");
const section = lines.join("\n");
console.log(section);

if (writeDocs) writeDocsSection("compare-bench", section);
