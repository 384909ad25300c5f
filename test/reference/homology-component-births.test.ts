/**
 * Dimension 0 bars carry a birth simplex: the vertex that names the younger of the two components an edge
 * joins (packages/core/src/homology/barcode.ts). Vertices all enter at the start in index order, so a
 * component's age is given by its smallest vertex, and a merge kills the component whose smallest vertex
 * is larger — the elder rule (H. Edelsbrunner and J. Harer, Computational Topology: An Introduction, 2010,
 * §VII.1; statement recalled from memory). The deaths are the weights of a minimum spanning forest
 * (Kruskal's algorithm), checked elsewhere; here the labels are checked, first on graphs worked by hand,
 * then on random graphs against networkx's connected components (`networkx.connected_components`).
 */
import { computeBarcode, fromEdgeList, type WeightedGraph } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { missingPythonModules, runPythonScript } from "../support/python.js";
import { seededRandom } from "../support/random.js";

function graphOf(n: number, edges: [number, number, number][], directed = false): WeightedGraph {
  return fromEdgeList({
    n,
    sources: edges.map((e) => e[0]),
    targets: edges.map((e) => e[1]),
    weights: edges.map((e) => e[2]),
    directed,
  });
}

const h0 = (graph: WeightedGraph, semantics: "distance" | "similarity" = "distance") =>
  computeBarcode(graph, { semantics, maxDim: 0 })
    .bars.filter((b) => b.dim === 0)
    .map(({ birth, death, birthSimplex, deathSimplex }) => ({ birth, death, birthSimplex, deathSimplex }));

describe("H0 birth simplices on graphs worked by hand (the elder rule)", () => {
  it("a path 0–1–2–3 whose edges enter from the far end: each merge names the younger side's oldest vertex", () => {
    // t=1: {2} meets {3}; 3 is younger.  t=2: {1} meets {2,3}, whose oldest vertex 2 is younger than 1.
    // t=3: {0} meets {1,2,3} (oldest 1): 1.  Vertex 0 never dies.
    const graph = graphOf(4, [
      [2, 3, 1],
      [1, 2, 2],
      [0, 1, 3],
    ]);
    expect(h0(graph)).toEqual([
      { birth: 0, death: 1, birthSimplex: [3], deathSimplex: [2, 3] },
      { birth: 0, death: 2, birthSimplex: [2], deathSimplex: [1, 2] },
      { birth: 0, death: 3, birthSimplex: [1], deathSimplex: [0, 1] },
      { birth: 0, death: null, birthSimplex: [0], deathSimplex: null },
    ]);
  });

  it("merges of two grown components are named by the younger component's oldest vertex, not by the edge's ends", () => {
    // t=1 {0,5}: 5 dies.  t=2 {1,4}: 4 dies.  t=3 {2,3}: 3 dies.
    // t=4 edge 4–5 joins {0,5} (oldest 0) and {1,4} (oldest 1): 1 dies, though neither end is 1.
    // t=5 edge 3–4 joins {2,3} (oldest 2) and {0,1,4,5} (oldest 0): 2 dies.
    const graph = graphOf(6, [
      [0, 5, 1],
      [1, 4, 2],
      [2, 3, 3],
      [4, 5, 4],
      [3, 4, 5],
    ]);
    expect(h0(graph)).toEqual([
      { birth: 0, death: 1, birthSimplex: [5], deathSimplex: [0, 5] },
      { birth: 0, death: 2, birthSimplex: [4], deathSimplex: [1, 4] },
      { birth: 0, death: 3, birthSimplex: [3], deathSimplex: [2, 3] },
      { birth: 0, death: 4, birthSimplex: [1], deathSimplex: [4, 5] },
      { birth: 0, death: 5, birthSimplex: [2], deathSimplex: [3, 4] },
      { birth: 0, death: null, birthSimplex: [0], deathSimplex: null },
    ]);
  });

  it("an edge inside a component kills nothing, and every component left keeps its oldest vertex", () => {
    // Triangle 1–2–3 (2–3 at t=1, 1–3 at t=2, 1–2 at t=3 closes a loop) and the edge 4–6; 0 and 5 alone.
    const graph = graphOf(7, [
      [2, 3, 1],
      [1, 3, 2],
      [1, 2, 3],
      [4, 6, 4],
    ]);
    expect(h0(graph)).toEqual([
      { birth: 0, death: 1, birthSimplex: [3], deathSimplex: [2, 3] },
      { birth: 0, death: 2, birthSimplex: [2], deathSimplex: [1, 3] },
      { birth: 0, death: 4, birthSimplex: [6], deathSimplex: [4, 6] },
      { birth: 0, death: null, birthSimplex: [0], deathSimplex: null },
      { birth: 0, death: null, birthSimplex: [1], deathSimplex: null },
      { birth: 0, death: null, birthSimplex: [4], deathSimplex: null },
      { birth: 0, death: null, birthSimplex: [5], deathSimplex: null },
    ]);
  });

  it("similarity weights: the same merges in the same order, births at the largest weight", () => {
    const graph = graphOf(6, [
      [0, 5, 5],
      [1, 4, 4],
      [2, 3, 3],
      [4, 5, 2],
      [3, 4, 1],
    ]);
    // Edge 0–5 enters with the vertices (at 5): a bar of length zero, dropped by default.
    expect(h0(graph, "similarity").map((b) => [b.birth, b.death, b.birthSimplex[0]])).toEqual([
      [5, 4, 4],
      [5, 3, 3],
      [5, 2, 1],
      [5, 1, 2],
      [5, null, 0],
    ]);
  });

  it("directed graphs: components of the underlying graph, the arc as the death simplex", () => {
    // t=1 arc 2→1 joins {1} and {2}: 2 dies.  t=2 arc 0→2 joins {0} and {1,2} (oldest 1): 1 dies.
    const graph = graphOf(
      3,
      [
        [2, 1, 1],
        [0, 2, 2],
      ],
      true,
    );
    expect(h0(graph)).toEqual([
      { birth: 0, death: 1, birthSimplex: [2], deathSimplex: [2, 1] },
      { birth: 0, death: 2, birthSimplex: [1], deathSimplex: [0, 2] },
      { birth: 0, death: null, birthSimplex: [0], deathSimplex: null },
    ]);
  });
});

