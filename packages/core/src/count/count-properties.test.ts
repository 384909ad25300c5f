import type { WeightedGraph } from "../graph/weighted-graph.js";

/**
 * Slow, obviously-correct reference for the tests: lists every simplex by trying every vertex subset
 * (undirected: all pairs adjacent) or every ordering of it (directed: an arc vi→vj for all i<j),
 * straight from the definitions. Only for graphs of a few vertices.
 */
export interface BruteSimplex {
  vertices: number[]; // in simplex order (directed: v0..vk)
  slots: number[]; // CSR slots of its edges (both slots for undirected edges)
  maxWeightF: number; // largest edge filtration value (−∞ for a vertex)
}

export function slotOf(g: WeightedGraph, u: number, v: number): number {
  for (let s = g.offsets[u]; s < g.offsets[u + 1]; s++) if (g.targets[s] === v) return s;
  return -1;
}

export function bruteSimplices(g: WeightedGraph, f: (slot: number) => number = () => 0): BruteSimplex[] {
  const out: BruteSimplex[] = [];
  const n = g.n;
  for (let mask = 1; mask < 1 << n; mask++) {
    const set: number[] = [];
    for (let v = 0; v < n; v++) if (mask & (1 << v)) set.push(v);
    const orders = g.directed ? permutations(set) : [set];
    for (const order of orders) {
      const slots: number[] = [];
      let ok = true;
      let maxF = Number.NEGATIVE_INFINITY;
      for (let i = 0; i < order.length && ok; i++) {
        for (let j = i + 1; j < order.length; j++) {
          const s = slotOf(g, order[i], order[j]);
          if (s < 0) {
            ok = false;
            break;
          }
          slots.push(s);
          if (!g.directed) slots.push(slotOf(g, order[j], order[i]));
          maxF = Math.max(maxF, f(s));
        }
      }
      if (ok) out.push({ vertices: order, slots, maxWeightF: maxF });
    }
  }
  return out;
}

function permutations(a: number[]): number[][] {
  if (a.length <= 1) return [a.slice()];
  const out: number[][] = [];
  for (let i = 0; i < a.length; i++) {
    const rest = a.slice(0, i).concat(a.slice(i + 1));
    for (const p of permutations(rest)) out.push([a[i], ...p]);
  }
  return out;
}

// ---------------------------------------------------------------------------------------------------------
// Property tests: the counters against the brute force on random small graphs (fast-check).

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { edgeFiltration } from "../filtration/edge-filtration.js";
import { explicitGrid } from "../filtration/threshold-grid.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { countSimplices } from "./count-simplices.js";
import { sweepSimplexCounts } from "./sweep-simplex-counts.js";

const arbGraph = fc
  .record({
    n: fc.integer({ min: 1, max: 7 }),
    directed: fc.boolean(),
    p: fc.double({ min: 0.2, max: 1, noNaN: true }),
  })
  .chain(({ n, directed, p }) => {
    const pairs: [number, number][] = [];
    for (let u = 0; u < n; u++)
      for (let v = directed ? 0 : u + 1; v < n; v++) if (u !== v) pairs.push([u, v]);
    return fc
      .array(fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.integer({ min: 1, max: 5 })), {
        minLength: pairs.length,
        maxLength: pairs.length,
      })
      .map((draws) => {
        const kept = pairs.filter((_, i) => draws[i][0] < p);
        const weights = pairs.map((_, i) => draws[i][1]).filter((_, i) => draws[i][0] < p);
        return fromEdgeList({
          n,
          directed,
          sources: kept.map((e) => e[0]),
          targets: kept.map((e) => e[1]),
          weights,
        });
      });
  });

function tally(simplices: BruteSimplex[], g: WeightedGraph) {
  const top = Math.max(0, ...simplices.map((s) => s.vertices.length - 1));
  const counts = new Float64Array(top + 1);
  const member = Array.from({ length: top + 1 }, () => new Float64Array(g.n));
  const source = Array.from({ length: top + 1 }, () => new Float64Array(g.n));
  const sink = Array.from({ length: top + 1 }, () => new Float64Array(g.n));
  const edges = Array.from({ length: top + 1 }, () => new Float64Array(g.targets.length));
  for (const s of simplices) {
    const k = s.vertices.length - 1;
    counts[k]++;
    for (const v of s.vertices) member[k][v]++;
    source[k][s.vertices[0]]++;
    sink[k][s.vertices[k]]++;
    for (const slot of s.slots) edges[k][slot]++;
  }
  return { counts, member, source, sink, edges };
}

