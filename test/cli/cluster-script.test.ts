/**
 * `cluster-script`: the job scripts state the resources asked for, quote paths with spaces, and do the run
 * when executed as Slurm would (each array task with its SLURM_ARRAY_TASK_ID, then the merge) — here run by
 * bash directly, so this holds without a scheduler; test/cluster/ submits them to a real one. Reference:
 * a single-process `extract` of the same dataset.
 */
import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { encodeNpy } from "@cliquescape/io";
import { beforeAll, describe, expect, it } from "vitest";
import { expectSameRun, SMALL_DATASET, similarityDataset, similarityMatrix } from "./extract-fixtures.js";
import { runCli, scratchFiles } from "./run-cli.js";

const BIN = fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url));

describe("cluster-script", () => {
  let dir: string;
  let out: string;
  beforeAll(() => {
    dir = similarityDataset(SMALL_DATASET);
    out = join(dir, "run with spaces");
    const plan = runCli(["extract", join(dir, "manifest.csv"), "--out", out, "--plan", "--top-dim", "2"]);
    expect(plan.status, plan.stderr).toBe(0);
  });

  it("states the resources per task and the dependency, and refuses what cannot work", () => {
    const made = runCli([
      "cluster-script",
      out,
      "--shards",
      "3",
      "--cpus",
      "2",
      "--mem",
      "3G",
      "--time",
      "1-02:00:00",
      "--partition",
      "short",
      "--account",
      "lab",
      "--max-parallel",
      "2",
      "--sbatch=--constraint=avx2",
      "--setup",
      "module load nodejs",
    ]);
    expect(made.status, made.stderr).toBe(0);
    expect(made.stdout).toContain("3 array tasks");
    const shards = readFileSync(join(out, "slurm", "shards.sbatch"), "utf8");
    for (const line of [
      "#SBATCH --array=0-2%2",
      "#SBATCH --cpus-per-task=2",
      "#SBATCH --mem=3072M",
      "#SBATCH --time=1-02:00:00",
      "#SBATCH --partition=short",
      "#SBATCH --account=lab",
      "#SBATCH --constraint=avx2",
      "module load nodejs",
    ])
      expect(shards).toContain(line);
    expect(shards).toContain(`--out '${out}'`);
    expect(shards).toContain(`--shard "\${SLURM_ARRAY_TASK_ID}/3"`);
    const merge = readFileSync(join(out, "slurm", "merge.sbatch"), "utf8");
    expect(merge).toContain(`merge '${out}' --shards 3`);
    const submit = readFileSync(join(out, "slurm", "submit.sh"), "utf8");
    expect(submit).toContain('--dependency="afterok:$shards"');
    expect(statSync(join(out, "slurm", "submit.sh")).mode & 0o111).not.toBe(0);
    // Defaults: 1 CPU, the spec's homology memory (1024 MiB) + 512 MiB.
    expect(runCli(["cluster-script", out, "--shards", "2"]).status).toBe(0);
    expect(readFileSync(join(out, "slurm", "shards.sbatch"), "utf8")).toContain("#SBATCH --mem=1536M");

    const tooMany = runCli(["cluster-script", out, "--shards", "8"]);
    expect(tooMany.status).toBe(2);
    expect(tooMany.stderr).toContain("only 7 graphs");
    const badMem = runCli(["cluster-script", out, "--shards", "2", "--mem", "lots"]);
    expect(badMem.status).toBe(2);
    const badTime = runCli(["cluster-script", out, "--shards", "2", "--time", "4h"]);
    expect(badTime.status).toBe(2);
    const empty = join(dir, "not-planned");
    mkdirSync(empty);
    const unplanned = runCli(["cluster-script", empty, "--shards", "2"]);
    expect(unplanned.status).toBe(2);
    expect(unplanned.stderr).toContain("--plan");
  });

  it("its scripts, run as Slurm runs them, write a single run's files", () => {
    const single = join(dir, "single");
    const reference = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      single,
      "--top-dim",
      "2",
      "--workers",
      "1",
    ]);
    expect(reference.status, reference.stderr).toBe(0);
    expect(runCli(["cluster-script", out, "--shards", "3"]).status).toBe(0);
    for (let i = 0; i < 3; i++) {
      const task = spawnSync("bash", [join(out, "slurm", "shards.sbatch")], {
        env: { ...process.env, SLURM_ARRAY_TASK_ID: String(i), SLURM_CPUS_PER_TASK: "1" },
        encoding: "utf8",
      });
      expect(task.status, task.stderr).toBe(0);
      expect(task.stdout).toContain(`shard ${i}/3 finished`);
    }
    const merge = spawnSync("bash", [join(out, "slurm", "merge.sbatch")], { encoding: "utf8" });
    expect(merge.status, merge.stderr).toBe(0);
    expectSameRun(single, out);
  });

  it("a stack with a labels file, planned with paths relative to its folder, runs from anywhere", () => {
    // The plan is made inside the dataset's folder with relative paths; the jobs cd there first.
    const stackDir = scratchFiles({ "labels.txt": "a\nb\na\nb\na\nb\n" });
    const n = 9;
    const values: number[] = [];
    for (let g = 0; g < 6; g++)
      for (const row of similarityMatrix(n, false, 500 + g)) for (const w of row) values.push(w ?? 0);
    writeFileSync(join(stackDir, "stack.npy"), encodeNpy(values, [6, n, n]));
    const inStack = (args: string[]) =>
      spawnSync(process.execPath, [BIN, ...args], { cwd: stackDir, encoding: "utf8" });
    const args = ["stack.npy", "--labels", "labels.txt", "--top-dim", "2"];
    const reference = inStack(["extract", ...args, "--out", "single", "--workers", "1"]);
    expect(reference.status, reference.stderr).toBe(0);
    expect(inStack(["extract", ...args, "--out", "sharded", "--plan"]).status).toBe(0);
    expect(inStack(["cluster-script", "sharded", "--shards", "2"]).status).toBe(0);
    const script = (name: string, env: Record<string, string> = {}) =>
      spawnSync("bash", [join(stackDir, "sharded", "slurm", name)], {
        cwd: dir, // not the dataset's folder
        env: { ...process.env, ...env },
        encoding: "utf8",
      });
    for (const i of ["0", "1"]) {
      const task = script("shards.sbatch", { SLURM_ARRAY_TASK_ID: i });
      expect(task.status, task.stderr).toBe(0);
    }
    const merge = script("merge.sbatch");
    expect(merge.status, merge.stderr).toBe(0);
    expectSameRun(join(stackDir, "single"), join(stackDir, "sharded"));
    expect(readFileSync(join(stackDir, "sharded", "features.csv"), "utf8")).toMatch(/\n[^,]+,b,/);
  });
});
