/**
 * Sharded runs: `extract --plan`, `extract --shard I/N` and `merge` give the run folder a single
 * `extract` run writes, byte for byte; a missing or unfinished shard is named and nothing is written; a
 * shard under other settings is refused; a shard run again skips the graphs it finished. Reference: the
 * single-process run of the same command.
 */
import { spawn } from "node:child_process";
import { existsSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { expectSameRun, SMALL_DATASET, similarityDataset } from "./extract-fixtures.js";
import { runCli } from "./run-cli.js";

const BIN = fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url));

/** The small fixture plus a graph with a bad cell (fails, with its line) and a manifest row without a file. */
function datasetWithFailures(): string {
  const dir = similarityDataset(SMALL_DATASET);
  writeFileSync(join(dir, "bad.csv"), "0,1,0.5\n1,0,abc\n0.5,0.2,0\n");
  const manifest = readFileSync(join(dir, "manifest.csv"), "utf8");
  writeFileSync(
    join(dir, "manifest.csv"),
    `${manifest}bad,bad.csv,beta,false,train\nghost,no-such-file.csv,alpha,false,test\n`,
  );
  return dir;
}

describe("sharded extract runs", () => {
  let dir: string;
  let manifest: string;
  let single: string;
  beforeAll(() => {
    dir = datasetWithFailures();
    manifest = join(dir, "manifest.csv");
    single = join(dir, "single");
    const run = runCli(["extract", manifest, "--out", single, "--workers", "1"]);
    expect(run.status, run.stderr).toBe(1); // the bad graph and the missing file are left out
    expect(readFileSync(join(single, "errors.csv"), "utf8")).toMatch(/bad,bad\.csv,2,3,/);
  });

  const shard = (out: string, i: number, n: number, extra: string[] = []) =>
    runCli([
      "extract",
      manifest,
      "--out",
      out,
      "--spec",
      join(out, "spec.json"),
      "--shard",
      `${i}/${n}`,
      "--workers",
      "1",
      ...extra,
    ]);

  it("plan, 4 shards and merge write the single run's files byte for byte; shards share no graph", () => {
    const out = join(dir, "four");
    const plan = runCli(["extract", manifest, "--out", out, "--plan"]);
    expect(plan.status, plan.stderr).toBe(0);
    expect(plan.stdout).toContain("planned: 8 graphs (1 could not be read");
    expect(existsSync(join(out, "features.csv"))).toBe(false); // the plan computes no graph
    for (let i = 0; i < 4; i++) {
      const run = shard(out, i, 4);
      expect(run.status, run.stderr).toBe(0); // finished, the failed graph included
      expect(run.stdout).toContain(`shard ${i}/4 finished`);
    }
    // Each graph's record is in exactly one part.
    const owners = new Map<string, string>();
    for (const part of readdirSync(join(out, "parts")).sort()) {
      for (const name of readdirSync(join(out, "parts", part, "graphs"))) {
        expect(owners.get(name), `${name} in ${owners.get(name)} and ${part}`).toBeUndefined();
        owners.set(name, part);
      }
    }
    expect([...owners.keys()].sort()).toEqual(readdirSync(join(single, "graphs")).sort());
    const merge = runCli(["merge", out]);
    expect(merge.status, merge.stderr).toBe(1); // as the single run: a graph was left out
    expect(merge.stdout).toContain("7 graphs in the tables");
    expectSameRun(single, out);
    // Merging again changes nothing.
    expect(runCli(["merge", out]).status).toBe(1);
    expectSameRun(single, out);
  });

  it("names missing and unfinished shards, writes nothing, and a re-run shard recomputes only what is missing", () => {
    const out = join(dir, "partial");
    expect(runCli(["extract", manifest, "--out", out, "--plan"]).status).toBe(0);
    for (const i of [0, 1, 3]) expect(shard(out, i, 4).status).toBe(0);
    // Shard 1 loses one finished graph (as if killed while writing it).
    const graphs1 = join(out, "parts", "1-of-4", "graphs");
    const lost = readdirSync(graphs1).sort()[0];
    rmSync(join(graphs1, lost));
    const merge = runCli(["merge", out, "--shards", "4"]);
    expect(merge.status).toBe(4);
    expect(merge.stderr).toContain("2 of 4 shards not finished; nothing written");
    expect(merge.stderr).toMatch(/shard 1 \(.*1-of-4\): incomplete: 1 of 2 graphs done/);
    expect(merge.stderr).toMatch(/shard 2 \(.*2-of-4\): missing \(never ran\)/);
    expect(merge.stderr).toContain("--array=1,2");
    for (const table of ["features.csv", "features.npz", "errors.csv"])
      expect(existsSync(join(out, table)), table).toBe(false);

    const again = shard(out, 1, 4);
    expect(again.status).toBe(0);
    expect(again.stdout).toContain("2 of 2 graphs done (1 already done before this run)");
    expect(shard(out, 2, 4).status).toBe(0);
    expect(runCli(["merge", out]).status).toBe(1);
    expectSameRun(single, out);
    // Parts of another shard count in the same folder: the merge asks which count is meant.
    expect(shard(out, 0, 2).status).toBe(0);
    const which = runCli(["merge", out]);
    expect(which.status).toBe(2);
    expect(which.stderr).toContain("shards of 2 different counts (2, 4): pass --shards N");
    expect(runCli(["merge", out, "--shards", "4"]).status).toBe(1);
    expectSameRun(single, out);
  });

  it("2 shards and 1 shard give the same folder too (the split does not change any byte)", () => {
    for (const n of [1, 2]) {
      const out = join(dir, `n${n}`);
      expect(runCli(["extract", manifest, "--out", out, "--plan"]).status).toBe(0);
      for (let i = 0; i < n; i++) expect(shard(out, i, n).status).toBe(0);
      expect(runCli(["merge", out]).status).toBe(1);
      expectSameRun(single, out);
    }
  });

  it("refuses a shard under other settings, before a plan, or on another dataset", () => {
    const out = join(dir, "refuse");
    const before = runCli(["extract", manifest, "--out", out, "--shard", "0/2"]);
    expect(before.status).toBe(2);
    expect(before.stderr).toContain("--plan");
    // A single run's folder has no plan to merge.
    const unplanned = runCli(["merge", single]);
    expect(unplanned.status).toBe(2);
    expect(unplanned.stderr).toContain("has no shard plan");
    expect(runCli(["extract", manifest, "--out", out, "--plan", "--top-dim", "2"]).status).toBe(0);
    // The same options as the plan need no --spec: the grid comes from the plan.
    const same = runCli(["extract", manifest, "--out", out, "--shard", "0/2", "--top-dim", "2"]);
    expect(same.status, same.stderr).toBe(0);
    const other = runCli(["extract", manifest, "--out", out, "--shard", "1/2"]);
    expect(other.status).toBe(2);
    expect(other.stderr).toContain("complex.topDim: 2 → 3");
    expect(existsSync(join(out, "parts", "1-of-2"))).toBe(false);
    const bad = runCli(["extract", manifest, "--out", out, "--shard", "2/2"]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain("must be below N");
    const both = runCli(["extract", manifest, "--out", out, "--shard", "0/2", "--plan"]);
    expect(both.status).toBe(2);
    // Another dataset (one graph fewer) is not the plan's.
    const lines = readFileSync(manifest, "utf8").trimEnd().split("\n");
    const fewer = join(dir, "fewer.csv");
    writeFileSync(fewer, `${lines.slice(0, -3).join("\n")}\n`);
    const wrong = runCli([
      "extract",
      fewer,
      "--out",
      out,
      "--spec",
      join(out, "spec.json"),
      "--shard",
      "0/2",
    ]);
    expect(wrong.status).toBe(2);
    expect(wrong.stderr).toContain("is not the dataset of the plan");
    // A graph file changed since the plan is refused by the shard that owns it.
    const changed = join(dir, "changed");
    expect(runCli(["extract", manifest, "--out", changed, "--plan"]).status).toBe(0);
    const file = join(dir, `${SMALL_DATASET[0].id}.csv`);
    const original = readFileSync(file);
    writeFileSync(file, Buffer.concat([original, Buffer.from("\n")]));
    try {
      const results = [0, 1].map((i) => shard(changed, i, 2));
      expect(results.map((r) => r.status).sort()).toEqual([0, 2]);
      expect(results.find((r) => r.status === 2)!.stderr).toContain("changed since the plan");
    } finally {
      writeFileSync(file, original);
    }
  });

  it("the same shard started twice: the second refuses at once (its part folder is locked), other shards run", async () => {
    const out = join(dir, "twice");
    // Many null samples: a shard is still working when the next command starts.
    const slow = ["--null-model", "rewire", "--null-samples", "5000"];
    expect(runCli(["extract", manifest, "--out", out, "--plan", ...slow]).status).toBe(0);
    const start = (i: number) =>
      spawn(
        process.execPath,
        [BIN, "extract", manifest, "--out", out, "--spec", join(out, "spec.json"), "--shard", `${i}/2`],
        { stdio: "ignore" },
      );
    const locked = async (i: number) => {
      const lock = join(out, "parts", `${i}-of-2`, "run.lock");
      for (let k = 0; !existsSync(lock); k++) {
        if (k > 600) throw new Error(`shard ${i} never took its lock`);
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
    };
    const stop = async (child: ReturnType<typeof spawn>) => {
      if (child.exitCode === null) child.kill("SIGTERM");
      if (child.exitCode === null) await new Promise((resolve) => child.once("exit", resolve));
    };
    const first = start(0);
    try {
      await locked(0);
      const second = shard(out, 0, 2);
      expect(second.status).toBe(75);
      expect(second.stderr).toContain("is in use by another run");
      // Shard 1 has its own folder and lock: it starts beside shard 0 (and is stopped: that is all we need).
      const other = start(1);
      try {
        await locked(1);
        expect(other.exitCode).toBeNull();
      } finally {
        await stop(other);
      }
    } finally {
      await stop(first);
    }
  });
});
