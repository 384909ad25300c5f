/**
 * `distances` and `nullmodel` end to end on the built program: the distance matrix written from an extract
 * run equals the core's distances recomputed here from the run's barcode files (python3-numpy reads the
 * .npy); a null model's report is reproducible with a seed and identical with 1 and 2 workers.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { diagramOf, wassersteinDistance } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { runCli } from "./run-cli.js";

describe("distances RUN_DIR", () => {
  it("writes a symmetric matrix equal to the core's distances between the run's barcodes", () => {
    const out = mkdtempSync(join(tmpdir(), "cliquescape-dist-"));
    const run = join(out, "run");
    expect(
      runCli(["extract", "demo-data/manifest.csv", "--out", run, "--workers", "1", "--no-bundles"]).status,
    ).toBe(0);
    const result = runCli(["distances", run, "--workers", "2"]);
    expect(result.status, result.stderr).toBe(0);
    const csv = readFileSync(join(run, "distances", "wasserstein1-d1.csv"), "utf8")
      .trim()
      .split("\n");
    const ids = csv[0].split(",").slice(1);
    expect(ids).toHaveLength(36);
    const bars = (id: string) => JSON.parse(readFileSync(join(run, "barcodes", `${id}.json`), "utf8"));
    const a = bars(ids[0]);
    const b = bars(ids[13]);
    const expected = wassersteinDistance(
      diagramOf({ semantics: a.weights, bars: a.bars }, 1, { kind: "cut", at: a.end }),
      diagramOf({ semantics: b.weights, bars: b.bars }, 1, { kind: "cut", at: b.end }),
      1,
    );
    expect(Number(csv[1].split(",")[14])).toBe(expected);
    const numpy = spawnSync(
      "python3",
      [
        "-c",
        `import numpy as n; m = n.load("${join(run, "distances", "wasserstein1-d1.npy")}"); print(m.shape[0], bool((m == m.T).all()), m[0, 13])`,
      ],
      { encoding: "utf8" },
    );
    if (numpy.status === 0) expect(numpy.stdout.trim()).toBe(`36 True ${expected}`);
    expect(runCli(["distances", out]).status).toBe(2); // not a run folder
  });
});

describe("nullmodel FILE", () => {
  it("is reproducible with a seed and the same with 1 and 2 workers", () => {
    const args = [
      "nullmodel",
      "demo-data/graphs/ring01u.csv",
      "--model",
      "rewire",
      "--samples",
      "12",
      "--density",
      "0.1",
      "--format",
      "json",
    ];
    const one = runCli([...args, "--workers", "1"]);
    const two = runCli([...args, "--workers", "2"]);
    expect(one.status, one.stderr).toBe(0);
    expect(two.stdout).toBe(one.stdout);
    const report = JSON.parse(one.stdout);
    expect(report.samples).toBe(12);
    expect(report.swaps.done).toBeGreaterThan(0);
    const edges = report.features.find((f: { name: string }) => f.name === "simplices_d1");
    expect(edges.sd).toBe(0); // rewiring keeps the edge count at the threshold
    expect(edges.z).toBeNull();
    const triangles = report.features.find((f: { name: string }) => f.name === "simplices_d2");
    expect(triangles.pGreater).toBeCloseTo(1 / 13, 12);
    const bad = runCli([...args.slice(0, 2), "--model", "nope"]);
    expect(bad.status).not.toBe(0);
    expect(bad.stderr).toMatch(/nope/);
  });
});
