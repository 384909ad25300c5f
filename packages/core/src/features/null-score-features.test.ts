/**
 * z-scored columns against their definition: z = (observed − mean) / sd over N null samples, sd with
 * N − 1 (common practice: the sample standard deviation). The expected values are recomputed here by an
 * independent path: samples drawn with nullSample, counts from countSimplices, Betti numbers from the rank
 * path bettiAt (β_k = #k-simplices − rank ∂_k − rank ∂_{k+1}; A. Hatcher, Algebraic Topology, 2002, §2.1)
 * rather than from barcodes, Betti-curve areas by the trapezoid rule over |Δx| written out here (as the
 * `betti_d{k}_area` columns: a similarity axis runs downwards).
 */
import { describe, expect, it } from "vitest";
import { randomDigraph, randomGraph } from "../../../../test/support/known-graphs.js";
import { seededRandom } from "../../../../test/support/random.js";
import { countSimplices } from "../count/count-simplices.js";
import { densityGrid } from "../filtration/threshold-grid.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { bettiAt } from "../homology/betti-at.js";
import { nullSample, rewiringStrata } from "../null-model/null-sample.js";
import { TimeLimitError } from "../work/time-limit-error.js";
import { axisGrid, type FeatureAxis } from "./feature-axis.js";
import {
  checkNullScoreConfig,
  type NullScoreConfig,
  nullScoreNames,
  nullScoreValues,
} from "./null-score-features.js";

const TOP_DIM = 2;

/** The features by the independent path: counts d1..d2, Betti d0..d1 at t, Betti-curve areas over x. */
function features(graph: WeightedGraph, t: number, thresholds: Float64Array, x: readonly number[]) {
  const counts = countSimplices(graph, { threshold: t, semantics: "similarity", maxDim: TOP_DIM }).counts;
  const betti = bettiAt(graph, { threshold: t, semantics: "similarity", maxDim: TOP_DIM - 1 });
  const curves = Array.from(thresholds, (w) =>
    bettiAt(graph, { threshold: w, semantics: "similarity", maxDim: TOP_DIM - 1 }),
  );
  const areas = [0, 1].map((k) => {
    let area = 0;
    for (let i = 1; i < x.length; i++)
      area += ((curves[i][k] + curves[i - 1][k]) / 2) * Math.abs(x[i] - x[i - 1]);
    return area;
  });
  return [counts[1] ?? 0, counts[2] ?? 0, betti[0], betti[1], ...areas];
}

function zScore(observed: number, nulls: number[]): number {
  const mean = nulls.reduce((a, b) => a + b, 0) / nulls.length;
  const sd = Math.sqrt(nulls.reduce((a, b) => a + (b - mean) ** 2, 0) / (nulls.length - 1));
  return sd === 0 ? Number.NaN : (observed - mean) / sd;
}

describe("nullScoreNames", () => {
  it("depend on the settings only, in a fixed order whatever the order of the list", () => {
    const config: NullScoreConfig = {
      model: "rewire",
      samples: 10,
      seed: 3,
      features: ["bettiAreas", "simplices"],
      threshold: { kind: "density", value: 0.1 },
    };
    expect(nullScoreNames(config, 2)).toEqual([
      "z_rewire_simplices_d1_dens0.1",
      "z_rewire_simplices_d2_dens0.1",
      "z_rewire_betti_d0_area",
      "z_rewire_betti_d1_area",
    ]);
    expect(
      nullScoreNames({ ...config, model: "er", features: ["betti"], threshold: { kind: "all" } }, 3),
    ).toEqual(["z_er_betti_d0_all", "z_er_betti_d1_all", "z_er_betti_d2_all"]);
    expect(nullScoreNames({ ...config, threshold: { kind: "weight", value: 0.45 } }, 1)[0]).toBe(
      "z_rewire_simplices_d1_w0.45",
    );
    expect(() => nullScoreNames({ ...config, samples: 1 }, 2)).toThrow(/samples/);
    expect(() => nullScoreNames({ ...config, features: ["loops" as "betti"] }, 2)).toThrow(/loops/);
  });
});

describe("checkNullScoreConfig", () => {
  const config: NullScoreConfig = {
    model: "rewire",
    samples: 10,
    seed: 3,
    features: ["simplices"],
    threshold: { kind: "density", value: 0.1 },
  };

  it("accepts every bound: 2 samples, seed 0, densities 0 and 1, no swaps", () => {
    const accepted: NullScoreConfig[] = [
      config,
      { ...config, model: "er" },
      { ...config, model: "shuffle" },
      { ...config, samples: 2 },
      { ...config, seed: 0 },
      { ...config, seed: Number.MAX_SAFE_INTEGER },
      { ...config, threshold: { kind: "density", value: 0 } },
      { ...config, threshold: { kind: "density", value: 1 } },
      { ...config, threshold: { kind: "weight", value: -2.5 } },
      { ...config, threshold: { kind: "all" } },
      { ...config, swapsPerEdge: 0 },
      { ...config, swapsPerEdge: 0.5 },
    ];
    for (const c of accepted) expect(() => checkNullScoreConfig(c), JSON.stringify(c)).not.toThrow();
  });

  it("refuses each setting out of range, naming it and the value given", () => {
    const refused: [NullScoreConfig, string][] = [
      [
        { ...config, model: "lattice" as "er" },
        'unknown null model "lattice"; choose from er, rewire, shuffle',
      ],
      [
        { ...config, samples: 1 },
        "null samples must be a whole number ≥ 2 (a z-score needs a spread), got 1",
      ],
      [{ ...config, seed: -1 }, "the null-model seed must be a whole number ≥ 0, got -1"],
      [{ ...config, seed: 1.5 }, "the null-model seed must be a whole number ≥ 0, got 1.5"],
      [{ ...config, seed: 2 ** 53 }, `the null-model seed must be a whole number ≥ 0, got ${2 ** 53}`],
      [
        { ...config, features: ["betti", "loops" as "betti"] },
        'unknown null-model feature "loops"; choose from simplices, betti, bettiAreas',
      ],
      [
        { ...config, threshold: { kind: "density", value: 1.5 } },
        "the null-model density 1.5 is outside [0, 1]",
      ],
      [
        { ...config, threshold: { kind: "density", value: -0.5 } },
        "the null-model density -0.5 is outside [0, 1]",
      ],
      [
        { ...config, threshold: { kind: "weight", value: Number.NaN } },
        "the null-model threshold must be a finite weight, got NaN",
      ],
      [{ ...config, swapsPerEdge: -1 }, "swapsPerEdge must be a number ≥ 0, got -1"],
      [
        { ...config, swapsPerEdge: Number.POSITIVE_INFINITY },
        "swapsPerEdge must be a number ≥ 0, got Infinity",
      ],
      [{ ...config, swapsPerEdge: Number.NaN }, "swapsPerEdge must be a number ≥ 0, got NaN"],
    ];
    for (const [c, message] of refused) {
      expect(() => checkNullScoreConfig(c), message).toThrow(RangeError);
      expect(() => checkNullScoreConfig(c), message).toThrow(message);
    }
  });
});

