import { describe, expect, it } from "vitest";
import { loopWalk } from "./loop-walk.js";

describe("loopWalk", () => {
  it("orders the edges of a square given in any order and orientation", () => {
    // Square 0-1-2-3-0 (a 4-cycle, the smallest loop no triangle fills).
    expect(loopWalk([1, 0, 2, 3, 1, 2, 0, 3])).toEqual([1, 0, 3, 2, 1]);
  });

  it("refuses edges that do not close up", () => {
    expect(() => loopWalk([0, 1, 1, 2])).toThrow("closed loop");
    expect(() => loopWalk([0, 1, 2, 3])).toThrow("closed loop");
  });
});
