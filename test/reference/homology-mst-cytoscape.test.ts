/**
 * H0 deaths are the weights of a minimum spanning forest (union–find in filtration order is Kruskal's
 * algorithm; common practice). Reference: cytoscape's `eles.kruskal(weightFn)`, a general-purpose graph
 * library, run on the same edges. For similarity weights the forest is a maximum one (Kruskal on −w).
 */
import { computeBarcode, fromEdgeList } from "@cliquescape/core";
import cytoscape from "cytoscape";
import { describe, expect, it } from "vitest";
import { seededRandom } from "../support/random.js";

interface Edges {
  n: number;
  sources: number[];
  targets: number[];
  weights: number[];
}

function randomEdges(n: number, p: number, seed: number, levels: number): Edges {
  const random = seededRandom(seed);
  const edges: Edges = { n, sources: [], targets: [], weights: [] };
  for (let u = 0; u < n; u++) {
    for (let v = u + 1; v < n; v++) {
      if (random() >= p) continue;
      edges.sources.push(u);
      edges.targets.push(v);
      // A few discrete levels make ties common; levels = 0 draws continuous weights.
      edges.weights.push(levels > 0 ? 1 + Math.floor(random() * levels) : 0.5 + random());
    }
  }
  return edges;
}

function kruskalWeights(edges: Edges, sign: 1 | -1): number[] {
  const cy = cytoscape({
    headless: true,
    elements: [
      ...Array.from({ length: edges.n }, (_, v) => ({ data: { id: `n${v}` } })),
      ...edges.sources.map((u, i) => ({
        data: { id: `e${i}`, source: `n${u}`, target: `n${edges.targets[i]}`, weight: edges.weights[i] },
      })),
    ],
  });
  const forest = cy.elements().kruskal((edge) => sign * edge.data("weight"));
  return forest
    .edges()
    .map((edge) => edge.data("weight") as number)
    .sort((a, b) => a - b);
}

describe("H0 deaths against cytoscape's Kruskal spanning forest", () => {
  const cases = [
    { n: 40, p: 0.08, levels: 0 }, // sparse, several components
    { n: 40, p: 0.3, levels: 0 },
    { n: 60, p: 0.2, levels: 3 }, // many ties
    { n: 25, p: 1, levels: 5 },
  ];
  for (const { n, p, levels } of cases) {
    for (const seed of [11, 12, 13]) {
      it(`n=${n}, p=${p}, ${levels ? `${levels} weight levels` : "continuous weights"}, seed ${seed}`, () => {
        const edges = randomEdges(n, p, seed, levels);
        const graph = fromEdgeList({ ...edges, directed: false });
        for (const semantics of ["distance", "similarity"] as const) {
          const barcode = computeBarcode(graph, { semantics, maxDim: 0, keepZeroLength: true });
          const h0 = barcode.bars.filter((b) => b.dim === 0);
          const deaths = h0
            .filter((b) => b.death !== null)
            .map((b) => b.death as number)
            .sort((a, b) => a - b);
          const reference = kruskalWeights(edges, semantics === "distance" ? 1 : -1);
          expect(deaths).toEqual(reference);
          // One essential class per component: n − (forest edges).
          expect(h0.filter((b) => b.death === null).length).toBe(n - reference.length);
        }
      });
    }
  }
});
