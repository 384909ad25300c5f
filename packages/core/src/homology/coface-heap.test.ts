import { describe, expect, it } from "vitest";
import { seededRandom } from "../../../../test/support/random.js";
import { CofaceHeap } from "./coface-heap.js";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";

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

  it("keeps (f, key) order under pushes and pops interleaved at random (a sorted list as reference)", () => {
    // A heap must give the least entry after any sequence of operations, not only after pushing all first
    // (common practice); filling then emptying leaves whole regions of the four-ary tree untried.
    const random = seededRandom(2024);
    for (let round = 0; round < 10; round++) {
      const heap = new CofaceHeap(new ByteLedger(undefined), 4);
      const sorted: number[] = []; // f * 10,000 + key, ascending
      for (let step = 0; step < 3000; step++) {
        if (sorted.length === 0 || random() < 0.55) {
          const f = Math.floor(random() * 1000);
          const key = Math.floor(random() * 10000);
          heap.push(f, key, 1);
          const packed = f * 10000 + key;
          let at = sorted.length;
          while (at > 0 && sorted[at - 1] > packed) at--;
          sorted.splice(at, 0, packed);
        } else {
          const least = sorted.shift() as number;
          expect([heap.f[0], heap.key[0]], `round ${round}, step ${step}`).toEqual([
            Math.floor(least / 10000),
            least % 10000,
          ]);
          heap.pop();
        }
        expect(heap.size).toBe(sorted.length);
      }
    }
  });

  it("is empty after clear(), and pops only what is pushed after it", () => {
    const heap = new CofaceHeap(new ByteLedger(undefined), 4);
    for (let i = 0; i < 10; i++) heap.push(i, i, 1);
    heap.clear();
    expect(heap.size).toBe(0);
    heap.push(5, 50, 2);
    heap.push(3, 30, 1);
    expect([heap.f[0], heap.key[0], heap.popMerged()]).toEqual([3, 30, 1]);
    expect([heap.f[0], heap.key[0], heap.popMerged(), heap.size]).toEqual([5, 50, 2, 0]);
  });

  it("sums the copies of the top key", () => {
    const heap = new CofaceHeap(new ByteLedger(undefined));
    heap.push(1, 5, 1);
    heap.push(2, 9, 2);
    heap.push(1, 5, 2);
    expect(heap.popMerged()).toBe(3);
    expect([heap.f[0], heap.key[0], heap.size]).toEqual([2, 9, 1]);
  });

  it("moves each coefficient with its entry", () => {
    const heap = new CofaceHeap(new ByteLedger(undefined), 2);
    const entries: [number, number, number][] = [];
    let x = 11;
    for (let key = 0; key < 300; key++) {
      x = (x * 48271) % 2147483647;
      entries.push([x % 17, key, x % 1000]);
    }
    for (const [f, k, c] of entries) heap.push(f, k, c);
    entries.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
    const popped: [number, number, number][] = [];
    while (heap.size > 0) {
      popped.push([heap.f[0], heap.key[0], heap.coef[0]]);
      heap.pop();
    }
    expect(popped).toEqual(entries);
  });

  it("stops merging when the heap runs empty", () => {
    const heap = new CofaceHeap(new ByteLedger(undefined), 2);
    heap.push(1, 5, 1);
    heap.push(1, 5, 2);
    heap.push(1, 5, 4);
    expect(heap.popMerged()).toBe(7);
    expect(heap.size).toBe(0);
    heap.push(3, 5, 1);
    expect(heap.popMerged()).toBe(1);
    expect(heap.size).toBe(0);
  });

  it("holds 20 bytes per entry of capacity in the ledger, grows through it, and gives them back", () => {
    const ledger = new ByteLedger(undefined);
    const heap = new CofaceHeap(ledger, 4);
    expect(ledger.held).toBe(4 * 20);
    for (let i = 0; i < 4; i++) heap.push(i, i, 1);
    expect(heap.f.length).toBe(4);
    heap.push(9, 9, 1);
    expect([heap.f.length, heap.key.length, heap.coef.length]).toEqual([8, 8, 8]);
    expect(ledger.held).toBe(8 * 20);
    heap.dispose();
    expect(ledger.held).toBe(0);
    let error: unknown;
    try {
      const small = new CofaceHeap(new ByteLedger({ maxBytes: 100 }), 4);
      for (let i = 0; i < 5; i++) small.push(i, i, 1);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect((error as HomologyBudgetError).stage).toBe("growing the working column");
    expect(() => new CofaceHeap(new ByteLedger({ maxBytes: 79 }), 4)).toThrow(/growing the working column/);
  });
});
