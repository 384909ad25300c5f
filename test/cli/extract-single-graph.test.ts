/**
 * The batch job against the single-graph commands and numpy: the features `extract` writes for a small
 * dataset must equal what `cliquescape sweep` and `cliquescape barcode` print for the same graphs (counts,
 * Euler characteristic, Betti numbers, bars), and the quantile grid must equal numpy.quantile of the
 * dataset's edge weights (outside reference: Debian's python3-numpy).
 */
import { spawnSync } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { encodeNpy } from "@cliquescape/io";
import { beforeAll, describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON } from "../support/python.js";
import { readFeatureTable, SMALL_DATASET, similarityDataset, similarityMatrix } from "./extract-fixtures.js";
import { runCli } from "./run-cli.js";

const GRID = [0.9, 0.75, 0.6, 0.45, 0.3, 0.15];

describe("extract equals the single-graph commands", () => {
  let dir: string;
  let table: { header: string[]; rows: string[][] };
  beforeAll(() => {
    dir = similarityDataset(SMALL_DATASET);
    const run = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "run"),
      "--threshold",
      GRID.join(","),
      "--top-dim",
      "3",
      "--barcode-range",
      "full",
      "--workers",
      "2",
    ]);
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    table = readFeatureTable(join(dir, "run", "features.csv"));
  });

  it.each(SMALL_DATASET.map((g) => [g.id, g] as const))(
    "%s: counts, Euler and Betti curves match sweep",
    (id, g) => {
      const row = table.rows.find((r) => r[0] === id)!;
      expect(row[1]).toBe(g.label);
      const cell = (name: string) => Number(row[table.header.indexOf(name)]);
      const sweep = runCli([
        "sweep",
        join(dir, `${id}.csv`),
        "--threshold",
        GRID.join(","),
        "--top-dim",
        "3",
        "--format",
        "json",
        ...(g.directed ? ["--directed"] : []),
      ]);
      expect(sweep.status).toBe(0);
      const report = JSON.parse(sweep.stdout) as {
        thresholds: number[];
        counts: number[][];
        euler: number[];
        betti: number[][];
      };
      expect(report.thresholds).toEqual(GRID);
      GRID.forEach((t, i) => {
        for (let k = 1; k <= 3; k++) expect(cell(`simplices_d${k}_w${t}`)).toBe(report.counts[i][k] ?? 0);
        expect(cell(`euler_w${t}`)).toBe(report.euler[i]);
        for (let k = 0; k < 3; k++) expect(cell(`betti_d${k}_w${t}`)).toBe(report.betti[i][k]);
      });
      expect(cell("net_nodes")).toBe(g.n);
    },
  );

  it.each(SMALL_DATASET.map((g) => [g.id, g] as const))(
    "%s: the barcode file has the bars of `barcode`",
    (id, g) => {
      const single = runCli([
        "barcode",
        join(dir, `${id}.csv`),
        "--top-dim",
        "3",
        "--format",
        "json",
        ...(g.directed ? ["--directed"] : []),
      ]);
      expect(single.status).toBe(0);
      const expected = JSON.parse(single.stdout).bars;
      const written = JSON.parse(readFileSync(join(dir, "run", "barcodes", `${id}.json`), "utf8"));
      expect(written.id).toBe(id);
      expect(written.bars).toEqual(expected);
    },
  );
});

describe("the quantile grid equals numpy.quantile over the dataset's edges", () => {
  const missing = missingPythonModules(["numpy"]);
  it.skipIf(missing !== null)(
    `default grid: 20 weights between the 5 % and 95 % quantiles ${missing ?? ""}`,
    () => {
      const dir = similarityDataset(SMALL_DATASET);
      const run = runCli(["extract", join(dir, "manifest.csv"), "--out", join(dir, "run"), "--workers", "2"]);
      expect(run.status).toBe(0);
      const spec = JSON.parse(readFileSync(join(dir, "run", "spec.json"), "utf8"));
      // numpy reads the same CSV files; an empty cell is NaN = no edge; undirected pairs counted once.
      const script = `
import json, sys, numpy as np
files = json.loads(sys.argv[1])
values = []
for path, directed in files:
    m = np.genfromtxt(path, delimiter=",")
    mask = ~np.isnan(m) & ~np.eye(len(m), dtype=bool)
    if not directed:
        mask &= np.triu(np.ones_like(mask), 1).astype(bool)
    values.append(m[mask])
v = np.concatenate(values)
lo, hi = np.quantile(v, [0.05, 0.95])
print(json.dumps({"lo": lo, "hi": hi, "grid": np.linspace(hi, lo, 20).tolist(), "n": int(v.size)}))
`;
      const files = SMALL_DATASET.map((g) => [join(dir, `${g.id}.csv`), g.directed]);
      const py = spawnSync(PYTHON, ["-c", script, JSON.stringify(files)], { encoding: "utf8" });
      expect(py.stderr).toBe("");
      const reference = JSON.parse(py.stdout);
      expect(spec.grid).toEqual({ kind: "quantiles", steps: 20, from: 0.05, to: 0.95 });
      expect(spec.resolvedGrid.edgesSampled).toBe(reference.n);
      expect(spec.resolvedGrid.quantileWeights[0]).toBeCloseTo(reference.lo, 12);
      expect(spec.resolvedGrid.quantileWeights[1]).toBeCloseTo(reference.hi, 12);
      expect(spec.resolvedGrid.values).toHaveLength(20);
      for (const [i, v] of (spec.resolvedGrid.values as number[]).entries()) {
        expect(v).toBeCloseTo(reference.grid[i], 12);
      }
    },
  );
});

/** null when Debian's python3 imports numpy, else why not. */
describe("a stack dataset", () => {
  it("gives the same feature rows as the same matrices written as CSV files", () => {
    const graphs = SMALL_DATASET.filter((g) => !g.directed).map((g) => ({ ...g, n: 12 }));
    const dir = similarityDataset(graphs);
    const n = 12;
    const values = new Float64Array(graphs.length * n * n);
    graphs.forEach((g, s) => {
      similarityMatrix(n, false, g.seed).forEach((row, i) => {
        row.forEach((w, j) => {
          values[(s * n + i) * n + j] = w ?? 0;
        });
      });
    });
    writeFileSync(join(dir, "stack.npy"), encodeNpy(values, [graphs.length, n, n]));
    writeFileSync(join(dir, "labels.txt"), `${graphs.map((g) => g.label).join("\n")}\n`);
    const fromFiles = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "files"),
      "--threshold",
      "0.8,0.5,0.2",
    ]);
    const fromStack = runCli([
      "extract",
      join(dir, "stack.npy"),
      "--labels",
      join(dir, "labels.txt"),
      "--out",
      join(dir, "stack"),
      "--threshold",
      "0.8,0.5,0.2",
    ]);
    expect(fromFiles.status).toBe(0);
    expect(fromStack.stderr).toBe("");
    expect(fromStack.status).toBe(0);
    const a = readFeatureTable(join(dir, "files", "features.csv"));
    const b = readFeatureTable(join(dir, "stack", "features.csv"));
    expect(b.header).toEqual(a.header);
    expect(b.rows.map((r) => [r[1], ...r.slice(3)])).toEqual(a.rows.map((r) => [r[1], ...r.slice(3)]));
  });
});
