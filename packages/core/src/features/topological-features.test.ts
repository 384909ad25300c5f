import { describe, expect, it } from "vitest";
import { binomial } from "../../../../test/support/combinatorics.js";
import {
  completeGraph,
  octahedron,
  randomDigraph,
  randomGraph,
  transitiveTournament,
} from "../../../../test/support/known-graphs.js";
import { seededRandom } from "../../../../test/support/random.js";
import { sweepSimplexCounts } from "../count/sweep-simplex-counts.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { bettiCurves } from "../homology/betti-curves.js";
import { computeBarcode } from "../homology/compute-barcode.js";
import { axisGrid, type FeatureAxis } from "./feature-axis.js";
import { DEFAULT_FEATURE_CONFIG, type FeatureConfig } from "./feature-config.js";
import { topologicalFeatureNames } from "./feature-names.js";
import { topologicalFeatures } from "./topological-features.js";
import { weightedSquare } from "./weighted-square.fixture.js";

/** The feature row as a name → value map, so checks read like the columns a user sees. */
function row(
  graph: WeightedGraph,
  config: FeatureConfig,
  axis: FeatureAxis,
  semantics: "distance" | "similarity",
) {
  const names = topologicalFeatureNames(config, axis);
  const result = topologicalFeatures(graph, { config, axis, semantics });
  expect(result.values.length).toBe(names.length);
  return { get: (name: string) => columnValue(names, result.values, name), result, names };
}

function columnValue(names: string[], values: Float64Array, name: string): number {
  const i = names.indexOf(name);
  if (i < 0) throw new Error(`no column ${name}`);
  return values[i];
}

// A square 0-1-2-3 with distances 1, 2, 3, 4 and the diagonal 0-2 at 5 (hand-computed; common practice).
const square = weightedSquare();

const onlyTopology = (families: Partial<FeatureConfig["families"]>, topDim = 3): FeatureConfig => ({
  topDim,
  prime: 2,
  families: {
    simplexCounts: false,
    euler: false,
    betti: false,
    curveSummaries: false,
    barcodeSummaries: false,
    network: false,
    ...families,
  },
});

describe("topologicalFeatureNames", () => {
  it("lays out the default columns as documented and never repeats a name", () => {
    const axis: FeatureAxis = { kind: "weight", values: [0.1, 0.45, 0.9] };
    const names = topologicalFeatureNames(DEFAULT_FEATURE_CONFIG, axis);
    // 3 count curves + Euler + 3 Betti curves on 3 points, 7 curves × 3 summaries, 3 dims × 5 bar numbers.
    expect(names.length).toBe(7 * 3 + 7 * 3 + 3 * 5);
    expect(new Set(names).size).toBe(names.length);
    expect(names.slice(0, 4)).toEqual([
      "simplices_d1_w0.1",
      "simplices_d1_w0.45",
      "simplices_d1_w0.9",
      "simplices_d2_w0.1",
    ]);
    expect(names).toContain("euler_w0.45");
    expect(names).toContain("betti_d2_w0.9");
    expect(names).toContain("betti_d1_peak_at");
    expect(names).toContain("simplices_d3_area");
    expect(names).toContain("euler_max");
    expect(names.slice(-5)).toEqual([
      "bars_d2_count",
      "bars_d2_essential",
      "bars_d2_total_persistence",
      "bars_d2_max_persistence",
      "bars_d2_entropy",
    ]);
    for (const name of names) expect(name).toMatch(/^[a-z0-9_.-]+$/); // CSV-safe: no commas, quotes or spaces
  });

  it("names density columns by density", () => {
    const names = topologicalFeatureNames(onlyTopology({ euler: true }), {
      kind: "density",
      values: [0.05, 0.1, 0.2],
    });
    expect(names).toEqual(["euler_dens0.05", "euler_dens0.1", "euler_dens0.2"]);
  });

  it("gives every graph of a dataset the same columns: as many values as names, whatever the graph", () => {
    const random = seededRandom(7);
    const graphs = [square, octahedron(), completeGraph(6), randomGraph(12, 0.5, random, { weighted: true })];
    const axis: FeatureAxis = { kind: "density", values: [0, 0.25, 0.5, 1] };
    const names = topologicalFeatureNames(DEFAULT_FEATURE_CONFIG, axis);
    for (const graph of graphs) {
      const { values } = topologicalFeatures(graph, {
        config: DEFAULT_FEATURE_CONFIG,
        axis,
        semantics: "similarity",
      });
      expect(values.length).toBe(names.length);
      expect(values.every(Number.isFinite)).toBe(true);
    }
  });
});

