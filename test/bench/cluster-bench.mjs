// Benchmark of a sharded run through a real Slurm scheduler (not a test; run as root with slurm-wlm and
// munge installed, after `npm run build`): the batch benchmark's dataset (1,000 dense 100-node matrices by
// default) planned once, then run as an array job of 1 shard and of 2 shards (1 CPU each) on a single-node
// cluster with 2 CPUs that this script starts and stops (test/cluster/slurm-cluster.mjs), each followed by
// its dependent merge job. Reports the plan's time, each shard's and the merge's wall and CPU time (user +
// system, /usr/bin/time inside the job), the wall time from submission to the merge's end, and the load
// average; checks that both merged feature tables are identical; writes a section of docs/benchmarks.md.
//
//   node test/bench/cluster-bench.mjs [--graphs 1000] [--nodes 100] [--shards 1,2] [--no-docs]
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync, rmSync } from "node:fs";
import { cpus, loadavg, tmpdir, totalmem } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { missingSlurm, startSlurmCluster } from "../cluster/slurm-cluster.mjs";
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
const shardCounts = option("--shards", "1,2").split(",").map(Number);
const writeDocs = !args.includes("--no-docs");

const missing = missingSlurm();
if (missing) throw new Error(`cannot start a Slurm cluster here: ${missing}`);

const base = join(tmpdir(), "cliquescape-extract-bench");
const dataset = join(base, `data-${graphs}x${nodes}`);
console.error(`dataset: ${graphs} matrices of ${nodes} nodes in ${dataset}`);
makeDataset(dataset, graphs, nodes);
const manifest = join(dataset, "manifest.csv");

const timeOf = (file) => {
  const [seconds, maxRssKiB, user, system] = readFileSync(file, "utf8")
    .trim()
    .split("\n")
    .pop()
    .split(" ")
    .map(Number);
  return { seconds, cpuSeconds: user + system, peakMiB: maxRssKiB / 1024 };
};

const cluster = await startSlurmCluster();
const results = [];
try {
  for (const shards of shardCounts) {
    const out = join(base, `cluster-${shards}`);
    rmSync(out, { recursive: true, force: true });
    const plan = timedCommand(
      process.execPath,
      [bin, "extract", manifest, "--out", out, "--plan", "--workers", "2"],
      `${out}.plan-time`,
    );
    const logs = join(out, "slurm", "logs");
    // Every job runs under /usr/bin/time, writing its own report (the merge has no array task id).
    const command = `/usr/bin/time -f "%e %M %U %S" -o ${logs}/time-\${SLURM_ARRAY_TASK_ID:-merge}.txt ${process.execPath} ${bin}`;
    const script = spawnSync(
      process.execPath,
      [
        bin,
        "cluster-script",
        out,
        "--shards",
        String(shards),
        "--cpus",
        "1",
        "--time",
        "120",
        "--command",
        command,
      ],
      { encoding: "utf8" },
    );
    if (script.status !== 0) throw new Error(`cluster-script failed: ${script.stderr}`);
    const started = Date.now();
    const submit = spawnSync(join(out, "slurm", "submit.sh"), [], { env: cluster.env, encoding: "utf8" });
    if (submit.status !== 0) throw new Error(`submit.sh failed: ${submit.stderr}`);
    const [, shardJob, mergeJob] = /shards job (\d+) .*merge job (\d+)/.exec(submit.stdout);
    await cluster.waitForJobs([shardJob, mergeJob], 4 * 3600_000);
    const wall = (Date.now() - started) / 1000;
    const load = loadavg()[0];
    const state = cluster.jobState(mergeJob);
    if (state !== "COMPLETED") throw new Error(`merge job ${state}\n${cluster.logs()}`);
    const tasks = Array.from({ length: shards }, (_, i) => timeOf(join(logs, `time-${i}.txt`)));
    const merge = timeOf(join(logs, "time-merge.txt"));
    const result = { shards, plan, tasks, merge, wall, load, out };
    console.error(
      `${shards} shard(s): plan ${plan.seconds.toFixed(1)} s; shards ${tasks.map((t) => `${t.seconds.toFixed(1)} s wall / ${t.cpuSeconds.toFixed(1)} s CPU`).join(", ")}; ` +
        `merge ${merge.seconds.toFixed(2)} s; submission to merged ${wall.toFixed(1)} s; load ${load.toFixed(1)}`,
    );
    results.push(result);
  }
} finally {
  await cluster.stop();
  rmSync(cluster.dir, { recursive: true, force: true });
}

