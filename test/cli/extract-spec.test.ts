/**
 * The run spec of `extract`: a partial spec file is validated and every mistake named by its JSON path;
 * settings in it take effect; options override it; the edge-value transform equals transforming the
 * matrices beforehand (reference: the same matrices with 1 − w or 1/w written into the files); a simplex
 * budget turns a graph into a recorded failure, not a crash.
 */
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { readFeatureTable, SMALL_DATASET, similarityDataset, similarityMatrix } from "./extract-fixtures.js";
import { matrixCsv, runCli } from "./run-cli.js";

describe("extract --spec", () => {
  // A spec edited by hand (or tampered with) is checked for meaning, not only for shape.
  it.each([
    [
      "a grid from -1e308 to 1e308 (areas would be infinite)",
      { grid: { kind: "weights", values: [1e308, -1e308] } },
      "at grid.values: the values are so far apart that their difference overflows float64",
    ],
    [
      "a resolved grid from -1e308 to 1e308",
      { grid: { kind: "weights", values: [0.5] }, resolvedGrid: { kind: "weight", values: [1e308, -1e308] } },
      "at resolvedGrid.values: the values are so far apart",
    ],
    [
      "a label name listed twice (two codes for one label)",
      { labelNames: ["alpha", "beta", "alpha"] },
      'at labelNames.2: label "alpha" is listed twice (also at 0); each label has one code',
    ],
    [
      "an undirected node layout for a dataset with directed graphs",
      { grid: { kind: "weights", values: [0.5] }, nodeLayout: "undirected" },
      /nodeLayout: the spec says "undirected", but graph b1 \(.*manifest\.csv:4\) is read as directed; every bundle of a run has the same node columns/,
    ],
  ])("refuses %s before computing anything", (_, spec, message) => {
    const dir = similarityDataset(SMALL_DATASET);
    writeFileSync(join(dir, "tampered.json"), JSON.stringify(spec));
    const args = ["extract", join(dir, "manifest.csv"), "--out", join(dir, "run")];
    const run = runCli([...args, "--spec", join(dir, "tampered.json")]);
    expect(run.status).toBe(2);
    if (typeof message === "string") expect(run.stderr).toContain(message);
    else expect(run.stderr).toMatch(message);
    expect(() => readFileSync(join(dir, "run", "spec.json"))).toThrow();
  });

  it("names every invalid setting by its JSON path and writes nothing", () => {
    const dir = similarityDataset(SMALL_DATASET.slice(0, 2));
    writeFileSync(
      join(dir, "bad.json"),
      JSON.stringify({
        complex: { topDim: 0, prime: 4 },
        grid: { kind: "quantiles", steps: "20" },
        colour: "red",
      }),
    );
    const run = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "run"),
      "--spec",
      join(dir, "bad.json"),
    ]);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain("invalid run spec");
    expect(run.stderr).toMatch(/at complex\.topDim: .*>=1/);
    expect(run.stderr).toMatch(/at complex\.prime: must be a prime number/);
    expect(run.stderr).toMatch(/at grid\.steps: .*expected number/);
    expect(run.stderr).toMatch(/colour/);
    expect(() => readFileSync(join(dir, "run", "spec.json"))).toThrow();
  });

  it("reports broken JSON with its line and column", () => {
    const dir = similarityDataset(SMALL_DATASET.slice(0, 1));
    writeFileSync(join(dir, "broken.json"), '{\n  "complex": { "topDim": 2, }\n}\n');
    const run = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "run"),
      "--spec",
      join(dir, "broken.json"),
    ]);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/broken\.json:2:\d+: not valid JSON/);
  });

  it("applies a partial spec, and options override it", () => {
    const dir = similarityDataset(SMALL_DATASET.slice(0, 3));
    writeFileSync(
      join(dir, "partial.json"),
      JSON.stringify({ complex: { topDim: 2 }, grid: { kind: "densities", values: [0.3, 0.1, 0.2] } }),
    );
    const run = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "run"),
      "--spec",
      join(dir, "partial.json"),
      "--prime",
      "3",
      "--families",
      "betti,euler",
    ]);
    expect(run.status).toBe(0);
    const spec = JSON.parse(readFileSync(join(dir, "run", "spec.json"), "utf8"));
    expect(spec.complex).toMatchObject({ topDim: 2, prime: 3 });
    expect(spec.resolvedGrid).toEqual({ kind: "density", values: [0.1, 0.2, 0.3] });
    const { header } = readFeatureTable(join(dir, "run", "features.csv"));
    expect(header.slice(4)).toEqual([
      "euler_dens0.1",
      "euler_dens0.2",
      "euler_dens0.3",
      ...[0, 1].flatMap((k) => ["0.1", "0.2", "0.3"].map((d) => `betti_d${k}_dens${d}`)),
    ]);
  });

  it("writes every setting into spec.json, so --spec spec.json resumes the run with the same columns", () => {
    const dir = similarityDataset(SMALL_DATASET.slice(0, 2));
    writeFileSync(
      join(dir, "partial.json"),
      JSON.stringify({
        complex: { topDim: 2 },
        families: { landscapes: true },
        vectorisation: { landscapeLayers: 2 },
        nullScores: { model: "er", samples: 3, features: ["betti"] },
      }),
    );
    const out = join(dir, "run");
    const args = ["extract", join(dir, "manifest.csv"), "--out", out, "--no-bundles"];
    expect(runCli([...args, "--spec", join(dir, "partial.json")]).status).toBe(0);
    const spec = JSON.parse(readFileSync(join(out, "spec.json"), "utf8"));
    expect(spec.vectorisation.landscapeLayers).toBe(2);
    expect(spec.nullScores).toMatchObject({ model: "er", samples: 3, features: ["betti"] });
    const before = readFileSync(join(out, "features.csv"), "utf8");
    const again = runCli([...args, "--spec", join(out, "spec.json")]);
    expect(again.status, again.stderr).toBe(0);
    expect(again.stdout).toContain("(2 already done before this run)");
    expect(readFileSync(join(out, "features.csv"), "utf8")).toBe(before);
    const header = readFeatureTable(join(out, "features.csv")).header;
    expect(header.filter((name) => name.startsWith("landscape_d1_l"))).toHaveLength(
      2 * spec.resolvedGrid.values.length,
    );
    expect(header.filter((name) => name.startsWith("z_er_"))).toEqual([
      "z_er_betti_d0_dens0.1",
      "z_er_betti_d1_dens0.1",
    ]);
  });
});

