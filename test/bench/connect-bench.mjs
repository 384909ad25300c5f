import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { cpus, tmpdir, totalmem } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { encodeNpy } from "../../packages/io/dist/index.js";
import { writeDocsSection } from "./docs-section.mjs";
import { seededRandom } from "./random.mjs";
import { optionReader, timedCommand } from "./timed-command.mjs";

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, "..", "..");
const bin = join(root, "packages", "cli", "bin", "cliquescape.js");
const python = process.env.PYTHON ?? "/usr/bin/python3";
const args = process.argv.slice(2);
const option = optionReader(args);
const subjects = Number(option("--subjects", "500"));
const channels = Number(option("--channels", "200"));
const timePoints = Number(option("--time", "1200"));
const writeDocs = !args.includes("--no-docs");
const LATENT = 6;

/**
 * One recording: every channel mixes six shared latent AR(1) signals (coefficient 0.7) with its own
 * loadings, plus its own white noise, so the channels correlate as regions of one brain would.
 */
function recording(seed) {
  const random = seededRandom(seed);
  const normal = () => Math.sqrt(-2 * Math.log(random())) * Math.cos(2 * Math.PI * random());
  const latent = new Float64Array(LATENT * timePoints);
  for (let k = 0; k < LATENT; k++) {
    let x = 0;
    for (let t = 0; t < timePoints; t++) latent[k * timePoints + t] = x = 0.7 * x + normal();
  }
  const values = new Float64Array(timePoints * channels);
  const loading = new Float64Array(LATENT);
  for (let c = 0; c < channels; c++) {
    for (let k = 0; k < LATENT; k++) loading[k] = normal() * 0.6;
    for (let t = 0; t < timePoints; t++) {
      let x = normal();
      for (let k = 0; k < LATENT; k++) x += loading[k] * latent[k * timePoints + t];
      values[t * channels + c] = x;
    }
  }
  return values;
}

function makeDataset(dir) {
  const stamp = join(dir, "made.json");
  const wanted = JSON.stringify({ subjects, channels, timePoints, version: 1 });
  if (existsSync(stamp) && readFileSync(stamp, "utf8") === wanted) return;
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(join(dir, "recordings"), { recursive: true });
  for (let s = 0; s < subjects; s++) {
    const name = `sub-${String(s).padStart(4, "0")}.npy`;
    writeFileSync(join(dir, "recordings", name), encodeNpy(recording(7000 + s), [timePoints, channels]));
  }
  writeFileSync(stamp, wanted);
}

/** Runs a command under /usr/bin/time (see timedCommand), its stdout as text. */
function timed(command, commandArgs, env = {}) {
  const measured = timedCommand(command, commandArgs, join(base, "time.txt"), env);
  return { ...measured, stdout: measured.stdout.toString("utf8") };
}

const base = join(tmpdir(), "cliquescape-connect-bench");
const dataset = join(base, `data-${subjects}x${channels}x${timePoints}`);
console.error(
  `generating ${subjects} recordings of ${timePoints} × ${channels} in ${dataset} (kept for later runs)…`,
);
makeDataset(dataset);
const folder = join(dataset, "recordings");
const rows = [];
for (const measure of ["pearson", "partial"]) {
  // Interleaved, so that a change in the machine's load hits both sides alike.
  for (const workers of [1, 2]) {
    const out = join(base, `out-${measure}-w${workers}`);
    rmSync(out, { recursive: true, force: true });
    const ours = timed(process.execPath, [
      bin,
      "connect",
      folder,
      "--out",
      out,
      "--measure",
      measure,
      "--workers",
      String(workers),
    ]);
    const numpyOut = join(base, `numpy-${measure}-t${workers}.npy`);
    const theirs = timed(
      python,
      [join(here, "connect_numpy.py"), folder, measure, numpyOut, join(out, "matrices.npy")],
      {
        OPENBLAS_NUM_THREADS: String(workers),
      },
    );
    const difference = Number(theirs.stdout.trim());
    console.error(
      `${measure}, ${workers}: cliquescape ${ours.seconds.toFixed(1)} s (CPU ${ours.cpuSeconds.toFixed(1)}), numpy ${theirs.seconds.toFixed(1)} s (CPU ${theirs.cpuSeconds.toFixed(1)}); largest difference ${difference}`,
    );
    rows.push({ measure, workers, ours, theirs, difference });
    rmSync(numpyOut, { force: true });
  }
}

const f1 = (x) => x.toFixed(1);
const section = [
  "<!-- connect-bench:start -->",
  "## Connectivity matrices: `cliquescape connect`",
  "",
  `Measured by \`node test/bench/connect-bench.mjs\` on ${new Date().toISOString().slice(0, 10)}: ${subjects} seeded recordings of`,
  `${timePoints} time points × ${channels} channels (float64 .npy files, time × channels, ${((subjects * timePoints * channels * 8) / 2 ** 20).toFixed(0)} MiB in all) to one`,
  `(${subjects}, ${channels}, ${channels}) stack of Pearson correlations, and of partial correlations from the Ledoit–Wolf`,
  "shrinkage covariance. Against numpy on the same files in the same run (`test/bench/connect_numpy.py`):",
  "`numpy.corrcoef`, and `sklearn.covariance.LedoitWolf().precision_` normalised, each stack saved with `numpy.save`;",
  "numpy's OpenBLAS on as many threads as cliquescape has workers (`OPENBLAS_NUM_THREADS`). Wall time of the whole",
  "command (start-up, reading, computing, writing); CPU time is user + system and peak memory the maximum resident",
  "set size, from /usr/bin/time; the 1-minute load average after each run shows how much other work shared the",
  `machine. **The machine was shared** with other engineers' jobs (${cpus().length} cores), so wall times vary`,
  "between runs; CPU times and the ratios measured in the same run say more.",
  `Machine: ${cpus().length} × ${cpus()[0]?.model ?? "unknown CPU"}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}.`,
  "",
  "| measure | workers / BLAS threads | cliquescape wall (s) | CPU (s) | peak (MiB) | numpy wall (s) | CPU (s) | peak (MiB) | wall ratio | CPU ratio | load after | largest difference |",
  "|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|",
  ...rows.map(
    (r) =>
      `| ${r.measure} | ${r.workers} | ${f1(r.ours.seconds)} | ${f1(r.ours.cpuSeconds)} | ${r.ours.peakMiB.toFixed(0)} | ${f1(r.theirs.seconds)} | ${f1(r.theirs.cpuSeconds)} | ${r.theirs.peakMiB.toFixed(0)} | ${(r.ours.seconds / r.theirs.seconds).toFixed(2)} | ${(r.ours.cpuSeconds / r.theirs.cpuSeconds).toFixed(2)} | ${r.ours.load.toFixed(1)} | ${r.difference.toExponential(1)} |`,
  ),
  "",
  "Ratios are cliquescape ÷ numpy (above 1: cliquescape slower). Largest difference: between the two stacks,",
  "over every entry of every matrix.",
  "<!-- connect-bench:end -->",
].join("\n");
console.log(section);

if (writeDocs) writeDocsSection("connect-bench", section);
