/**
 * Sharded extract on a real single-node Slurm cluster (Debian's slurm-wlm and munge, started by the test):
 * the job scripts cluster-script writes, submitted with its submit.sh as an array job of 4 shards and a
 * dependent merge, give a single-process run's files byte for byte; a shard task cancelled midway and
 * submitted again alone gives the same files, and the graphs it had finished are not recomputed.
 * Reference: `extract` of the same command in one process.
 */
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { expectSameRun } from "../cli/extract-fixtures.js";
import { runCli } from "../cli/run-cli.js";
import { missingSlurm, type SlurmCluster, startSlurmCluster } from "./slurm-cluster.mjs";

const DEMO = fileURLToPath(new URL("../../demo-data/manifest.csv", import.meta.url));
// z-scored columns against 150 rewired samples make each demo graph take a noticeable fraction of a second,
// so a shard of 9 graphs can be caught midway.
const OPTIONS = ["--null-model", "rewire", "--null-samples", "150"];
const SHARDS = 4;
const JOB_WAIT_MS = 600_000; // a heavily loaded machine; the jobs take seconds on an idle one

const skip = missingSlurm();

describe.skipIf(skip)(`extract on a real Slurm cluster${skip ? ` (skipped: ${skip})` : ""}`, () => {
  let cluster: SlurmCluster | undefined;
  let work: string;
  let single: string;

  beforeAll(async () => {
    cluster = await startSlurmCluster();
    work = mkdtempSync(join(tmpdir(), "cliquescape-slurm-runs-"));
    single = join(work, "single");
    const run = runCli(["extract", DEMO, "--out", single, "--workers", "2", ...OPTIONS]);
    expect(run.status, run.stderr).toBe(0);
  }, 600_000);

  afterAll(async () => {
    await cluster?.stop();
    if (work) rmSync(work, { recursive: true, force: true });
    if (cluster) rmSync(cluster.dir, { recursive: true, force: true });
  }, 60_000);

  /** Plans the demo run into `out` and writes its job scripts (small memory: the test node is small). */
  function planAndScript(out: string): void {
    const plan = runCli(["extract", DEMO, "--out", out, "--plan", ...OPTIONS]);
    expect(plan.status, plan.stderr).toBe(0);
    const script = runCli([
      "cluster-script",
      out,
      "--shards",
      String(SHARDS),
      "--mem",
      "256M",
      "--merge-mem",
      "256M",
      "--time",
      "20",
    ]);
    expect(script.status, script.stderr).toBe(0);
  }

  /** Runs the generated submit.sh (all shards, or the named ones); returns the two job ids it printed. */
  function submit(out: string, indices?: string): { shards: string; merge: string } {
    const run = spawnSync(join(out, "slurm", "submit.sh"), indices === undefined ? [] : [indices], {
      env: cluster!.env,
      encoding: "utf8",
    });
    expect(run.status, run.stderr).toBe(0);
    const match = /shards job (\d+) .*merge job (\d+)/.exec(run.stdout);
    expect(match, run.stdout).not.toBeNull();
    return { shards: match![1], merge: match![2] };
  }

  const log = (out: string, name: string) => readFileSync(join(out, "slurm", "logs", name), "utf8");

  it("an array job of 4 shards and the dependent merge write a single run's files byte for byte", async () => {
    const out = join(work, "all");
    planAndScript(out);
    const jobs = submit(out);
    await cluster!.waitForJobs([jobs.shards, jobs.merge], JOB_WAIT_MS);
    const state = cluster!.jobState(jobs.merge);
    expect(state, `${state}\n${cluster!.logs()}`).toBe("COMPLETED");
    for (let i = 0; i < SHARDS; i++) {
      expect(cluster!.jobState(`${jobs.shards}_${i}`)).toBe("COMPLETED");
      expect(log(out, `shard-${i}.job-${jobs.shards}.out`)).toContain(`shard ${i}/${SHARDS} finished`);
    }
    expect(log(out, `merge.job-${jobs.merge}.out`)).toContain("done: 36 graphs in the tables, 0 left out");
    expectSameRun(single, out);
  });

  it("a shard cancelled midway, submitted again alone, gives the same files without recomputing its finished graphs", async () => {
    const out = join(work, "killed");
    planAndScript(out);
    const first = submit(out);
    const records = (k: number) => {
      const dir = join(out, "parts", `${k}-of-${SHARDS}`, "graphs");
      return existsSync(dir) ? readdirSync(dir).filter((name) => name.endsWith(".json")) : [];
    };
    // The first shard seen with at least one finished graph and at most half of its share is cancelled.
    let victim = -1;
    const deadline = Date.now() + JOB_WAIT_MS;
    while (victim < 0) {
      for (let k = 0; k < SHARDS && victim < 0; k++) {
        const done = records(k).length;
        if (done >= 1 && done <= 4) victim = k;
      }
      if (victim >= 0) break;
      if (Date.now() > deadline) throw new Error(`no shard was caught midway\n${cluster!.logs()}`);
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    cluster!.run("scancel", [`${first.shards}_${victim}`]);
    await cluster!.waitForJobs([first.shards, first.merge], JOB_WAIT_MS);
    expect(cluster!.jobState(`${first.shards}_${victim}`)).toBe("CANCELLED");
    // The shard could not end well, so the merge never ran (cancelled: its dependency cannot be met).
    expect(cluster!.jobState(first.merge)).not.toBe("COMPLETED");
    expect(existsSync(join(out, "features.csv"))).toBe(false);
    const merge = runCli(["merge", out]);
    expect(merge.status).toBe(4);
    expect(merge.stderr).toMatch(new RegExp(`1 of ${SHARDS} shards not finished`));
    const share = (
      JSON.parse(readFileSync(join(out, "parts", `${victim}-of-${SHARDS}`, "status.json"), "utf8")) as {
        graphs: number;
      }
    ).graphs;
    const kept = records(victim);
    expect(kept.length).toBeGreaterThanOrEqual(1);
    expect(kept.length).toBeLessThan(share);
    expect(merge.stderr).toContain(`shard ${victim} (`);
    expect(merge.stderr).toContain(`incomplete: ${kept.length} of ${share} graphs done`);
    const before = new Map(
      kept.map((name) => {
        const s = statSync(join(out, "parts", `${victim}-of-${SHARDS}`, "graphs", name));
        return [name, `${s.ino}:${s.mtimeMs}`];
      }),
    );
    const again = submit(out, String(victim));
    await cluster!.waitForJobs([again.shards, again.merge], JOB_WAIT_MS);
    expect(cluster!.jobState(again.merge), cluster!.logs()).toBe("COMPLETED");
    expect(log(out, `shard-${victim}.job-${again.shards}.out`)).toContain(
      `${share} of ${share} graphs done (${kept.length} already done before this run)`,
    );
    for (const [name, stamp] of before) {
      const s = statSync(join(out, "parts", `${victim}-of-${SHARDS}`, "graphs", name));
      expect(`${s.ino}:${s.mtimeMs}`, `${name} was written again`).toBe(stamp);
    }
    expectSameRun(single, out);
  });
});
