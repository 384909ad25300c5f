/**
 * Properties of the diagram distances, as property tests (fast-check):
 * - both are metrics on diagrams: d(A, A) = 0, symmetry, the triangle inequality (common practice: the
 *   bottleneck and p-Wasserstein distances are extended metrics; D. Cohen-Steiner, H. Edelsbrunner, J. Harer,
 *   "Stability of persistence diagrams", Discrete Comput. Geom. 37, 2007, and D. Cohen-Steiner et al.,
 *   "Lipschitz functions have L_p-stable persistence", Found. Comput. Math. 10, 2010);
 * - stability: moving every edge weight by at most ε moves every simplex's filtration value by at most ε,
 *   so the bottleneck distance between the two barcodes, dimension by dimension, is at most ε
 *   (Cohen-Steiner, Edelsbrunner, Harer 2007, Main Theorem).
 */
import {
  bottleneckDistance,
  computeBarcode,
  diagramOf,
  finiteDiagram,
  fromEdgeList,
  type PersistenceDiagram,
  wassersteinDistance,
} from "@cliquescape/core";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { seededRandom } from "../support/random.js";

const diagrams = fc
  .array(fc.tuple(fc.integer({ min: 0, max: 60 }), fc.integer({ min: 0, max: 30 })), { maxLength: 25 })
  .map(
    (points): PersistenceDiagram =>
      finiteDiagram(
        points.map(([b]) => b / 8),
        points.map(([b, length]) => (b + length) / 8),
      ),
  );

const distances: [string, (a: PersistenceDiagram, b: PersistenceDiagram) => number][] = [
  ["bottleneck", bottleneckDistance],
  ["1-Wasserstein", (a, b) => wassersteinDistance(a, b, 1)],
  ["2-Wasserstein", (a, b) => wassersteinDistance(a, b, 2)],
];

describe("diagram distances are metrics", () => {
  for (const [name, d] of distances) {
    it(`${name}: d(A, A) = 0, symmetric, triangle inequality`, () => {
      fc.assert(
        fc.property(diagrams, diagrams, diagrams, (a, b, c) => {
          expect(d(a, a)).toBe(0);
          const ab = d(a, b);
          expect(d(b, a)).toBeCloseTo(ab, 12);
          expect(d(a, c)).toBeLessThanOrEqual(ab + d(b, c) + 1e-12);
        }),
        { numRuns: 300 },
      );
    });
  }
});

describe("stability: perturbing every weight by at most ε moves each barcode by at most ε (bottleneck)", () => {
  for (const directed of [false, true]) {
    it(`${directed ? "directed flag" : "clique"} complexes`, () => {
      fc.assert(
        fc.property(
          fc.integer({ min: 3, max: directed ? 7 : 11 }),
          fc.integer({ min: 1, max: 1 << 30 }),
          fc.double({ min: 0.001, max: 0.5, noNaN: true }),
          (n, seed, epsilon) => {
            const random = seededRandom(seed);
            const sources: number[] = [];
            const targets: number[] = [];
            const weights: number[] = [];
            const moved: number[] = [];
            for (let u = 0; u < n; u++) {
              for (let v = directed ? 0 : u + 1; v < n; v++) {
                if (u === v || random() < 0.3) continue;
                sources.push(u);
                targets.push(v);
                const w = 1 + random();
                weights.push(w);
                moved.push(w + epsilon * (2 * random() - 1));
              }
            }
            const barcode = (w: number[]) =>
              computeBarcode(fromEdgeList({ n, sources, targets, weights: w, directed }), {
                semantics: "distance",
                maxDim: 2,
              });
            const before = barcode(weights);
            const after = barcode(moved);
            for (let dim = 0; dim <= 2; dim++) {
              const a = diagramOf(before, dim, { kind: "separate" });
              const b = diagramOf(after, dim, { kind: "separate" });
              expect(bottleneckDistance(a, b)).toBeLessThanOrEqual(epsilon + 1e-12);
            }
          },
        ),
        { numRuns: 150 },
      );
    });
  }
});
