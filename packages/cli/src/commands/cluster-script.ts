import { chmodSync, mkdirSync } from "node:fs";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { writeFileAtomic } from "@cliquescape/io";
import { Command, Option } from "commander";
import {
  mergeScript,
  type SlurmJob,
  shardsScript,
  shellQuote,
  submitScript,
} from "../cluster/slurm-script.js";
import { runFeatureNames } from "../extract/graph-job.js";
import { validateSpec } from "../extract/load-spec.js";
import { readPlan } from "../extract/plan-file.js";
import { readJson } from "../extract/prepare-run.js";
import { runFolder } from "../extract/run-folder.js";
import type { ResolvedRunSpec } from "../extract/run-spec.js";
import { partitionGraphs } from "../extract/shard-plan.js";
import { positiveInteger, UsageError } from "../options/graph-options.js";

export function clusterScriptCommand(): Command {
  const command = new Command("cluster-script")
    .summary("write Slurm job scripts that run a planned extract as an array job, then merge")
    .description(
      "Writes, into RUN/slurm/, a Slurm batch script for an array job with one task per shard (task I runs " +
        "`extract --shard I/N` with the plan's spec.json), a merge job that starts when every shard has ended " +
        "well (--dependency=afterok), and submit.sh, which submits both (or only the shards you name, to run " +
        "failed ones again). RUN must have been planned with `extract --plan`. Nothing is submitted. See " +
        "docs/cluster.md.",
    )
    .argument("<run-dir>", "a run folder made with extract --plan")
    .requiredOption("--shards <n>", "number of shards (array tasks)", positiveInteger)
    .addOption(
      new Option("--cpus <n>", "CPUs per shard task (its worker threads)")
        .argParser(positiveInteger)
        .default(1),
    )
    .addOption(
      new Option(
        "--mem <size>",
        "memory per shard task, e.g. 3G or 2500M (default: CPUs × (the spec's homology memory + 512 MiB))",
      ).argParser(memoryMiB),
    )
    .addOption(
      new Option("--time <limit>", "time limit per shard task").argParser(slurmTime).default("04:00:00"),
    )
    .addOption(
      new Option(
        "--merge-mem <size>",
        "memory of the merge job (default: from the table size, at least 1G)",
      ).argParser(memoryMiB),
    )
    .addOption(
      new Option("--merge-time <limit>", "time limit of the merge job")
        .argParser(slurmTime)
        .default("01:00:00"),
    )
    .addOption(new Option("--partition <name>", "Slurm partition (default: the cluster's default)"))
    .addOption(new Option("--account <name>", "Slurm account to charge"))
    .addOption(
      new Option("--max-parallel <k>", "run at most k shard tasks at once").argParser(positiveInteger),
    )
    .addOption(
      new Option("--sbatch <option>", "one more #SBATCH line, e.g. --sbatch=--constraint=avx2 (repeatable)")
        .argParser((value: string, previous: string[] = []) => [...previous, value])
        .default([]),
    )
    .addOption(
      new Option("--setup <line>", "a shell line the jobs run first, e.g. 'module load nodejs' (repeatable)")
        .argParser((value: string, previous: string[] = []) => [...previous, value])
        .default([]),
    )
    .addOption(
      new Option(
        "--command <words>",
        "how the compute nodes run cliquescape (default: this node and this cliquescape, by absolute path)",
      ),
    )
    .addHelpText(
      "after",
      `
Examples:
  cliquescape extract cohort.csv --out runs/big --plan --top-dim 3
  cliquescape cluster-script runs/big --shards 50 --cpus 4 --mem 8G --time 02:00:00 --partition short
  runs/big/slurm/submit.sh          # all 50 shards, then the merge
  runs/big/slurm/submit.sh 17       # shard 17 again (it was cancelled), then the merge`,
    )
    .action((runDir: string, options: ClusterScriptOptions) => {
      clusterScript(runDir, options);
    });
  return command;
}

interface ClusterScriptOptions {
  shards: number;
  cpus: number;
  mem?: number;
  time: string;
  mergeMem?: number;
  mergeTime: string;
  partition?: string;
  account?: string;
  maxParallel?: number;
  sbatch: string[];
  setup: string[];
  command?: string;
}

