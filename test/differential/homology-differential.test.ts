/**
 * Randomised differential tests, each computation under a hard time bound: thousands of seeded small graphs
 * of many shapes (test/support/differential-cases.ts) go through both clique layouts of the barcode, the
 * independent rank path (bettiAt: ranks of boundary matrices, Hatcher 2002 §2.1), simplex counts at every
 * threshold and the one-pass sweep; the results must agree with each other and with the Euler–Poincaré
 * relation χ = Σ(−1)^k c_k = Σ(−1)^k β_k (common practice; e.g. Hatcher, Algebraic Topology, Thm 2.44).
 * A case that does not finish within the bound fails the test and names its seed instead of stalling CI.
 * CLIQUESCAPE_DIFFERENTIAL_SEED varies the seeds (the default keeps runs reproducible).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { buildCore } from "../support/built-core.js";
import { differentialCases } from "../support/differential-cases.js";
import { runDifferentialCases } from "../support/differential-check.js";

const BASE_SEED = Number(process.env.CLIQUESCAPE_DIFFERENTIAL_SEED ?? 20261202);

beforeAll(() => buildCore(), 120_000);

describe("differential: barcode layouts, rank path, counts and sweep agree, each case time-bounded", () => {
  it("2,000 undirected graphs: dense and sparse clique layouts", async () => {
    const cases = differentialCases(2000, BASE_SEED, false);
    // Over Z/2 the sweep over bands is forced too, each way it can end (test/support/band-sweep-policies.ts).
    const { outcomes, failures, ranked, dims, usedDim, withClass } = await runDifferentialCases(cases, [
      "dense",
      "sparse",
      "dense/wholeFiltration",
      "sparse/earlyHandOff",
      "dense/oneBand",
      "sparse/entryCap",
    ]);
    expect(failures.slice(0, 20)).toEqual([]);
    expect(outcomes).toHaveLength(2000);
    expect(ranked).toBe(2000);
    expect(dims).toBe(5);
    // The cases reach every dimension: ≥ 300 computed to each of H1..H5, classes up to H3 in many.
    expect(Math.min(...usedDim.slice(1))).toBeGreaterThanOrEqual(300);
    expect(withClass[1]).toBeGreaterThanOrEqual(1000);
    expect(withClass[2]).toBeGreaterThanOrEqual(200);
    expect(withClass[3]).toBeGreaterThanOrEqual(30);
  }, 900_000);

  it("800 directed graphs: flag tables against the rank path", async () => {
    const cases = differentialCases(800, BASE_SEED + 100_000, true);
    const { outcomes, failures, dims, withClass } = await runDifferentialCases(cases, [
      "tables",
      "tables/wholeFiltration",
      "tables/earlyHandOff",
      "tables/oneBand",
    ]);
    expect(failures.slice(0, 20)).toEqual([]);
    expect(outcomes).toHaveLength(800);
    expect(dims).toBe(5);
    expect(withClass[2]).toBeGreaterThanOrEqual(150);
    expect(withClass[4]).toBeGreaterThanOrEqual(20);
  }, 900_000);
});
