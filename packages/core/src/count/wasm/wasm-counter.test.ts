import { afterEach, describe, expect, it, vi } from "vitest";
import { fromEdgeList } from "../../graph/from-edge-list.js";
import { countSimplices } from "../count-simplices.js";
import { SimplexBudgetError } from "../simplex-budget-error.js";
import { countKernel } from "./count-kernel.js";

/** Complete graph K_n, undirected, or directed with every arc both ways. */
function complete(n: number, directed = false) {
  const sources: number[] = [];
  const targets: number[] = [];
  for (let u = 0; u < n; u++)
    for (let v = directed ? 0 : u + 1; v < n; v++)
      if (u !== v) {
        sources.push(u);
        targets.push(v);
      }
  return fromEdgeList({ n, directed, sources, targets, weights: sources.map(() => 1) });
}

/** C(n, k) by the multiplicative formula (exact for the small values here). */
function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}

afterEach(() => {
  vi.unstubAllGlobals();
  vi.resetModules();
});

describe("the WebAssembly counting kernel", () => {
  it("loads synchronously from the embedded bytes", () => {
    const kernel = countKernel();
    expect(kernel).not.toBeNull();
    expect(typeof kernel?.countRoots).toBe("function");
  });

  // K_n has C(n, k+1) k-simplices (common practice); K_70 spans two 64-bit words per row, K_130 three.
  it.each([5, 40, 64, 65, 70, 130])("counts K_%i like the formula and the TypeScript kernel", (n) => {
    const g = complete(n);
    const cap = { maxDim: 4, budget: Number.POSITIVE_INFINITY };
    const wasm = countSimplices(g, { ...cap, kernel: "webassembly" });
    const ts = countSimplices(g, { ...cap, kernel: "typescript" });
    expect(Array.from(wasm.counts)).toEqual(Array.from({ length: 5 }, (_, k) => binomial(n, k + 1)));
    expect(wasm).toEqual(ts);
    expect(wasm.truncated).toBe(n > 5);
  });

  it("counts a complete digraph's ordered tuples, n!/(n−k−1)! per dimension", () => {
    const g = complete(9, true);
    const wasm = countSimplices(g, { kernel: "webassembly" });
    const falling = (k: number) => Array.from({ length: k + 1 }, (_, i) => 9 - i).reduce((a, b) => a * b, 1);
    expect(Array.from(wasm.counts)).toEqual(Array.from({ length: 9 }, (_, k) => falling(k)));
    expect(wasm).toEqual(countSimplices(g, { kernel: "typescript" }));
  });

  it("stops on the budget with the counts so far, like the TypeScript kernel", () => {
    const g = complete(30, true);
    for (const kernel of ["webassembly", "typescript"] as const) {
      let caught: unknown;
      try {
        countSimplices(g, { budget: 5e6, kernel });
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(SimplexBudgetError);
      const counted = Array.from((caught as SimplexBudgetError).counted);
      expect(counted.slice(0, 2)).toEqual([30, 870]); // vertices and arcs are counted up front
      expect(counted[2]).toBeLessThanOrEqual(30 * 29 * 28);
      expect(counted.reduce((a, b) => a + b, 0)).toBeGreaterThan(5e6);
      expect((caught as SimplexBudgetError).progress).toBeLessThan(1);
    }
  });

  it("falls back to the TypeScript kernel where WebAssembly is missing, and says so when it was asked for", async () => {
    vi.stubGlobal("WebAssembly", undefined);
    vi.resetModules();
    const fresh = await import("../count-simplices.js");
    const g = complete(12);
    expect(Array.from(fresh.countSimplices(g).counts)).toEqual(
      Array.from({ length: 12 }, (_, k) => binomial(12, k + 1)),
    );
    expect(() => fresh.countSimplices(g, { kernel: "webassembly" })).toThrow(
      "the WebAssembly counting kernel is not available here, or its memory cannot hold this graph's tables " +
        '(kernel: "webassembly" was asked for; "auto" would count in TypeScript)',
    );
    const freshSweep = await import("../sweep-simplex-counts.js");
    const grid = { thresholds: Float64Array.from([1]), semantics: "distance" as const };
    expect(() => freshSweep.sweepSimplexCounts(g, grid, { maxDim: 3, kernel: "webassembly" })).toThrow(
      /WebAssembly counting kernel is not available/,
    );
  });

  it("refuses an unknown kernel name", () => {
    // @ts-expect-error: a caller from JavaScript can pass anything
    expect(() => countSimplices(complete(4), { kernel: "wasm" })).toThrow(/kernel must be "auto"/);
  });
});
