import { describe, expect, it } from "vitest";
import { CofaceHeap } from "./coface-heap.js";
import { ByteLedger } from "./homology-budget.js";

describe("CofaceHeap", () => {
  it("pops entries in (f, key) order, like a sorted array (common practice)", () => {
    const heap = new CofaceHeap(new ByteLedger(undefined), 2);
    const entries: [number, number][] = [];
    let x = 7;
    for (let i = 0; i < 500; i++) {
      x = (x * 48271) % 2147483647;
      entries.push([x % 13, x % 101]);
    }
    for (const [f, k] of entries) heap.push(f, k, 1);
    entries.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
    const popped: [number, number][] = [];
    while (heap.size > 0) {
      popped.push([heap.f[0], heap.key[0]]);
      heap.pop();
    }
    expect(popped).toEqual(entries);
  });

  it("sums the copies of the top key", () => {
    const heap = new CofaceHeap(new ByteLedger(undefined));
    heap.push(1, 5, 1);
    heap.push(2, 9, 2);
    heap.push(1, 5, 2);
    expect(heap.popMerged()).toBe(3);
    expect([heap.f[0], heap.key[0], heap.size]).toEqual([2, 9, 1]);
  });
});
