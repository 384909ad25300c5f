import { describe, expect, it } from "vitest";
import { writeBreadthFirstOrder } from "./breadth-first-order.js";

describe("writeBreadthFirstOrder", () => {
  it("renumbers by breadth-first search along out-edges, keeping every arc", () => {
    // 0→3, 3→1, 3→4, 1→0, 2→4 (2 is reached only as a new start); lists: 0:[3] 1:[0] 2:[4] 3:[1,4] 4:[]
    const offsets = Int32Array.from([0, 1, 2, 3, 5, 5]);
    const targets = Int32Array.from([3, 0, 4, 1, 4]);
    const outOffsets = new Int32Array(6);
    const outTargets = new Int32Array(5);
    writeBreadthFirstOrder(5, offsets, targets, outOffsets, outTargets);
    // visit order 0, 3, 1, 4, 2: new ids 0→0, 3→1, 1→2, 4→3, 2→4
    expect(Array.from(outOffsets)).toEqual([0, 1, 3, 4, 4, 5]);
    expect(Array.from(outTargets)).toEqual([1, 2, 3, 0, 3]);
  });
});
