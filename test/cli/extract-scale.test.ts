/**
 * Scale of a dataset (issue 8 §2): `extract` on a stack of 1,000,000 tiny graphs finishes, writes tables
 * whose every row is right, and a rerun on the finished folder finishes too (both once died writing the
 * tables: a spread of 130,000 ids into Math.max overflowed the call stack). A spec whose grid has 100,000
 * thresholds runs end to end and is reused through --spec.
 *
 * Reference values are closed forms, common practice: at a similarity threshold t a graph keeps the pairs of
 * weight ≥ t (its 1-simplices), and a triangle is a 2-simplex when all three of its pairs are kept.
 */
import { spawn } from "node:child_process";
import { readFileSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { encodeNpy, npyValues, pickNpzArray, readNpzMembers } from "@cliquescape/io";
import { afterAll, describe, expect, it } from "vitest";
import { readFeatureTable } from "./extract-fixtures.js";
import { runCli, scratchFiles } from "./run-cli.js";

// The issue asks for a million graphs end to end, so the suite runs a million: about 3 minutes of CPU on 2
// cores, most of it the million per-graph record files of the run folder (docs/benchmarks.md).
// CLIQUESCAPE_SCALE_GRAPHS=N runs another size while working on the writers.
const GRAPHS = Number(process.env.CLIQUESCAPE_SCALE_GRAPHS ?? 1_000_000);
const dirs: string[] = [];
const manyFiles: string[] = [];
afterAll(() => {
  for (const dir of dirs) rmSync(dir, { recursive: true, force: true });
  // One record file per graph: deleting them took minutes on a disk mounted with discard, so rm does it in
  // the background while the suite goes on.
  for (const dir of manyFiles) spawn("rm", ["-rf", dir], { detached: true, stdio: "ignore" }).unref();
});

/** Weight of pair p (0: 0–1, 1: 0–2, 2: 1–2) of graph g: 0.75 where bit p of g is set, else 0.25. */
const weight = (g: number, p: number) => ((g >> p) & 1 ? 0.75 : 0.25);

/** k symmetric 3×3 matrices, C order, diagonal 0: every pattern of strong and weak pairs, in turn. */
function stackOfTriangles(k: number): Uint8Array {
  const values = new Float64Array(k * 9);
  for (let g = 0; g < k; g++) {
    const [a, b, c] = [weight(g, 0), weight(g, 1), weight(g, 2)];
    values.set([0, a, b, a, 0, c, b, c, 0], g * 9);
  }
  return encodeNpy(values, [k, 3, 3]);
}

function seconds(started: bigint): number {
  return Number(process.hrtime.bigint() - started) / 1e9;
}

describe(`extract on ${GRAPHS.toLocaleString("en")} tiny graphs`, () => {
  it("finishes, every row of both tables is right, and a rerun finishes on the same tables", () => {
    const dir = scratchFiles({});
    manyFiles.push(dir);
    writeFileSync(join(dir, "stack.npy"), stackOfTriangles(GRAPHS));
    const args = [
      "extract",
      join(dir, "stack.npy"),
      "--out",
      join(dir, "run"),
      "--threshold",
      "0.5",
      "--families",
      "simplexCounts",
      "--top-dim",
      "2",
      "--no-bundles",
      "--no-barcodes",
      "--workers",
      "2",
    ];
    let started = process.hrtime.bigint();
    const first = runCli(args);
    const firstSeconds = seconds(started);
    expect(first.stderr).not.toMatch(/Maximum call stack|Invalid string length|unexpected/);
    expect(first.status).toBe(0);
    expect(first.stdout).toContain(`done: ${GRAPHS} graphs in the tables, 0 left out`);

    const csv = readFileSync(join(dir, "run", "features.csv"), "utf8");
    const lines = csv.split("\n");
    expect(lines[0]).toBe("id,label,split,truncated,simplices_d1_w0.5,simplices_d2_w0.5");
    expect(lines).toHaveLength(GRAPHS + 2); // header, rows, and the empty string after the last newline
    const width = String(GRAPHS - 1).length;
    const npz = pickNpzArray(readNpzMembers(join(dir, "run", "features.npz")), "features.npz", "X");
    expect(npz.shape).toEqual([GRAPHS, 2]);
    const X = npyValues(npz);
    let wrong = 0;
    for (let g = 0; g < GRAPHS; g++) {
      const kept = (g & 1) + ((g >> 1) & 1) + ((g >> 2) & 1);
      const triangles = (g & 7) === 7 ? 1 : 0;
      // Three nodes hold no simplex above dimension 2: the counts are whole (truncated false).
      const expected = `stack-${String(g).padStart(width, "0")},,,false,${kept},${triangles}`;
      if (lines[g + 1] !== expected || X[2 * g] !== kept || X[2 * g + 1] !== triangles) wrong++;
    }
    expect(wrong).toBe(0);

    started = process.hrtime.bigint();
    const again = runCli(args);
    const againSeconds = seconds(started);
    expect(again.status).toBe(0);
    expect(again.stdout).toContain(`(${GRAPHS} already done before this run)`);
    expect(readFileSync(join(dir, "run", "features.csv"), "utf8")).toBe(csv);
    console.log(
      `${GRAPHS} graphs: first run ${firstSeconds.toFixed(1)} s, rerun ${againSeconds.toFixed(1)} s (wall)`,
    );
  }, 1_800_000);
});

describe("extract with a spec whose grid has 100,000 thresholds", () => {
  it("writes 100,000 columns per family, right at every threshold, and reuses the spec", () => {
    const dir = scratchFiles({});
    dirs.push(dir);
    // Five 3×3 graphs, each with its own weights; 100,000 thresholds evenly from 1 down to 0.
    const k = 5;
    const matrices = new Float64Array(k * 9);
    const pairs: number[][] = [];
    for (let g = 0; g < k; g++) {
      const [a, b, c] = [0.1 + 0.15 * g, 0.9 - 0.1 * g, 0.5 + 0.05 * g];
      pairs.push([a, b, c]);
      matrices.set([0, a, b, a, 0, c, b, c, 0], g * 9);
    }
    writeFileSync(join(dir, "five.npy"), encodeNpy(matrices, [k, 3, 3]));
    const T = 100_000;
    const thresholds = Array.from({ length: T }, (_, i) => 1 - i / (T - 1));
    writeFileSync(join(dir, "spec.json"), JSON.stringify({ grid: { kind: "weights", values: thresholds } }));
    const args = (out: string, spec: string) => [
      "extract",
      join(dir, "five.npy"),
      "--out",
      join(dir, out),
      "--spec",
      spec,
      "--families",
      "simplexCounts",
      "--top-dim",
      "2",
      "--workers",
      "2",
    ];
    const run = runCli(args("run", join(dir, "spec.json")));
    expect(run.stderr).not.toMatch(/Maximum call stack|Invalid string length|unexpected/);
    expect(run.status).toBe(0);
    const table = readFeatureTable(join(dir, "run", "features.csv"));
    expect(table.header.slice(0, 4)).toEqual(["id", "label", "split", "truncated"]);
    expect(table.header).toHaveLength(4 + 2 * T);
    expect(table.rows).toHaveLength(k);
    // Column j of family d1 is read at thresholds[j]: the pairs of weight ≥ it, and the triangle when all are.
    let wrong = 0;
    for (let g = 0; g < k; g++) {
      for (let j = 0; j < T; j++) {
        const kept = pairs[g].filter((w) => w >= thresholds[j]).length;
        if (Number(table.rows[g][4 + j]) !== kept) wrong++;
        if (Number(table.rows[g][4 + T + j]) !== (kept === 3 ? 1 : 0)) wrong++;
      }
    }
    expect(wrong).toBe(0);
    // The finished run's spec.json carries the whole grid; given back with --spec it gives the same table.
    const reused = runCli(args("again", join(dir, "run", "spec.json")));
    expect(reused.status).toBe(0);
    expect(readFileSync(join(dir, "again", "features.csv"), "utf8")).toBe(
      readFileSync(join(dir, "run", "features.csv"), "utf8"),
    );
  });
});
