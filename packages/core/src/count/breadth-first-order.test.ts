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

  it("explores a later root's out-list before the next root, and reads only each vertex's own list", () => {
    // 0:[] 1:[3] 2:[] 3:[]: the second root 1 reaches 3 before the root 2 starts; new ids 0→0, 1→1, 3→2, 2→3
    const outOffsets = new Int32Array(5);
    const outTargets = new Int32Array(1);
    writeBreadthFirstOrder(4, Int32Array.from([0, 0, 1, 1, 1]), Int32Array.from([3]), outOffsets, outTargets);
    expect(Array.from(outOffsets)).toEqual([0, 0, 1, 1, 1]);
    expect(Array.from(outTargets)).toEqual([2]);
    // 0:[1] 1:[] 2:[] 3:[4] 4:[]: vertex 0 must not reach 4, the first arc after its own list; ids unchanged
    const outOffsets2 = new Int32Array(6);
    const outTargets2 = new Int32Array(2);
    writeBreadthFirstOrder(
      5,
      Int32Array.from([0, 1, 1, 1, 2, 2]),
      Int32Array.from([1, 4]),
      outOffsets2,
      outTargets2,
    );
    expect(Array.from(outOffsets2)).toEqual([0, 1, 1, 1, 2, 2]);
    expect(Array.from(outTargets2)).toEqual([1, 4]);
  });
});