const missing = missingPythonModules(["networkx"]);

describe.skipIf(missing !== null)(
  `H0 birth simplices on random graphs against networkx's components${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    for (const seed of [1, 2, 3, 4]) {
      it(`G(40, 0.06) with distinct weights, seed ${seed}`, () => {
        const random = seededRandom(700 + seed);
        const n = 40;
        const edges: [number, number, number][] = [];
        for (let u = 0; u < n; u++)
          for (let v = u + 1; v < n; v++) if (random() < 0.06) edges.push([u, v, 0]);
        // Distinct weights 1..m in a random order.
        const order = edges.map((_, i) => i).sort(() => random() - 0.5);
        order.forEach((e, rank) => {
          edges[e][2] = rank + 1;
        });
        const bars = h0(graphOf(n, edges));
        const finite = bars.filter((b) => b.death !== null);
        const { below, at } = runPythonScript<{ below: number[][]; at: number[][] }>("component_merges.py", {
          n,
          edges,
          thresholds: finite.map((b) => b.death),
        });
        finite.forEach((bar, i) => {
          const v = bar.birthSimplex[0];
          const [a, b] = bar.deathSimplex!;
          // Just before the death the edge joins two components; v names the younger one: it is the
          // smallest vertex of its component, and the other component's smallest vertex is smaller.
          expect(below[i][a]).not.toBe(below[i][b]);
          expect(below[i][v], `bar ${i}`).toBe(v);
          expect([below[i][a], below[i][b]]).toContain(v);
          const other = below[i][a] === v ? below[i][b] : below[i][a];
          expect(other).toBeLessThan(v);
          expect(at[i][v]).toBe(other);
        });
        // The classes never killed are the final components, named by their smallest vertex.
        const finalLabels = runPythonScript<{ at: number[][] }>("component_merges.py", {
          n,
          edges,
          thresholds: [Number.MAX_VALUE], // every edge
        }).at[0];
        const essential = bars.filter((b) => b.death === null).map((b) => b.birthSimplex[0]);
        expect(essential).toEqual([...new Set(finalLabels)].sort((x, y) => x - y));
        expect(finite.length).toBeGreaterThan(10);
      });
    }
  },
);
