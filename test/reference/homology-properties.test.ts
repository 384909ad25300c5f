/**
 * Property tests (fast-check) of the homology engine against the counting core and against itself:
 * - Euler–Poincaré: χ = Σ (−1)^k β_k with χ from countSimplices (common practice; A. Hatcher, Algebraic
 *   Topology, 2002, Thm. 2.44), at every threshold, with β read off the barcode;
 * - relabelling the vertices leaves the barcode's intervals unchanged (common practice: homology is a
 *   topological invariant);
 * - the undirected graph and its symmetric directed version: every clique with its vertices in any order is
 *   a directed simplex, so the directed flag complex of a symmetric digraph differs, but its β_0 equals the
 *   clique complex's (same components).
 */
import {
  bettiFromBarcode,
  computeBarcode,
  countSimplices,
  fromEdgeList,
  type WeightedGraph,
} from "@cliquescape/core";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { relabel } from "../support/graph-ops.js";
import { symmetricDigraph } from "../support/known-graphs.js";
import { seededRandom } from "../support/random.js";

function randomWeighted(
  n: number,
  p: number,
  levels: number,
  directed: boolean,
  seed: number,
): WeightedGraph {
  const random = seededRandom(seed);
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < n; u++) {
    for (let v = directed ? 0 : u + 1; v < n; v++) {
      if (u === v || random() >= p) continue;
      sources.push(u);
      targets.push(v);
      weights.push(1 + Math.floor(random() * levels));
    }
  }
  return fromEdgeList({ n, sources, targets, weights, directed });
}

const graphs = (directed: boolean) =>
  fc
    .record({
      n: fc.integer({ min: 1, max: directed ? 7 : 10 }),
      p: fc.double({ min: 0.1, max: 1, noNaN: true }),
      levels: fc.integer({ min: 1, max: 6 }),
      seed: fc.integer({ min: 1, max: 1 << 30 }),
    })
    .map(({ n, p, levels, seed }) => randomWeighted(n, p, levels, directed, seed));

describe("Euler–Poincaré against the counting core", () => {
  for (const directed of [false, true]) {
    it(`${directed ? "directed" : "undirected"}: χ = Σ (−1)^k β_k at every threshold`, () => {
      fc.assert(
        fc.property(graphs(directed), fc.constantFrom(2, 3, 7), (graph, prime) => {
          // Homology in every dimension the complex has: its dimension is below n.
          const maxDim = Math.max(0, graph.n - 1);
          const barcode = computeBarcode(graph, { semantics: "distance", maxDim, prime });
          for (const threshold of [0, 1, 2, 3, 4, 5, 6]) {
            const { euler } = countSimplices(graph, { threshold, semantics: "distance" });
            const betti = bettiFromBarcode(barcode, threshold);
            expect(betti.reduce((sum, b, k) => sum + (k % 2 === 0 ? b : -b), 0)).toBe(euler);
          }
        }),
        { numRuns: 60 },
      );
    });
  }
});

describe("invariances", () => {
  it("relabelling vertices keeps the intervals", () => {
    fc.assert(
      fc.property(graphs(false), fc.integer({ min: 1, max: 1000 }), (graph, seed) => {
        const random = seededRandom(seed);
        const perm = Array.from({ length: graph.n }, (_, i) => i);
        for (let i = perm.length - 1; i > 0; i--) {
          const j = Math.floor(random() * (i + 1));
          [perm[i], perm[j]] = [perm[j], perm[i]];
        }
        const intervals = (g: WeightedGraph) =>
          computeBarcode(g, { semantics: "similarity", maxDim: 2 })
            .bars.map((b) => `${b.dim}:${b.birth}:${b.death}`)
            .sort();
        expect(intervals(relabel(graph, perm))).toEqual(intervals(graph));
      }),
      { numRuns: 60 },
    );
  });

  it("a graph and its symmetric digraph have the same H0 bars", () => {
    fc.assert(
      fc.property(graphs(false), (graph) => {
        const h0 = (g: WeightedGraph) =>
          computeBarcode(g, { semantics: "distance", maxDim: 0 })
            .bars.map((b) => `${b.birth}:${b.death}`)
            .sort();
        expect(h0(symmetricDigraph(graph))).toEqual(h0(graph));
      }),
      { numRuns: 60 },
    );
  });
});
