import { describe, expect, it } from "vitest";
import { fromEdgeList } from "../graph/from-edge-list.js";
import { axisPositions } from "./axis-positions.js";

// axisPositions' own definition of a density axis: (number of edges with f ≤ f(w)) / possible edges − d₀,
// worked by hand. A first density d₀ ≠ 0 is what tells "− d₀" from "+ d₀".
describe("axisPositions on a density axis that does not start at 0", () => {
  const axis = { kind: "density", values: [0.25, 0.5, 1] } as const;

  it("shifts every density by the first one: positions, samples and span", () => {
    // A triangle with distances 1, 2, 3: 3 possible edges, so densities 1/3, 2/3, 1 at weights 1, 2, 3.
    const triangle = fromEdgeList({
      n: 3,
      sources: [0, 1, 0],
      targets: [1, 2, 2],
      weights: [1, 2, 3],
      directed: false,
    });
    const { position, samples, span } = axisPositions(triangle, axis, "distance");
    expect(Array.from(samples)).toEqual([0, 0.25, 0.75]);
    expect(span).toBe(0.75);
    expect(position(0.5)).toBe(0 - 0.25); // no edge yet
    expect(position(2)).toBeCloseTo(2 / 3 - 0.25, 15);
    expect(position(3)).toBe(1 - 0.25);
  });

  it("a graph with one node has no possible edge: every weight sits at density 0, so at −d₀", () => {
    const single = fromEdgeList({ n: 1, sources: [], targets: [], weights: [], directed: false });
    const { position, samples } = axisPositions(single, axis, "distance");
    expect(position(0)).toBe(-0.25);
    expect(position(7)).toBe(-0.25);
    expect(Array.from(samples)).toEqual([0, 0.25, 0.75]);
  });
});