function clusterScript(runDir: string, options: ClusterScriptOptions): void {
  const runRoot = resolve(runDir);
  const plan = readPlan(runRoot);
  const folder = runFolder(runRoot);
  const spec = validateSpec(readJson(folder.spec), folder.spec) as ResolvedRunSpec;
  const graphs = plan.graphs.length;
  if (options.shards > graphs)
    throw new UsageError(
      `--shards ${options.shards}: the plan has only ${graphs} graphs (at most one shard each)`,
    );
  const features = runFeatureNames(spec).length;
  // The merge holds every record (about 24 bytes a value as parsed JSON) and the table (8 bytes a value).
  const tableMiB = Math.ceil((graphs * features * 32) / 2 ** 20);
  const bin = fileURLToPath(new URL("../../bin/cliquescape.js", import.meta.url));
  const job: SlurmJob = {
    runRoot,
    shards: options.shards,
    workingDirectory: plan.workingDirectory,
    command: options.command ?? `${shellQuote(process.execPath)} ${shellQuote(bin)}`,
    setup: options.setup,
    datasetArguments: [
      plan.dataset,
      ...(plan.datasetOptions.labelsFile !== undefined ? ["--labels", plan.datasetOptions.labelsFile] : []),
      ...(plan.datasetOptions.labelsColumn !== undefined
        ? ["--labels-column", plan.datasetOptions.labelsColumn]
        : []),
      ...(plan.datasetOptions.coordinatesFile !== undefined
        ? ["--coordinates", plan.datasetOptions.coordinatesFile]
        : []),
      ...(plan.datasetOptions.variable !== undefined ? ["--variable", plan.datasetOptions.variable] : []),
    ],
    resources: {
      cpus: options.cpus,
      memMiB: options.mem ?? options.cpus * (spec.complex.homologyMemoryMiB + 512),
      time: options.time,
      mergeMemMiB: options.mergeMem ?? Math.max(1024, 512 + tableMiB),
      mergeTime: options.mergeTime,
      ...(options.partition ? { partition: options.partition } : {}),
      ...(options.account ? { account: options.account } : {}),
      ...(options.maxParallel ? { maxParallel: options.maxParallel } : {}),
      sbatchOptions: options.sbatch,
    },
  };
  const dir = join(runRoot, "slurm");
  mkdirSync(join(dir, "logs"), { recursive: true }); // Slurm does not create the folder of --output
  writeFileAtomic(join(dir, "shards.sbatch"), shardsScript(job));
  writeFileAtomic(join(dir, "merge.sbatch"), mergeScript(job));
  writeFileAtomic(join(dir, "submit.sh"), submitScript(job));
  chmodSync(join(dir, "submit.sh"), 0o755);
  const sizes = partitionGraphs(plan.graphs, options.shards).map((p) => p.length);
  const r = job.resources;
  process.stdout.write(
    `wrote ${dir}/shards.sbatch, merge.sbatch and submit.sh\n` +
      `shards: ${options.shards} array tasks (${Math.min(...sizes)}..${Math.max(...sizes)} graphs each, balanced by estimated cost), ` +
      `each ${r.cpus} CPU${r.cpus > 1 ? "s" : ""}, ${r.memMiB} MiB, ${r.time}\n` +
      `merge: 1 CPU, ${r.mergeMemMiB} MiB, ${r.mergeTime}, after every shard has ended well\n` +
      `submit: ${dir}/submit.sh   (a failed shard alone: ${dir}/submit.sh I)\n` +
      `results: ${runRoot}/features.csv, features.npz, errors.csv (after the merge); logs in ${dir}/logs\n`,
  );
}

/** "3G", "2500M", "2500" (MiB) or "1T" → MiB. */
function memoryMiB(text: string): number {
  const match = /^(\d+)([KMGT]?)B?$/i.exec(text.trim());
  if (!match) throw new UsageError(`expected a memory size such as 4G or 2500M, got "${text}"`);
  const value = Number(match[1]);
  const unit = match[2].toUpperCase();
  const mib =
    unit === "K"
      ? Math.ceil(value / 1024)
      : unit === "G"
        ? value * 1024
        : unit === "T"
          ? value * 2 ** 20
          : value;
  if (mib < 1) throw new UsageError(`memory ${text}: at least 1M`);
  return mib;
}

/** Slurm's time formats: minutes, MM:SS, HH:MM:SS, D-HH, D-HH:MM, D-HH:MM:SS. */
function slurmTime(text: string): string {
  if (!/^(\d+-\d{1,2}(:\d{2}){0,2}|\d+(:\d{2}){0,2})$/.test(text.trim()))
    throw new UsageError(`expected a Slurm time limit such as 04:00:00, 90 or 1-12:00:00, got "${text}"`);
  return text.trim();
}
