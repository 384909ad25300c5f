import { describe, expect, it } from "vitest";
import { handBar as bar, handBarcode } from "../../../../test/support/hand-barcode.js";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { computeBarcode } from "./compute-barcode.js";
import { mostPersistentBars, representativeCycle } from "./representative-cycle.js";

// The square 0–1–2–3–0 with distances 1, 2, 3, 4 on its edges (worked by hand): no triangle, so one loop is
// born when 0–3 enters at 4 and never dies; the components die at 1, 2, 3.
const square = fromEdgeList({
  n: 4,
  sources: [0, 1, 2, 0],
  targets: [1, 2, 3, 3],
  weights: [1, 2, 3, 4],
  directed: false,
});

describe("representativeCycle", () => {
  it("closes the creating edge with the path through the earlier edges (the square, worked by hand)", () => {
    const code = computeBarcode(square, { semantics: "distance", maxDim: 1 });
    const loop = code.bars.findIndex((b) => b.dim === 1);
    expect(code.bars[loop]).toMatchObject({ birth: 4, death: null, birthSimplex: [0, 3] });
    // Creating edge (0, 3), then the walk 3 → 2 → 1 → 0.
    expect(Array.from(representativeCycle(square, code, loop))).toEqual([0, 3, 3, 2, 2, 1, 1, 0]);
  });

  it("says which argument is wrong: no such bar, not a loop, another graph", () => {
    const code = computeBarcode(square, { semantics: "distance", maxDim: 1 });
    expect(() => representativeCycle(square, code, 99)).toThrow(new RangeError("no bar at index 99"));
    expect(() => representativeCycle(square, code, -1)).toThrow(new RangeError("no bar at index -1"));
    const component = code.bars.findIndex((b) => b.dim === 0);
    expect(() => representativeCycle(square, code, component)).toThrow(
      new RangeError(`representative loops exist for dimension-1 bars; bar ${component} has dimension 0`),
    );
    const arcs = fromEdgeList({
      n: 4,
      sources: [0, 1, 2, 0],
      targets: [1, 2, 3, 3],
      weights: [1, 2, 3, 4],
      directed: true,
    });
    const loop = code.bars.findIndex((b) => b.dim === 1);
    expect(() => representativeCycle(arcs, code, loop)).toThrow(
      new RangeError("the graph is not the one the barcode was computed from"),
    );
  });
});

describe("mostPersistentBars", () => {
  // Bars 1–5 are loops: lengths 2, ∞, 1, 2, 5 (worked by hand); bars 0 and 6 are components.
  const bars = [
    bar(0, 0, 9),
    bar(1, 1, 3),
    bar(1, 2, null),
    bar(1, 5, 6),
    bar(1, 4, 6),
    bar(1, 3, 8),
    bar(0, 0, null),
  ];

  it("orders essential bars first, then by length descending, ties by position", () => {
    const code = handBarcode(bars, "distance");
    expect(mostPersistentBars(code, 1, 10)).toEqual([2, 5, 1, 4, 3]);
    expect(mostPersistentBars(code, 1, 3)).toEqual([2, 5, 1]);
    expect(mostPersistentBars(code, 0, 10)).toEqual([6, 0]);
    expect(mostPersistentBars(code, 1, 0)).toEqual([]);
    expect(mostPersistentBars(code, 1, -2)).toEqual([]);
    expect(mostPersistentBars(code, 2, 4)).toEqual([]);
  });

  it("keeps many tied bars in barcode order", () => {
    // Lengths 3, 1, 3, 1, … with one essential bar at position 8 (worked by hand).
    const lengths = [3, 1, 3, 1, 3, 1, 3, 1, null, 3, 1, 3];
    const code = handBarcode(
      lengths.map((l, i) => bar(1, i, l === null ? null : i + l)),
      "distance",
    );
    expect(mostPersistentBars(code, 1, 12)).toEqual([8, 0, 2, 4, 6, 9, 11, 1, 3, 5, 7, 10]);
  });

  it("measures similarity bars, whose deaths are smaller numbers than their births, by |death − birth|", () => {
    // Lengths 2, 1, 4 (worked by hand).
    const code = handBarcode([bar(1, 9, 7), bar(1, 9, 8), bar(1, 6, 2)], "similarity");
    expect(mostPersistentBars(code, 1, 3)).toEqual([2, 0, 1]);
  });
});