describe("extract --transform", () => {
  it.each([
    ["one-minus", (w: number) => 1 - w],
    ["reciprocal", (w: number) => 1 / w],
  ] as const)("%s equals writing the transformed matrices into the files", (transform, f) => {
    const graphs = SMALL_DATASET.slice(0, 4);
    const raw = similarityDataset(graphs);
    const pre = similarityDataset(graphs);
    for (const g of graphs) {
      const m = similarityMatrix(g.n, g.directed, g.seed).map((row) =>
        row.map((w) => (w === null ? null : f(w))),
      );
      writeFileSync(join(pre, `${g.id}.csv`), matrixCsv(m));
    }
    const grid = transform === "one-minus" ? "0.1,0.3,0.5,0.7" : "1.2,2,4,10";
    const common = ["--weights", "distance", "--threshold", grid, "--no-bundles"];
    const a = runCli([
      "extract",
      join(raw, "manifest.csv"),
      "--out",
      join(raw, "run"),
      "--transform",
      transform,
      ...common,
    ]);
    const b = runCli(["extract", join(pre, "manifest.csv"), "--out", join(pre, "run"), ...common]);
    expect(a.status).toBe(0);
    expect(b.status).toBe(0);
    const ta = readFeatureTable(join(raw, "run", "features.csv"));
    const tb = readFeatureTable(join(pre, "run", "features.csv"));
    expect(ta.header).toEqual(tb.header);
    expect(ta.rows).toEqual(tb.rows);
    const spec = JSON.parse(readFileSync(join(raw, "run", "spec.json"), "utf8"));
    expect(spec.preparation.transform).toBe(transform);
  });

  it("a transform that gives an infinite value is a recorded error naming the edge", () => {
    const dir = similarityDataset([]);
    writeFileSync(join(dir, "ok.csv"), matrixCsv(similarityMatrix(6, false, 5)));
    writeFileSync(
      join(dir, "one.csv"),
      matrixCsv([
        [null, 1, 0.5],
        [1, null, 0.2],
        [0.5, 0.2, null],
      ]),
    );
    // A 0 read as an edge (--zero-edges edge) has −log 0 = ∞; w = 1 gives 0, which is fine.
    writeFileSync(join(dir, "zero.csv"), "0,0,0.5\n0,0,0.2\n0.5,0.2,0\n");
    writeFileSync(join(dir, "manifest.csv"), "id,file,label\nok,ok.csv,a\none,one.csv,a\nzero,zero.csv,a\n");
    const run = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "run"),
      "--transform",
      "neg-log",
      "--zero-edges",
      "edge",
      "--weights",
      "distance",
      "--threshold",
      "0.5,1,2",
    ]);
    expect(run.status).toBe(1);
    const errors = readFeatureTable(join(dir, "run", "errors.csv"));
    expect(errors.rows).toHaveLength(1);
    expect(errors.rows[0][0]).toBe("zero");
    expect(errors.rows[0][4]).toMatch(/neg-log transform turns the weight 0 of edge \(1, 2\) into Infinity/);
    expect(readFeatureTable(join(dir, "run", "features.csv")).rows.map((r) => r[0])).toEqual(["ok", "one"]);
  });
});

