import { afterEach, describe, expect, it, vi } from "vitest";
import { tickingClock } from "../../../../test/support/ticking-clock.js";
import { countSimplices } from "../count/count-simplices.js";
import { SimplexBudgetError } from "../count/simplex-budget-error.js";
import { sweepSimplexCounts } from "../count/sweep-simplex-counts.js";
import { evenGrid } from "../filtration/threshold-grid.js";
import { fromDenseMatrix } from "../graph/from-dense-matrix.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { computeBarcode } from "../homology/compute-barcode.js";
import { TimeLimitError } from "./time-limit-error.js";
import type { WorkProgress } from "./work-control.js";

/** Complete graph on n vertices with distinct pseudo-random weights in (0, 1) (a fixed LCG). */
function completeGraph(n: number, directed = false) {
  const values = new Float64Array(n * n);
  let state = 12345;
  for (let i = 0; i < n * n; i++) {
    state = (state * 1103515245 + 12345) % 2147483648;
    values[i] = (state + 1) / 2147483649;
  }
  for (let i = 0; i < n; i++)
    for (let j = 0; j < i; j++) if (!directed) values[i * n + j] = values[j * n + i];
  return fromDenseMatrix(n, values, { directed });
}

/** Complete multipartite graph K_{2,…,2}: 2·parts vertices, every pair an edge except 2i–(2i+1). */
function cocktailParty(parts: number) {
  const sources: number[] = [];
  const targets: number[] = [];
  for (let u = 0; u < 2 * parts; u++)
    for (let v = u + 1; v < 2 * parts; v++)
      if (v !== (u ^ 1)) {
        sources.push(u);
        targets.push(v);
      }
  return fromEdgeList({ n: 2 * parts, directed: false, sources, targets, weights: sources.map(() => 1) });
}

afterEach(() => {
  vi.restoreAllMocks();
});

describe("time limits", () => {
  // K_{2,…,2} with 20 parts: 3^20 − 1 ≈ 3.5·10^9 simplices (each part gives none, one or the other vertex),
  // and no candidate set is a clique, so no kernel can count a subtree in closed form (K_40 it can).
  it.each(["webassembly", "typescript"] as const)(
    "stop a count of K_{2,…,2} (3^20 simplices) with the stage and how far it got (%s kernel)",
    (kernel) => {
      const started = Date.now();
      let error: unknown;
      try {
        countSimplices(cocktailParty(20), { timeLimitMs: 50, budget: Number.POSITIVE_INFINITY, kernel });
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(TimeLimitError);
      const { progress, limitMs } = error as TimeLimitError;
      expect(limitMs).toBe(50);
      expect(progress.stage).toBe("counting simplices");
      expect(progress.total).toBe(40);
      expect(progress.elapsedMs).toBeGreaterThan(50);
      // It stops soon after the limit: a check comes every 2^20 simplices at the latest.
      expect(Date.now() - started).toBeLessThan(5000);
    },
  );

  it("stop a sweep the same way", () => {
    const g = completeGraph(40);
    expect(() =>
      sweepSimplexCounts(g, evenGrid(1, 0, 5, "similarity"), {
        timeLimitMs: 50,
        budget: Number.POSITIVE_INFINITY,
      }),
    ).toThrow(TimeLimitError);
  });

  it("stop a barcode of a complete 160-vertex graph to H2 with the stage it was in", () => {
    const graph = completeGraph(160);
    let error: unknown;
    const started = Date.now();
    try {
      computeBarcode(graph, { semantics: "distance", maxDim: 2, timeLimitMs: 100 });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(TimeLimitError);
    const { progress } = error as TimeLimitError;
    // Where it stops depends on the machine's speed; that it stops soon with a stage does not.
    expect(["listing simplices", "reducing columns", "pairing components"]).toContain(progress.stage);
    expect((error as Error).message).toMatch(/^time limit of 0\.1 s reached while .* of dimension \d/);
    // Unbounded, it runs for tens of seconds; a generous bound for loaded machines.
    expect(Date.now() - started).toBeLessThan(30_000);
  });

  it("stop a directed barcode while its tables are built", () => {
    // 60 vertices, every arc both ways: 60·59·58·57 directed 3-simplices are listed for H2.
    expect(() =>
      computeBarcode(completeGraph(60, true), { semantics: "distance", maxDim: 2, timeLimitMs: 30 }),
    ).toThrow(TimeLimitError);
  });
});

describe("progress", () => {
  it("reports each stage with counts that only grow within it, at most once per interval", () => {
    tickingClock();
    const seen: WorkProgress[] = [];
    computeBarcode(completeGraph(30), {
      semantics: "distance",
      maxDim: 2,
      onProgress: (p) => seen.push(p),
    });
    const stages = new Set(seen.map((p) => `${p.stage}/${p.dim}`));
    expect(stages).toContain("pairing components/0");
    expect(stages).toContain("reducing columns/1");
    expect(stages).toContain("reducing columns/2");
    for (let i = 1; i < seen.length; i++) {
      expect(seen[i].elapsedMs - seen[i - 1].elapsedMs).toBeGreaterThanOrEqual(1000);
      if (seen[i].stage === seen[i - 1].stage && seen[i].dim === seen[i - 1].dim)
        expect(seen[i].done).toBeGreaterThanOrEqual(seen[i - 1].done);
    }
    const reducing = seen.find((p) => p.stage === "reducing columns" && p.dim === 1);
    // 435 edges of K_30 are the columns of dimension 1.
    expect(reducing?.total).toBe(435);
  });
});

describe("barcode simplex budget", () => {
  // K_10 lists 10 vertices, 45 edges and 120 triangles for H0–H2 (C(10, k+1); common practice).
  it("passes when the listed simplices fit and stops with per-dimension counts when not", () => {
    const g = completeGraph(10);
    expect(() => computeBarcode(g, { semantics: "distance", maxDim: 2, maxSimplices: 175 })).not.toThrow();
    let error: unknown;
    try {
      computeBarcode(g, { semantics: "distance", maxDim: 2, maxSimplices: 100 });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(SimplexBudgetError);
    const counted = Array.from((error as SimplexBudgetError).counted);
    expect(counted.slice(0, 2)).toEqual([10, 45]);
    expect(counted[2]).toBeGreaterThan(45);
    expect((error as Error).message).toMatch(/with all 1-simplices done/);
  });

  it("counts a directed complex's tables up to maxDim + 1", () => {
    // Directed K_5 with every arc both ways: 5, 20, 60, 120 ordered simplices of dims 0..3 (5!/(5-k-1)!).
    const g = completeGraph(5, true);
    expect(() => computeBarcode(g, { semantics: "distance", maxDim: 2, maxSimplices: 205 })).not.toThrow();
    expect(() => computeBarcode(g, { semantics: "distance", maxDim: 2, maxSimplices: 204 })).toThrow(
      SimplexBudgetError,
    );
  });
});