describe("topologicalFeatures", () => {
  it("reads the octahedron as a 2-sphere once all its edges are in (A. Hatcher, Algebraic Topology, 2002)", () => {
    // K_{2,2,2} with all weights 1: 6 vertices, 12 edges, 8 triangles, no 3-simplex; Betti numbers (1, 0, 1).
    const axis: FeatureAxis = { kind: "weight", values: [0.5, 1] };
    const { get } = row(octahedron(), DEFAULT_FEATURE_CONFIG, axis, "distance");
    expect([get("simplices_d1_w1"), get("simplices_d2_w1"), get("simplices_d3_w1")]).toEqual([12, 8, 0]);
    expect(get("euler_w1")).toBe(2); // χ(S²) = 2
    expect([get("betti_d0_w1"), get("betti_d1_w1"), get("betti_d2_w1")]).toEqual([1, 0, 1]);
    // Before any edge: six isolated points.
    expect([get("simplices_d1_w0.5"), get("euler_w0.5"), get("betti_d0_w0.5"), get("betti_d2_w0.5")]).toEqual(
      [0, 6, 6, 0],
    );
    // Vertices are born at 0 (distance weights) and five of the six components merge at 1: five H0 bars of
    // length 1, so entropy ln 5. Every 1-cycle is created and filled at weight 1 (no H1 bar of positive
    // length), and the 2-sphere class never dies.
    expect([get("bars_d0_count"), get("bars_d0_essential"), get("bars_d0_total_persistence")]).toEqual([
      5, 1, 5,
    ]);
    expect(get("bars_d0_entropy")).toBeCloseTo(Math.log(5), 14);
    expect(get("bars_d1_count")).toBe(0);
    expect([get("bars_d2_count"), get("bars_d2_essential")]).toEqual([0, 1]);
  });

  it("follows the one loop of a weighted square (hand-computed, distance weights)", () => {
    const axis: FeatureAxis = { kind: "weight", values: [0, 1, 2, 3, 4, 5] };
    const { get } = row(square, DEFAULT_FEATURE_CONFIG, axis, "distance");
    const curve = (name: string) => axis.values.map((w) => get(`${name}_w${w}`));
    expect(curve("simplices_d1")).toEqual([0, 1, 2, 3, 4, 5]);
    expect(curve("simplices_d2")).toEqual([0, 0, 0, 0, 0, 2]);
    expect(curve("euler")).toEqual([4, 3, 2, 1, 0, 1]);
    expect(curve("betti_d0")).toEqual([4, 3, 2, 1, 1, 1]);
    expect(curve("betti_d1")).toEqual([0, 0, 0, 0, 1, 0]);
    // Trapezoid areas with unit steps: β0: 3.5 + 2.5 + 1.5 + 1 + 1; β1: 0.5 + 0.5.
    expect([get("betti_d0_max"), get("betti_d0_peak_at"), get("betti_d0_area")]).toEqual([4, 0, 9.5]);
    expect([get("betti_d1_max"), get("betti_d1_peak_at"), get("betti_d1_area")]).toEqual([1, 4, 1]);
    expect([get("simplices_d1_max"), get("simplices_d1_peak_at"), get("simplices_d1_area")]).toEqual([
      5, 5, 12.5,
    ]);
    expect([get("euler_max"), get("euler_peak_at")]).toEqual([4, 0]);
    // One H1 bar [4, 5): length 1; H0 bars die at 1, 2, 3.
    expect([get("bars_d1_count"), get("bars_d1_total_persistence"), get("bars_d1_max_persistence")]).toEqual([
      1, 1, 1,
    ]);
    expect(get("bars_d1_entropy")).toBe(0); // one bar: ln 1
    expect([get("bars_d0_count"), get("bars_d0_essential"), get("bars_d0_total_persistence")]).toEqual([
      3, 1, 6,
    ]);
  });

  it("takes the barcode up to the axis end by default: same Betti curves, later classes counted as essential", () => {
    // The square's loop is born at 4 and filled at 5. An axis ending at 4 never sees it die.
    const axis: FeatureAxis = { kind: "weight", values: [1, 2, 3, 4] };
    const axisRange = row(square, DEFAULT_FEATURE_CONFIG, axis, "distance");
    const fullRange = row(square, { ...DEFAULT_FEATURE_CONFIG, barcodeRange: "full" }, axis, "distance");
    for (const w of axis.values) {
      for (let k = 0; k < 3; k++)
        expect(axisRange.get(`betti_d${k}_w${w}`)).toBe(fullRange.get(`betti_d${k}_w${w}`));
    }
    expect([axisRange.get("bars_d1_count"), axisRange.get("bars_d1_essential")]).toEqual([0, 1]);
    expect([fullRange.get("bars_d1_count"), fullRange.get("bars_d1_essential")]).toEqual([1, 0]);
    expect(fullRange.get("bars_d1_total_persistence")).toBe(1);
    // A configuration that does not name the range at all reads it as "axis".
    const { barcodeRange: _, ...unnamed } = DEFAULT_FEATURE_CONFIG;
    expect(unnamed).not.toHaveProperty("barcodeRange");
    expect(Array.from(row(square, unnamed, axis, "distance").result.values)).toEqual(
      Array.from(axisRange.result.values),
    );
    expect(axisRange.result.barcode?.bars.find((b) => b.dim === 1)).toMatchObject({ birth: 4, death: null });
    expect(() =>
      row(square, { ...DEFAULT_FEATURE_CONFIG, barcodeRange: "some" as "full" }, axis, "distance"),
    ).toThrow(/barcodeRange/);
  });

  it("gives the same curves for similarity weights read along a descending axis", () => {
    // Weights 6 − w enter in the same order under similarity semantics.
    const mirrored = weightedSquare(true);
    const config = onlyTopology({ simplexCounts: true, euler: true, betti: true });
    // Axes start at the first edge: the filtration of similarity weights only starts at the largest weight.
    const distance = topologicalFeatures(square, {
      config,
      axis: { kind: "weight", values: [1, 2, 3, 4, 5] },
      semantics: "distance",
    });
    const similarity = topologicalFeatures(mirrored, {
      config,
      axis: { kind: "weight", values: [5, 4, 3, 2, 1] },
      semantics: "similarity",
    });
    expect(Array.from(similarity.values)).toEqual(Array.from(distance.values));
  });

  it("equals sweepSimplexCounts and bettiCurves on random graphs, undirected and directed", () => {
    const random = seededRandom(2024);
    const cases: [WeightedGraph, "distance" | "similarity"][] = [
      [randomGraph(14, 0.6, random, { weighted: true }), "distance"],
      [randomGraph(11, 0.8, random, { weighted: true }), "similarity"],
      [randomDigraph(9, 0.5, random, { weighted: true }), "distance"],
    ];
    const values = [0.1, 0.3, 0.5, 0.7, 0.9];
    for (const [graph, semantics] of cases) {
      const axis: FeatureAxis = {
        kind: "weight",
        values: semantics === "distance" ? values : [...values].reverse(),
      };
      const config = { ...DEFAULT_FEATURE_CONFIG, topDim: 3 };
      const { get, result } = row(graph, config, axis, semantics);
      const grid = axisGrid(graph, axis, semantics);
      const sweep = sweepSimplexCounts(graph, grid, { maxDim: 3 });
      // Betti curves of the full filtration's barcode: the features' barcode stops at the axis end.
      const betti = bettiCurves(computeBarcode(graph, { semantics, maxDim: 2 }), grid);
      axis.values.forEach((w, t) => {
        for (let k = 1; k <= 3; k++) expect(get(`simplices_d${k}_w${w}`)).toBe(sweep.counts[t][k] ?? 0);
        expect(get(`euler_w${w}`)).toBe(sweep.euler[t]);
        for (let k = 0; k < 3; k++) expect(get(`betti_d${k}_w${w}`)).toBe(betti[t][k]);
      });
      expect(result.truncated).toBe(sweep.truncated);
    }
  });

  it("satisfies the Euler–Poincaré relation χ = Σ (−1)^k β_k in every row when no 3-simplex exists (Hatcher 2002, Thm 2.44)", () => {
    const random = seededRandom(99);
    let checked = 0;
    for (let trial = 0; trial < 20; trial++) {
      const semantics = trial % 2 === 0 ? "distance" : "similarity";
      const graph = randomGraph(10, 0.35, random, { weighted: true });
      const axis: FeatureAxis = { kind: "density", values: [0, 0.1, 0.2, 0.3, 0.4] };
      const { get } = row(graph, DEFAULT_FEATURE_CONFIG, axis, semantics);
      if (axis.values.some((d) => get(`simplices_d3_dens${d}`) > 0)) continue;
      for (const d of axis.values) {
        expect(get(`euler_dens${d}`)).toBe(
          get(`betti_d0_dens${d}`) - get(`betti_d1_dens${d}`) + get(`betti_d2_dens${d}`),
        );
      }
      checked++;
    }
    expect(checked).toBeGreaterThan(10);
  });

  it("reads a density axis with this graph's proportional thresholds, keeping columns aligned when thresholds repeat", () => {
    // Square: 5 edges of 6 possible. Densities 0, 0.5, 0.9, 1 keep 0, 3, round(5.4) = 5 and 6 → all 5 edges.
    const axis: FeatureAxis = { kind: "density", values: [0, 0.5, 0.9, 1] };
    const { get, result } = row(square, onlyTopology({ simplexCounts: true }, 2), axis, "distance");
    expect(Array.from(result.grid.thresholds.subarray(1))).toEqual([3, 5, 5]);
    expect(result.grid.thresholds[0]).toBeLessThan(1);
    expect(axis.values.map((d) => get(`simplices_d1_dens${d}`))).toEqual([0, 3, 5, 5]);
    expect(axis.values.map((d) => get(`simplices_d2_dens${d}`))).toEqual([0, 0, 2, 2]);
  });

  it("reads a threshold that keeps no edge as n isolated vertices under either semantics", () => {
    // A path with weights 0.9, 0.5, 0.3: density 0 keeps no edge, so β0 = 4 = χ (common practice: a graph
    // without edges has one component per vertex). Under similarity weights that threshold lies before the
    // filtration start (the largest weight), where the barcode has no vertex yet.
    const path = fromEdgeList({
      n: 4,
      sources: [0, 1, 2],
      targets: [1, 2, 3],
      weights: [0.9, 0.5, 0.3],
      directed: false,
    });
    const axis: FeatureAxis = { kind: "density", values: [0, 0.5] };
    for (const semantics of ["distance", "similarity"] as const) {
      const { get } = row(path, DEFAULT_FEATURE_CONFIG, axis, semantics);
      expect([get("betti_d0_dens0"), get("euler_dens0"), get("betti_d1_dens0")]).toEqual([4, 4, 0]);
      expect([get("betti_d0_dens0.5"), get("euler_dens0.5"), get("simplices_d1_dens0.5")]).toEqual([1, 1, 3]);
    }
  });

  it("flags truncation by topDim; counts stay exact and the Euler characteristic is the partial sum", () => {
    // K_5 has C(5, k+1) k-simplices (common practice); with topDim 2 the 3- and 4-simplices are cut off.
    const { get, result } = row(
      completeGraph(5),
      onlyTopology({ simplexCounts: true, euler: true }, 2),
      { kind: "weight", values: [1] },
      "distance",
    );
    expect(result.truncated).toBe(true);
    expect([get("simplices_d1_w1"), get("simplices_d2_w1")]).toEqual([binomial(5, 2), binomial(5, 3)]);
    expect(get("euler_w1")).toBe(5 - 10 + 10);
    const full = row(
      completeGraph(5),
      onlyTopology({ euler: true }, 4),
      { kind: "weight", values: [1] },
      "distance",
    );
    expect(full.result.truncated).toBe(false);
    expect(full.get("euler_w1")).toBe(1); // a simplex is contractible
  });

  it("counts directed flag simplices: the transitive tournament on n nodes has C(n, k+1) k-simplices", () => {
    // Every (k+1)-subset of a transitive tournament is one directed simplex (common practice).
    const { get } = row(
      transitiveTournament(5),
      onlyTopology({ simplexCounts: true }, 3),
      { kind: "weight", values: [1] },
      "distance",
    );
    expect([1, 2, 3].map((k) => get(`simplices_d${k}_w1`))).toEqual([10, 10, 5]);
  });

  it("skips the work of families that are off", () => {
    const counts = topologicalFeatures(square, {
      config: onlyTopology({ euler: true }),
      axis: { kind: "weight", values: [5] },
      semantics: "distance",
    });
    expect(counts.barcode).toBeNull();
    expect(Array.from(counts.values)).toEqual([1]);
    const bars = topologicalFeatures(square, {
      config: onlyTopology({ barcodeSummaries: true }, 2),
      axis: { kind: "weight", values: [5] },
      semantics: "distance",
    });
    expect(bars.truncated).toBeNull();
    expect(bars.barcode?.maxDim).toBe(1);
    expect(bars.values.length).toBe(2 * 5);
  });

  it("refuses unusable settings", () => {
    const axis: FeatureAxis = { kind: "weight", values: [1, 2] };
    const run = (config: FeatureConfig, a: FeatureAxis = axis) =>
      topologicalFeatures(square, { config, axis: a, semantics: "distance" });
    expect(() => run({ ...DEFAULT_FEATURE_CONFIG, topDim: 0 })).toThrow(/topDim/);
    expect(() => run({ ...DEFAULT_FEATURE_CONFIG, prime: 4 })).toThrow(/prime/);
    expect(() => run(DEFAULT_FEATURE_CONFIG, { kind: "weight", values: [2, 1] })).toThrow(/ascending/);
    expect(() =>
      topologicalFeatures(square, {
        config: DEFAULT_FEATURE_CONFIG,
        axis: { kind: "weight", values: [1, 2] },
        semantics: "similarity",
      }),
    ).toThrow(/descending/);
    expect(() => run(DEFAULT_FEATURE_CONFIG, { kind: "density", values: [0.2, 0.2] })).toThrow(/repeats/);
    expect(() => run(DEFAULT_FEATURE_CONFIG, { kind: "density", values: [1.5] })).toThrow(/outside/);
    expect(() => run(DEFAULT_FEATURE_CONFIG, { kind: "weight", values: [] })).toThrow(/no values/);
  });
});
