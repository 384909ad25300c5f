/**
 * Which kernel counts (countSimplices, sweepSimplexCounts): results are the same either way, so only the
 * calls into the WebAssembly kernel show the choice.
 *
 * Which way the sweep counts (sweep-simplex-counts.ts, perThresholdPays): one plain WebAssembly count per
 * threshold when the top level of a graph of that density outnumbers the level below by more than T / 2,
 * else one annotated enumeration for all thresholds. Both give the same counts (count-simplices.test.ts,
 * test/differential/); a wrong choice costs time only, which no other test sees. Here the plain kernel is
 * watched, and the formula worked by hand at both sides of its boundary:
 *   density ρ = kept slots / (n(n − 1)) (an undirected edge is two slots), ratio = (n − d)/(d + 1) · ρ^d,
 *   d = maxDim; per threshold iff n ≥ 2, d finite and ≥ 2, and ratio > T / 2.
 */
import { beforeEach, describe, expect, it, vi } from "vitest";
import { explicitGrid } from "../filtration/threshold-grid.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { countSimplices } from "./count-simplices.js";
import { sweepSimplexCounts } from "./sweep-simplex-counts.js";
import { countWithWasm } from "./wasm/wasm-counter.js";

vi.mock("./wasm/wasm-counter.js", async (importOriginal) => {
  const actual = await importOriginal<typeof import("./wasm/wasm-counter.js")>();
  return { ...actual, countWithWasm: vi.fn(actual.countWithWasm) };
});

beforeEach(() => {
  vi.mocked(countWithWasm).mockClear();
});

/** n vertices; `present` edges of weight 1 and `absent` of weight 9, the first pairs in (u, v) order. */
function graphOf(n: number, present: number, absent = 0) {
  const sources: number[] = [];
  const targets: number[] = [];
  for (let u = 0; u < n; u++)
    for (let v = u + 1; v < n; v++)
      if (sources.length < present + absent) {
        sources.push(u);
        targets.push(v);
      }
  expect(sources.length).toBe(present + absent);
  const weights = sources.map((_, i) => (i < present ? 1 : 9));
  return fromEdgeList({ n, directed: false, sources, targets, weights });
}

/** Plain WebAssembly counts made by one sweep on the grid 1..T (distances). */
function plainCounts(graph: ReturnType<typeof graphOf>, T: number, maxDim: number, kernel?: "typescript") {
  vi.mocked(countWithWasm).mockClear();
  const grid = explicitGrid(
    Array.from({ length: T }, (_, t) => t + 1),
    "distance",
  );
  sweepSimplexCounts(graph, grid, { maxDim, kernel });
  return vi.mocked(countWithWasm).mock.calls.length;
}

describe("the sweep's choice between per-threshold counts and one enumeration", () => {
  it("pays just above the boundary: n = 12, 28 of 66 edges, maxDim 2, one threshold", () => {
    // ρ = 56/132 = 0.4242, ratio = 10/3 · 0.18 = 0.600 > 1/2. Near misses that must not pass: ρ from
    // n(n + 1) gives 0.430; ratio > 2T needs 2; edges in bin 0 not counted give ρ = 0.
    expect(plainCounts(graphOf(12, 28), 1, 2)).toBe(1);
    // asked for the TypeScript kernel by name, the sweep never uses WebAssembly
    expect(plainCounts(graphOf(12, 28), 1, 2, "typescript")).toBe(0);
  });

  it("does not pay just below it, and edges beyond the last threshold do not count towards the density", () => {
    // 24 edges at weight 1, 24 at weight 9 (beyond the grid): ρ = 48/132 = 0.3636, ratio = 10/3 · 0.1322
    // = 0.441 < 1/2. Near misses: counting the 24 absent edges (ratio 1.76), (n + d)/(d + 1) (0.617),
    // (n − d)(d + 1) (3.97), dividing by ρ^d (25.2), ρ^(d − 1) (1.21), ρ = kept · n(n − 1) or kept/(n/(n − 1))
    // (huge).
    expect(plainCounts(graphOf(12, 24, 24), 1, 2)).toBe(0);
  });

  it("at exactly ratio = T / 2 it does not pay: K11 to maxDim 3 over four thresholds", () => {
    // ρ = 1, ratio = (11 − 3)/(3 + 1) = 2 = 4/2
    expect(plainCounts(graphOf(11, 55), 4, 3)).toBe(0);
    // and with three thresholds 2 > 3/2: one plain count per threshold
    expect(plainCounts(graphOf(11, 55), 3, 3)).toBe(3);
  });

  it("never below maxDim 2 (there is no level to popcount), however dense", () => {
    // K11 to maxDim 1 would give ratio (11 − 1)/2 = 5 > 1/2 without that rule
    expect(plainCounts(graphOf(11, 55), 1, 1)).toBe(0);
  });

  it("per threshold, edges beyond the last threshold stay out of every threshold's graph", () => {
    // the first three pairs, a star 0–1, 0–2, 0–3, at weight 1; the fourth pair 1–2 at weight 9, beyond the
    // grid 1..3, would close the triangle 0–1–2. Forced onto the per-threshold path; hand count at every
    // threshold: 4 vertices, 3 edges, no triangle
    const s = sweepSimplexCounts(graphOf(4, 3, 1), explicitGrid([1, 2, 3], "distance"), {
      maxDim: 2,
      kernel: "webassembly",
    });
    expect(s.counts.map((row) => Array.from(row))).toEqual([
      [4, 3],
      [4, 3],
      [4, 3],
    ]);
  });
});

describe("countSimplices honours the kernel asked for", () => {
  it('"typescript" never calls the WebAssembly kernel; "auto" and "webassembly" do, with the same counts', () => {
    const k11 = graphOf(11, 55);
    const counts: number[][] = [];
    for (const [kernel, calls] of [
      ["typescript", 0],
      ["auto", 1],
      ["webassembly", 1],
    ] as const) {
      vi.mocked(countWithWasm).mockClear();
      counts.push(Array.from(countSimplices(k11, { maxDim: 2, kernel }).counts));
      expect(vi.mocked(countWithWasm).mock.calls.length, kernel).toBe(calls);
    }
    // K11: C(11, 1), C(11, 2), C(11, 3) (common practice)
    expect(counts).toEqual([
      [11, 55, 165],
      [11, 55, 165],
      [11, 55, 165],
    ]);
  });
});