const tables = results.map((r) => readFileSync(join(r.out, "features.csv")));
const identical =
  tables.every((t) => t.equals(tables[0])) && results.every((r) => existsSync(join(r.out, "features.npz")));
// The commit by its subject's first words (hashes change with every rebase).
const commit = spawnSync("git", ["log", "-1", "--format=%s"], { cwd: root, encoding: "utf8" })
  .stdout.trim()
  .split(" ")
  .slice(0, 8)
  .join(" ");
const sum = (values) => values.reduce((a, b) => a + b, 0);

const section = [
  "<!-- cluster-bench:start -->",
  "## Sharded runs through Slurm: `extract --plan`, `--shard`, `merge`",
  "",
  `Measured by \`node test/bench/cluster-bench.mjs\` on ${new Date().toISOString().slice(0, 10)} (commit "${commit}…"), as root on a`,
  "single-node Slurm 22.05 cluster (Debian's slurm-wlm) that the script starts on this machine with 2 CPUs: the batch",
  `benchmark's ${graphs} dense ${nodes}-node matrices with default settings, planned once (\`extract --plan\`, 2 worker threads),`,
  "then run by `cluster-script`'s job scripts as an array job of N shards of 1 CPU each and its merge job",
  "(`--dependency=afterok`). Wall and CPU (user + system) times of each job from /usr/bin/time inside the job;",
  '"submitted → merged" is the wall time from `submit.sh` to the merge job\'s end, scheduling included. The',
  "1-minute load average after each run shows how much other work shared the 2 CPUs.",
  `Machine: ${cpus().length} × ${cpus()[0]?.model ?? "unknown CPU"}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}.`,
  "",
  "| shards | plan wall / CPU (s) | each shard wall / CPU (s) | shards' CPU total (s) | merge wall / CPU (s) | submitted → merged (s) | load after |",
  "|---:|---:|---:|---:|---:|---:|---:|",
  ...results.map(
    (r) =>
      `| ${r.shards} | ${r.plan.seconds.toFixed(1)} / ${r.plan.cpuSeconds.toFixed(1)} | ${r.tasks.map((t) => `${t.seconds.toFixed(1)} / ${t.cpuSeconds.toFixed(1)}`).join("; ")} | ` +
      `${sum(r.tasks.map((t) => t.cpuSeconds)).toFixed(1)} | ${r.merge.seconds.toFixed(2)} / ${r.merge.cpuSeconds.toFixed(2)} | ${r.wall.toFixed(1)} | ${r.load.toFixed(1)} |`,
  ),
  "",
  `features.csv identical for ${results.map((r) => r.shards).join(" and ")} shards: ${identical ? "yes" : "NO"}.`,
  ...(results.length === 2
    ? [
        `Submitted → merged: ${(results[0].wall / results[1].wall).toFixed(2)}× faster with ${results[1].shards} shards than with ${results[0].shards}` +
          ` (CPU in the shards ${sum(results[0].tasks.map((t) => t.cpuSeconds)).toFixed(0)} s and ${sum(results[1].tasks.map((t) => t.cpuSeconds)).toFixed(0)} s:` +
          " the split itself adds no work beyond each shard's start-up).",
      ]
    : []),
  ...(Math.max(...results.map((r) => r.load)) > cpus().length
    ? [
        `A load average above ${cpus().length} means other programs shared the CPUs during these runs: each job got only part of`,
        "a CPU (compare its CPU and wall times), so the wall times and their ratio measure the machine's load as much as",
        "the split; the CPU times are the steadier figures.",
      ]
    : []),
  "<!-- cluster-bench:end -->",
].join("\n");
console.log(section);
if (writeDocs) writeDocsSection("cluster-bench", section);