describe("nullScoreValues", () => {
  const cases: { name: string; graph: WeightedGraph; config: NullScoreConfig; axis: FeatureAxis }[] = [
    {
      name: "rewiring, undirected, density threshold and density axis",
      graph: randomGraph(16, 0.45, seededRandom(41), { weighted: true }),
      config: {
        model: "rewire",
        samples: 9,
        seed: 5,
        features: ["simplices", "betti", "bettiAreas"],
        threshold: { kind: "density", value: 0.3 },
      },
      axis: { kind: "density", values: [0.1, 0.2, 0.3, 0.4] },
    },
    {
      name: "Erdős–Rényi, directed, weight threshold and weight axis",
      graph: randomDigraph(11, 0.4, seededRandom(42), { weighted: true }),
      config: {
        model: "er",
        samples: 8,
        seed: 0,
        features: ["simplices", "betti", "bettiAreas"],
        threshold: { kind: "weight", value: 0.5 },
      },
      axis: { kind: "weight", values: [0.8, 0.6, 0.4, 0.2] },
    },
    {
      name: "weight shuffling, every edge",
      graph: randomGraph(14, 0.35, seededRandom(43), { weighted: true }),
      config: {
        model: "shuffle",
        samples: 7,
        seed: 11,
        features: ["simplices", "betti", "bettiAreas"],
        threshold: { kind: "all" },
      },
      axis: { kind: "weight", values: [0.9, 0.7, 0.5, 0.3, 0.1] },
    },
  ];
  for (const { name, graph, config, axis } of cases) {
    it(`${name}: z of every feature equals (observed − null mean) / null sd computed here`, () => {
      const values = nullScoreValues(graph, { config, topDim: TOP_DIM, axis, semantics: "similarity" });
      const t = config.threshold;
      const threshold =
        t.kind === "all"
          ? Number.NEGATIVE_INFINITY
          : t.kind === "weight"
            ? t.value
            : densityGrid(graph, [t.value], "similarity").thresholds[0];
      const grid = axisGrid(graph, axis, "similarity");
      const observed = features(graph, threshold, grid.thresholds, axis.values);
      const nulls = Array.from({ length: config.samples }, (_, s) => {
        const sample = nullSample(graph, s, {
          model: config.model,
          seed: config.seed,
          grid: rewiringStrata(grid, t.kind === "all" ? undefined : threshold),
        });
        return features(sample.graph, threshold, grid.thresholds, axis.values);
      });
      const expected = observed.map((o, f) =>
        zScore(
          o,
          nulls.map((row) => row[f]),
        ),
      );
      expect(values.length).toBe(nullScoreNames(config, TOP_DIM).length);
      for (let f = 0; f < expected.length; f++) {
        if (Number.isNaN(expected[f])) expect(values[f]).toBeNaN();
        else expect(values[f]).toBeCloseTo(expected[f], 9);
      }
      // Something varied: the check is not all NaN.
      expect(expected.filter((z) => Number.isFinite(z)).length).toBeGreaterThan(1);
      if (config.model === "rewire") expect(values[0]).toBeNaN(); // the edge count at the threshold is kept
    });
  }

  it("gives the chosen features only, the same values as the full set", () => {
    const { graph, config, axis } = cases[0];
    const all = nullScoreValues(graph, { config, topDim: TOP_DIM, axis, semantics: "similarity" });
    const betti = nullScoreValues(graph, {
      config: { ...config, features: ["betti"] },
      topDim: TOP_DIM,
      axis,
      semantics: "similarity",
    });
    expect(Array.from(betti)).toEqual(Array.from(all.subarray(2, 4)));
    const withoutBetti = nullScoreValues(graph, {
      config: { ...config, features: ["bettiAreas", "simplices"] },
      topDim: TOP_DIM,
      axis,
      semantics: "similarity",
    });
    expect(Array.from(withoutBetti)).toEqual([...all.subarray(0, 2), ...all.subarray(4, 6)]);
  });

  it("stops at the time limit, saying it was drawing null samples", () => {
    const { graph, config, axis } = cases[0];
    const work = { timeLimitMs: 1, startedAt: Date.now() - 1000 };
    let error: unknown;
    try {
      nullScoreValues(graph, { config, topDim: TOP_DIM, axis, semantics: "similarity", work });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(TimeLimitError);
    expect((error as TimeLimitError).message).toMatch(/while drawing null samples \(0 of 9 done/);
  });
});
