import { describe, expect, it } from "vitest";
import { randomGraph } from "../../../../test/support/known-graphs.js";
import { seededRandom } from "../../../../test/support/random.js";
import { densityGrid } from "../filtration/threshold-grid.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { axisGrid } from "./feature-axis.js";

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
