import { describe, expect, it } from "vitest";
import { randomGraph } from "../../../../test/support/known-graphs.js";
import { seededRandom } from "../../../../test/support/random.js";
import { densityGrid } from "../filtration/threshold-grid.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { axisGrid, checkFeatureAxis } from "./feature-axis.js";

describe("axisGrid", () => {
  it("gives each density the threshold densityGrid gives it alone, in axis order", () => {
    const graph = randomGraph(30, 0.7, seededRandom(8), { weighted: true });
    const values = [0.01, 0.05, 0.1, 0.3, 0.5];
    for (const semantics of ["distance", "similarity"] as const) {
      const grid = axisGrid(graph, { kind: "density", values }, semantics);
      expect(Array.from(grid.thresholds)).toEqual(
        values.map((d) => densityGrid(graph, [d], semantics).thresholds[0]),
      );
    }
  });

  it("repeats a threshold when two densities keep the same edges", () => {
    // Three edges of six possible, two of them tied at weight 2: densities 2/6 and 3/6 keep the same edges.
    const graph = fromEdgeList({
      n: 4,
      sources: [0, 1, 2],
      targets: [1, 2, 3],
      weights: [1, 2, 2],
      directed: false,
    });
    const grid = axisGrid(graph, { kind: "density", values: [1 / 6, 2 / 6, 3 / 6, 1] }, "distance");
    expect(Array.from(grid.thresholds)).toEqual([1, 2, 2, 2]);
  });

  it("uses a weight axis as given", () => {
    const graph = fromEdgeList({ n: 2, sources: [0], targets: [1], weights: [1], directed: false });
    expect(
      Array.from(axisGrid(graph, { kind: "weight", values: [3, 2, 1] }, "similarity").thresholds),
    ).toEqual([3, 2, 1]);
  });
});

describe("checkFeatureAxis", () => {
  it("accepts weight axes of any sign and size in filtration order, and densities within [0, 1]", () => {
    expect(() => checkFeatureAxis({ kind: "weight", values: [-3, 0, 2.5, 40] }, "distance")).not.toThrow();
    expect(() => checkFeatureAxis({ kind: "weight", values: [40, 2.5, 0, -3] }, "similarity")).not.toThrow();
    expect(() => checkFeatureAxis({ kind: "density", values: [0, 0.5, 1] }, "similarity")).not.toThrow();
  });

  it("names what is wrong: kind, no values, a value not finite, a density outside [0, 1], repeats", () => {
    const cases: [Parameters<typeof checkFeatureAxis>, string][] = [
      [[{ kind: "ratio" as "weight", values: [0.5] }, "distance"], 'unknown axis kind "ratio"'],
      [[{ kind: "weight", values: [] }, "distance"], "the feature axis has no values"],
      [
        [{ kind: "weight", values: [0, Number.POSITIVE_INFINITY] }, "distance"],
        "axis value 1 is not a finite number (Infinity)",
      ],
      [[{ kind: "weight", values: [Number.NaN] }, "distance"], "axis value 0 is not a finite number (NaN)"],
      [[{ kind: "density", values: [0.5, 1.5] }, "distance"], "density 1.5 is outside [0, 1]"],
      [[{ kind: "density", values: [-0.1] }, "distance"], "density -0.1 is outside [0, 1]"],
      // Densities always ascend, whatever the weights mean; weights follow the filtration.
      [
        [{ kind: "density", values: [0.5, 0.5] }, "similarity"],
        "axis values must be strictly ascending without repeats (value 1: 0.5)",
      ],
      [
        [{ kind: "weight", values: [1, 2] }, "similarity"],
        "axis values must be strictly descending without repeats (value 1: 2)",
      ],
      [
        [{ kind: "weight", values: [2, 1] }, "distance"],
        "axis values must be strictly ascending without repeats (value 1: 1)",
      ],
    ];
    for (const [[axis, semantics], message] of cases) {
      expect(() => checkFeatureAxis(axis, semantics), message).toThrow(RangeError);
      expect(() => checkFeatureAxis(axis, semantics), message).toThrow(message);
    }
  });
});