describe("extract budgets", () => {
  it("a graph over the simplex budget is recorded with the reason; the others finish", () => {
    const dir = similarityDataset([
      { id: "small", label: "a", directed: false, n: 5, seed: 1 },
      { id: "large", label: "a", directed: false, n: 30, seed: 2 },
    ]);
    const run = runCli(["extract", join(dir, "manifest.csv"), "--out", join(dir, "run"), "--budget", "200"]);
    expect(run.status).toBe(1);
    const errors = readFeatureTable(join(dir, "run", "errors.csv"));
    expect(errors.rows.map((r) => r[0])).toEqual(["large"]);
    expect(errors.rows[0][4]).toMatch(/budget/i);
    expect(readFeatureTable(join(dir, "run", "features.csv")).rows.map((r) => r[0])).toEqual(["small"]);
  });

  it("a graph over the time limit is abandoned and recorded; the others finish", () => {
    const dir = similarityDataset([{ id: "small", label: "a", directed: false, n: 6, seed: 1 }]);
    // 80 nodes with about 90 % of the pairs as edges, simplices to dimension 10: some 10^10 of them, far
    // beyond what counts in a second. Not every pair: a complete graph's candidate sets are cliques, which
    // the counter sums by binomial coefficients in no time (C(48, 9) counted in under a second).
    const n = 80;
    const dense = Array.from({ length: n }, (_, i) =>
      Array.from({ length: n }, (_, j) =>
        i === j || (7 * Math.min(i, j) + 13 * Math.max(i, j)) % 10 === 0 ? null : 0.5,
      ),
    );
    writeFileSync(join(dir, "dense.csv"), matrixCsv(dense));
    writeFileSync(
      join(dir, "manifest.csv"),
      "id,file,label\nsmall,small.csv,a\ndense,dense.csv,a\nlast,small.csv,a\n",
    );
    const run = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "run"),
      "--top-dim",
      "10",
      "--families",
      "simplexCounts",
      "--threshold",
      "0.5",
      "--no-bundles",
      "--time-limit",
      "1",
      "--workers",
      "1",
    ]);
    expect(run.status).toBe(1);
    const errors = readFeatureTable(join(dir, "run", "errors.csv"));
    expect(errors.rows.map((r) => r[0])).toEqual(["dense"]);
    expect(errors.rows[0][4]).toMatch(/time limit of 1\.0 s reached while .*raise --time-limit/);
    expect(readFeatureTable(join(dir, "run", "features.csv")).rows.map((r) => r[0])).toEqual([
      "small",
      "last",
    ]);
  });
});
