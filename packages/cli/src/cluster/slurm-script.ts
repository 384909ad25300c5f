/**
 * The Slurm job scripts of a planned run, as text: an array job with one task per shard, a merge job that
 * runs once every shard has ended well (`--dependency=afterok`), and a submit helper. Pure functions: the
 * command writes the files.
 */

export interface SlurmResources {
  /** CPUs per shard task (the shard runs that many worker threads). */
  cpus: number;
  /** Memory per shard task, in MiB. */
  memMiB: number;
  /** Wall-time limit per shard task, in Slurm's format (e.g. 04:00:00, 1-00:00:00). */
  time: string;
  mergeMemMiB: number;
  mergeTime: string;
  partition?: string;
  account?: string;
  /** At most this many shard tasks at once (Slurm's `%` array throttle). */
  maxParallel?: number;
  /** More `#SBATCH` options, as written after `#SBATCH ` (e.g. `--constraint=avx2`). */
  sbatchOptions: readonly string[];
}

export interface SlurmJob {
  /** Absolute run folder. */
  runRoot: string;
  shards: number;
  /** The folder the plan was made in: the jobs run there, so the dataset path means the same. */
  workingDirectory: string;
  /** How to run cliquescape on the compute nodes, as shell words already quoted. */
  command: string;
  /** Shell lines run before the command (e.g. `module load nodejs`). */
  setup: readonly string[];
  /** `extract`'s dataset argument and dataset options, unquoted. */
  datasetArguments: readonly string[];
  resources: SlurmResources;
}

/** A word for a POSIX shell, single-quoted unless it is plainly safe. */
export function shellQuote(word: string): string {
  if (/^[A-Za-z0-9_./:=@%+,-]+$/.test(word)) return word;
  return `'${word.replace(/'/g, `'\\''`)}'`;
}

function header(job: SlurmJob, name: string, lines: string[]): string[] {
  const r = job.resources;
  return [
    "#!/bin/bash",
    `#SBATCH --job-name=${name}`,
    ...lines.map((line) => `#SBATCH ${line}`),
    ...(r.partition ? [`#SBATCH --partition=${r.partition}`] : []),
    ...(r.account ? [`#SBATCH --account=${r.account}`] : []),
    ...r.sbatchOptions.map((line) => `#SBATCH ${line}`),
  ];
}

/** shards.sbatch: task I of the array runs `extract --shard I/N` with the plan's spec. */
export function shardsScript(job: SlurmJob): string {
  const r = job.resources;
  const logs = `${job.runRoot}/slurm/logs`;
  const extract = [
    job.command,
    "extract",
    ...job.datasetArguments.map(shellQuote),
    "--out",
    shellQuote(job.runRoot),
    "--spec",
    shellQuote(`${job.runRoot}/spec.json`),
    "--shard",
    `"\${SLURM_ARRAY_TASK_ID}/${job.shards}"`,
    "--workers",
    `"\${SLURM_CPUS_PER_TASK:-${r.cpus}}"`,
  ].join(" ");
  return `${[
    ...header(job, "cliquescape-shards", [
      `--array=0-${job.shards - 1}${r.maxParallel ? `%${r.maxParallel}` : ""}`,
      "--ntasks=1",
      `--cpus-per-task=${r.cpus}`,
      `--mem=${r.memMiB}M`,
      `--time=${r.time}`,
      `--output=${logs}/shard-%a.job-%A.out`,
    ]),
    `# Written by cliquescape cluster-script: shard I of ${job.shards} (I = the array task id) of the planned run`,
    `# in ${job.runRoot}; its files go to parts/I-of-${job.shards}/. Submit with submit.sh beside this file.`,
    "# A task that dies is run again alone (submit.sh I); graphs it finished are not recomputed.",
    "set -euo pipefail",
    ...job.setup,
    `cd ${shellQuote(job.workingDirectory)}`,
    `exec ${extract}`,
  ].join("\n")}\n`;
}

/** merge.sbatch: the tables of the whole run, once every shard has ended well. */
export function mergeScript(job: SlurmJob): string {
  const r = job.resources;
  return `${[
    ...header(job, "cliquescape-merge", [
      "--ntasks=1",
      "--cpus-per-task=1",
      `--mem=${r.mergeMemMiB}M`,
      `--time=${r.mergeTime}`,
      `--output=${job.runRoot}/slurm/logs/merge.job-%j.out`,
      // A shard that fails makes the dependency impossible: cancel this job rather than leave it waiting.
      "--kill-on-invalid-dep=yes",
    ]),
    "# Written by cliquescape cluster-script: merges the shards into the run folder's tables (submit.sh",
    "# submits it with --dependency=afterok on the shards' array job).",
    "set -euo pipefail",
    ...job.setup,
    `cd ${shellQuote(job.workingDirectory)}`,
    `exec ${job.command} merge ${shellQuote(job.runRoot)} --shards ${job.shards}`,
  ].join("\n")}\n`;
}

/** submit.sh: the array job (all shards, or the ones named), then the merge depending on it. */
export function submitScript(job: SlurmJob): string {
  return `${[
    "#!/bin/bash",
    "# Written by cliquescape cluster-script. Submits the shards as one array job and the merge as a job",
    "# that starts when every one of them has ended well.",
    "#   submit.sh          every shard",
    `#   submit.sh 2        only shard 2 (say, after it was cancelled or ran out of time), then the merge`,
    "#   submit.sh 1,3      shards 1 and 3",
    "set -euo pipefail",
    'here="$(cd "$(dirname "$0")" && pwd)"',
    `array="\${1:-0-${job.shards - 1}}"`,
    `shards="$(sbatch --parsable --array="$array${job.resources.maxParallel ? `%${job.resources.maxParallel}` : ""}" "$here/shards.sbatch")"`,
    `shards="\${shards%%;*}"  # --parsable prints "id;cluster" on sites with several clusters`,
    'merge="$(sbatch --parsable --dependency="afterok:$shards" "$here/merge.sbatch")"',
    `merge="\${merge%%;*}"`,
    'echo "submitted: shards job $shards (array $array), merge job $merge (runs when every shard has ended well)"',
    `echo "logs: ${job.runRoot}/slurm/logs; watch with: squeue -j $shards,$merge"`,
  ].join("\n")}\n`;
}
