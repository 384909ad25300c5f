import { describe, expect, it } from "vitest";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { edgeBins } from "./edge-bins.js";
import { filtrationStart } from "./edge-filtration.js";
import {
  allEdgesGrid,
  densityGrid,
  distinctEdgeFiltration,
  evenGrid,
  explicitGrid,
} from "./threshold-grid.js";

// A path 0-1-2-3 with weights 0.5, 0.2, 0.9 and the chord 0-2 of weight 0.2 (a tie), worked by hand.
const path = fromEdgeList({
  n: 4,
  sources: [0, 1, 2, 0],
  targets: [1, 2, 3, 2],
  weights: [0.5, 0.2, 0.9, 0.2],
  directed: false,
});

describe("threshold grids", () => {
  it("explicit: filtration order, repeats removed, NaN refused", () => {
    expect(Array.from(explicitGrid([0.3, 0.1, 0.3, 0.2], "distance").thresholds)).toEqual([0.1, 0.2, 0.3]);
    expect(Array.from(explicitGrid([0.3, 0.1, 0.3, 0.2], "similarity").thresholds)).toEqual([0.3, 0.2, 0.1]);
    expect(() => explicitGrid([0.1, Number.NaN], "distance")).toThrow("a threshold is NaN");
  });

  it("even: one value is the last end; bad sizes and ends are refused with the value", () => {
    expect(Array.from(evenGrid(0, 1, 1, "distance").thresholds)).toEqual([1]);
    expect(Array.from(evenGrid(0, 1, 3, "distance").thresholds)).toEqual([0, 0.5, 1]);
    expect(() => evenGrid(0, 1, 0, "distance")).toThrow("grid size must be a positive integer, got 0");
    expect(() => evenGrid(0, 1, 2.5, "distance")).toThrow("grid size must be a positive integer, got 2.5");
    expect(() => evenGrid(0, Number.POSITIVE_INFINITY, 3, "distance")).toThrow("grid ends must be finite");
    expect(() => evenGrid(Number.NaN, 1, 3, "distance")).toThrow("grid ends must be finite");
  });

  it("density: round(d × possible) strongest edges, ties kept, 0 just before the first edge", () => {
    // 4 nodes: 6 possible pairs. Distances ascending 0.2, 0.2, 0.5, 0.9.
    const grid = densityGrid(path, [0, 1 / 6, 0.5, 1], "distance");
    const first = grid.thresholds[0];
    expect(first).toBeLessThan(0.2);
    // The next float above the density-0 threshold is the first edge's weight itself.
    const bits = new BigInt64Array(Float64Array.of(first).buffer);
    bits[0] += 1n;
    expect(new Float64Array(bits.buffer)[0]).toBe(0.2);
    // round(d × 6) = 0, 1, 3, 6 edges of 0.2, 0.2, 0.5, 0.9: the 1st, the 3rd and (only 4 exist) the last.
    expect(Array.from(grid.thresholds).slice(1)).toEqual([0.2, 0.5, 0.9]);
    // Similarities: strongest first, 0.9 then 0.5.
    expect(Array.from(densityGrid(path, [1 / 6, 2 / 6], "similarity").thresholds)).toEqual([0.9, 0.5]);
    for (const bad of [-0.1, 1.1, Number.NaN])
      expect(() => densityGrid(path, [bad], "distance")).toThrow(`density must be in [0, 1], got ${bad}`);
  });

  it("density 0 below a first edge of weight 0 or a negative one", () => {
    const at = (w: number) =>
      densityGrid(
        fromEdgeList({ n: 2, sources: [0], targets: [1], weights: [w], directed: false, negative: "keep" }),
        [0],
        "distance",
      ).thresholds[0];
    expect(at(0)).toBe(-Number.MIN_VALUE);
    expect(at(-1)).toBe(-1 - Number.EPSILON);
  });

  it("directed graphs count arcs; the all-edges grid is the weakest edge, 0 without edges", () => {
    // The heavier arc leaves the first vertex: slot order is not weight order.
    const arcs = fromEdgeList({
      n: 2,
      sources: [0, 1],
      targets: [1, 0],
      weights: [0.7, 0.4],
      directed: true,
    });
    expect(Array.from(distinctEdgeFiltration(arcs, "distance"))).toEqual([0.4, 0.7]);
    expect(Array.from(densityGrid(arcs, [0.5], "distance").thresholds)).toEqual([0.4]);
    expect(Array.from(distinctEdgeFiltration(path, "distance"))).toEqual([0.2, 0.2, 0.5, 0.9]);
    expect(Array.from(allEdgesGrid(path, "distance").thresholds)).toEqual([0.9]);
    expect(Array.from(allEdgesGrid(path, "similarity").thresholds)).toEqual([0.2]);
    const empty = fromEdgeList({ n: 3, sources: [], targets: [], weights: [], directed: false });
    const none = allEdgesGrid(empty, "similarity").thresholds;
    // 0 either way: for similarities it is −0 (the negated filtration value), which prints as 0.
    expect(none.length === 1 && none[0] === 0).toBe(true);
  });
});

describe("where the filtration starts, and edge bins", () => {
  it("0 for distances, the smallest weight when negative, the largest similarity; 0 without edges", () => {
    expect(filtrationStart(path, "distance")).toBe(0);
    expect(filtrationStart(path, "similarity")).toBe(-0.9);
    const negative = fromEdgeList({
      n: 3,
      sources: [0, 1],
      targets: [1, 2],
      weights: [-0.5, -2],
      directed: false,
      negative: "keep",
    });
    expect(filtrationStart(negative, "distance")).toBe(-2);
    const empty = fromEdgeList({ n: 2, sources: [], targets: [], weights: [], directed: false });
    expect(filtrationStart(empty, "similarity")).toBe(0);
  });

  it("each edge goes to the first grid value at or above it, -1 past the grid or with no grid", () => {
    expect(Array.from(edgeBins(Float64Array.of(0.5, 1, 1.5, 3), Float64Array.of(1, 2)))).toEqual([
      0, 0, 1, -1,
    ]);
    expect(Array.from(edgeBins(Float64Array.of(0.5), new Float64Array(0)))).toEqual([-1]);
  });
});
