/**
 * Bottleneck and p-Wasserstein distances against the optimum of a general-purpose assignment solver from
 * Debian's packages: python3-scipy's `scipy.optimize.linear_sum_assignment` on the diagram-augmented cost
 * matrix (test/support/python/diagram_distances.py builds it independently of the core). Diagrams come from
 * real barcodes of seeded random graphs and from seeded random points, including ties and clusters of
 * nearby points (where the core's pruning and grouping matter most).
 */
import {
  bottleneckDistance,
  computeBarcode,
  diagramOf,
  finiteDiagram,
  type PersistenceDiagram,
  wassersteinDistance,
} from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { randomGraph } from "../support/known-graphs.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";
import { type Random, seededRandom } from "../support/random.js";

const missing = missingPythonModules(["scipy", "numpy"]);
const suite = missing ? describe.skip : describe;

type Points = [number, number][];

function randomPoints(random: Random, count: number, grid: number): Points {
  const points: Points = [];
  for (let i = 0; i < count; i++) {
    // Values on a coarse grid: ties between costs are common, as in barcodes of integer weights.
    const b = Math.floor(random() * grid) / 4;
    const length = Math.floor(random() * grid) / 4;
    points.push([b, b + length]);
  }
  return points;
}

function toDiagram(points: Points): PersistenceDiagram {
  return finiteDiagram(
    points.map((x) => x[0]),
    points.map((x) => x[1]),
  );
}

function toPoints(d: PersistenceDiagram): Points {
  return Array.from(d.births, (b, i) => [b, d.deaths[i]]);
}

/** Both distances of every case equal scipy's optimum (bottleneck exactly; Wasserstein in both orders). */
function expectScipyOptimum(cases: { a: Points; b: Points; p: number }[]): void {
  const expected = runPythonScript<{ wasserstein: number; bottleneck: number }[]>(
    "diagram_distances.py",
    cases,
  );
  cases.forEach((c, k) => {
    const a = toDiagram(c.a);
    const b = toDiagram(c.b);
    expect(bottleneckDistance(a, b), `case ${k}`).toBe(expected[k].bottleneck);
    expect(wassersteinDistance(a, b, c.p), `case ${k}`).toBeCloseTo(expected[k].wasserstein, 10);
    expect(wassersteinDistance(b, a, c.p), `case ${k} reversed`).toBeCloseTo(expected[k].wasserstein, 10);
  });
}

suite(`diagram distances equal scipy.optimize.linear_sum_assignment${missing ? ` (skipped: ${missing})` : ""}`, () => {
  it("on random point sets of 0 to 40 points, p = 1, 2, 3.5", () => {
    const random = seededRandom(20240610);
    const cases: { a: Points; b: Points; p: number }[] = [];
    for (let k = 0; k < 90; k++) {
      const grid = k % 3 === 0 ? 6 : 40;
      cases.push({
        a: randomPoints(random, Math.floor(random() * 41), grid),
        b: randomPoints(random, Math.floor(random() * 41), grid),
        p: [1, 2, 3.5][k % 3],
      });
    }
    expectScipyOptimum(cases);
  });

  it("on H1 diagrams of random weighted graphs", () => {
    const random = seededRandom(77);
    const diagrams: Points[] = [];
    for (let g = 0; g < 12; g++) {
      const graph = randomGraph(16 + g, 0.5, random, { weighted: true });
      const barcode = computeBarcode(graph, { semantics: "distance", maxDim: 1 });
      diagrams.push(toPoints(diagramOf(barcode, 1, { kind: "drop" })));
    }
    expect(diagrams.reduce((s, d) => s + d.length, 0)).toBeGreaterThan(30);
    const cases = diagrams.slice(1).map((b, k) => ({ a: diagrams[k], b, p: 1 + (k % 2) }));
    expectScipyOptimum(cases);
  });
  it("on ~300-bar H1 diagrams of complete graphs (clustered short bars, deaths tied at one edge)", () => {
    // The shape of the benchmark's diagrams: every pair of 90 nodes an edge with a uniform distance.
    const random = seededRandom(2026);
    const diagrams: Points[] = [];
    for (let g = 0; g < 4; g++) {
      const barcode = computeBarcode(randomGraph(90, 1, random, { weighted: true }), {
        semantics: "distance",
        maxDim: 1,
      });
      diagrams.push(toPoints(diagramOf(barcode, 1, { kind: "drop" })));
    }
    for (const d of diagrams) expect(d.length).toBeGreaterThan(200);
    const deaths = diagrams[0].map((x) => x[1]);
    expect(new Set(deaths).size).toBeLessThan(deaths.length); // ties the row reduction must get through
    const cases = [
      { a: diagrams[0], b: diagrams[1], p: 1 },
      { a: diagrams[2], b: diagrams[3], p: 1 },
      { a: diagrams[1], b: diagrams[2], p: 2 },
    ];
    expectScipyOptimum(cases);
  });
});