describe("counting against brute-force enumeration (random graphs up to 7 vertices)", () => {
  it("counts, node participation (member/source/sink) and edge participation agree", () => {
    fc.assert(
      fc.property(arbGraph, (g) => {
        const want = tally(bruteSimplices(g), g);
        const fast = countSimplices(g);
        expect(Array.from(fast.counts)).toEqual(Array.from(want.counts));
        const full = countSimplices(g, { participation: true, edgeParticipation: true });
        expect(Array.from(full.counts)).toEqual(Array.from(want.counts));
        expect(full.participation!.member.map((a) => Array.from(a))).toEqual(
          want.member.map((a) => Array.from(a)),
        );
        if (g.directed) {
          expect(full.participation!.source!.map((a) => Array.from(a))).toEqual(
            want.source.map((a) => Array.from(a)),
          );
          expect(full.participation!.sink!.map((a) => Array.from(a))).toEqual(
            want.sink.map((a) => Array.from(a)),
          );
        } else {
          expect(full.participation!.source).toBeUndefined();
        }
        // row 0 of the edge table is all zeros by definition; rows ≥ 1 count simplices through each slot
        expect(full.edgeParticipation!.map((a) => Array.from(a))).toEqual(
          want.edges.map((a) => Array.from(a)),
        );
      }),
      { numRuns: 300 },
    );
  });

  it("the one-pass sweep equals a separate count at every threshold, and both equal the brute force", () => {
    fc.assert(
      fc.property(
        arbGraph,
        fc.constantFrom<"distance" | "similarity">("distance", "similarity"),
        (g, semantics) => {
          const f = edgeFiltration(g, semantics);
          const all = bruteSimplices(g, (s) => f[s]);
          const grid = explicitGrid([0, 1, 2, 3, 4, 5, 2.5], semantics);
          const sweep = sweepSimplexCounts(g, grid);
          expect(sweep.thresholds.length).toBe(7);
          for (let t = 0; t < grid.thresholds.length; t++) {
            const threshold = grid.thresholds[t];
            const cut = semantics === "distance" ? threshold : -threshold;
            const want = tally(
              all.filter((s) => s.maxWeightF <= cut),
              g,
            ).counts;
            const single = countSimplices(g, { threshold, semantics });
            expect(Array.from(single.counts)).toEqual(Array.from(want));
            const row = Array.from(sweep.counts[t]);
            while (row.length > want.length && row[row.length - 1] === 0) row.pop();
            expect(row).toEqual(Array.from(want));
            let chi = 0;
            want.forEach((c, k) => {
              chi += k % 2 === 0 ? c : -c;
            });
            expect(sweep.euler[t]).toBe(chi);
            expect(single.euler).toBe(chi);
          }
        },
      ),
      { numRuns: 200 },
    );
  });

  it("maxDim keeps the lower counts and sets truncated exactly when higher simplices exist", () => {
    fc.assert(
      fc.property(arbGraph, fc.integer({ min: 0, max: 4 }), (g, maxDim) => {
        const want = tally(bruteSimplices(g), g).counts;
        const expectTruncated = want.length - 1 > maxDim;
        const expected = Array.from(want.slice(0, maxDim + 1));
        for (const r of [countSimplices(g, { maxDim }), countSimplices(g, { maxDim, participation: true })]) {
          expect(Array.from(r.counts)).toEqual(expected);
          expect(r.truncated).toBe(expectTruncated);
        }
        const sweep = sweepSimplexCounts(g, explicitGrid([10], "distance"), { maxDim });
        expect(Array.from(sweep.counts[0])).toEqual(expected);
        expect(sweep.truncated).toBe(expectTruncated);
      }),
      { numRuns: 200 },
    );
  });
});
