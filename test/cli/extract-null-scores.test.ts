/**
 * z-scored columns of `extract` end to end on the built program. Reference: `cliquescape nullmodel`, which
 * draws its samples on worker threads and compares them with its own code path for the report; for the same
 * graph, model, samples, seed, threshold and grid, every z column of a graph's row must be the z it prints,
 * to the last bit. The tables must not depend on the number of workers, and a rerun must give the same
 * bytes (each sample is seeded on its own).
 */
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { readFeatureTable, SMALL_DATASET, similarityDataset } from "./extract-fixtures.js";
import { runCli } from "./run-cli.js";

const SAMPLES = 12;
const SEED = 7;
const DENSITY = 0.4;

describe("extract --null-model", () => {
  let dir: string;
  let spec: string;
  beforeAll(() => {
    dir = similarityDataset(SMALL_DATASET);
    // Where counts and Betti numbers are read is a spec setting; the rest comes from the command line.
    spec = join(dir, "null-spec.json");
    writeFileSync(spec, JSON.stringify({ nullScores: { threshold: { kind: "density", value: DENSITY } } }));
  });
  const extract = (out: string, workers: number) =>
    runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, out),
      "--spec",
      spec,
      "--null-model",
      "rewire",
      "--null-samples",
      String(SAMPLES),
      "--null-seed",
      String(SEED),
      "--no-bundles",
      "--workers",
      String(workers),
    ]);

  it("writes z columns equal to nullmodel's z, the same bytes with 1 and 2 workers and on a rerun", () => {
    const one = extract("w1", 1);
    expect(one.status, one.stderr).toBe(0);
    const two = extract("w2", 2);
    expect(two.status, two.stderr).toBe(0);
    const again = extract("w2-again", 2);
    for (const table of ["features.csv", "features.npz"]) {
      const bytes = readFileSync(join(dir, "w1", table));
      expect(readFileSync(join(dir, "w2", table)).equals(bytes), table).toBe(true);
      expect(readFileSync(join(dir, "w2-again", table)).equals(bytes), table).toBe(true);
    }
    expect(again.status).toBe(0);

    const { header, rows } = readFeatureTable(join(dir, "w1", "features.csv"));
    const zNames = header.filter((name) => name.startsWith("z_"));
    expect(zNames).toEqual([
      ...[1, 2, 3].map((k) => `z_rewire_simplices_d${k}_dens0.4`),
      ...[0, 1, 2].map((k) => `z_rewire_betti_d${k}_dens0.4`),
      ...[0, 1, 2].map((k) => `z_rewire_betti_d${k}_area`),
    ]);
    const grid = JSON.parse(readFileSync(join(dir, "w1", "spec.json"), "utf8")).resolvedGrid.values;
    let compared = 0;
    for (const graph of [SMALL_DATASET[0], SMALL_DATASET[2]]) {
      const report = runCli([
        "nullmodel",
        join(dir, `${graph.id}.csv`),
        ...(graph.directed ? ["--directed"] : []),
        "--model",
        "rewire",
        "--samples",
        String(SAMPLES),
        "--seed",
        String(SEED),
        "--density",
        String(DENSITY),
        "--range",
        `${grid[0]}:${grid[grid.length - 1]}`,
        "--steps",
        String(grid.length),
        "--workers",
        "2",
        "--format",
        "json",
      ]);
      expect(report.status, report.stderr).toBe(0);
      const printed = JSON.parse(report.stdout) as {
        grid: number[];
        features: { name: string; z: number | null }[];
      };
      expect(printed.grid).toEqual(grid);
      const row = rows.find((r) => r[0] === graph.id)!;
      for (const name of zNames) {
        const feature = name.replace("z_rewire_", "").replace(`_dens${DENSITY}`, "");
        const expected = printed.features.find((f) => f.name === feature)!.z;
        const cell = Number(row[header.indexOf(name)]);
        if (expected === null) expect(cell, `${graph.id} ${name}`).toBeNaN();
        else {
          expect(cell, `${graph.id} ${name}`).toBe(expected);
          compared++;
        }
      }
    }
    expect(compared).toBeGreaterThan(6); // most columns have a spread to compare, not only NaN
  });

  it("refuses null settings without a model, and a run folder made under another seed", () => {
    const lone = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "x"),
      "--null-samples",
      "5",
    ]);
    expect(lone.status).toBe(2);
    expect(lone.stderr).toMatch(/--null-model/);
    const badFeature = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "x"),
      "--null-model",
      "er",
      "--null-features",
      "betti,loops",
    ]);
    expect(badFeature.status).toBe(2);
    expect(badFeature.stderr).toMatch(/loops/);
    const first = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "seeded"),
      "--null-model",
      "shuffle",
      "--null-samples",
      "3",
      "--null-features",
      "betti",
      "--top-dim",
      "2",
      "--no-bundles",
    ]);
    expect(first.status, first.stderr).toBe(0);
    const header = readFeatureTable(join(dir, "seeded", "features.csv")).header;
    expect(header.filter((name) => name.startsWith("z_"))).toEqual([
      "z_shuffle_betti_d0_dens0.1",
      "z_shuffle_betti_d1_dens0.1",
    ]);
    const reseeded = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "seeded"),
      "--spec",
      join(dir, "seeded", "spec.json"),
      "--null-seed",
      "2",
    ]);
    expect(reseeded.status).toBe(2);
    expect(reseeded.stderr).toMatch(/nullScores\.seed: 1 → 2/);
  });
});
