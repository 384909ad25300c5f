import { describe, expect, it } from "vitest";
import { TupleIndex } from "./tuple-index.js";

describe("TupleIndex", () => {
  it("finds every stored tuple's position and answers -1 for others, like a Map of joined tuples", () => {
    for (const width of [1, 2, 4]) {
      // Tuples of small vertex numbers, so that many differ in one place only and share hash slots.
      const reference = new Map<string, number>();
      const tuples: number[] = [];
      let x = 7;
      const wanted = Math.min(700, 30 ** width - 5); // leave some tuples absent
      while (reference.size < wanted) {
        const t: number[] = [];
        for (let j = 0; j < width; j++) {
          x = (x * 69069 + 1) % 4294967296;
          t.push(Math.floor(x / 65536) % 30); // high bits: the low ones of an LCG repeat
        }
        if (reference.has(t.join())) continue;
        reference.set(t.join(), reference.size);
        tuples.push(...t);
      }
      const index = new TupleIndex(Int32Array.from(tuples), width, reference.size);
      const probe = new Int32Array(width);
      for (let i = 0; i < reference.size; i++) {
        probe.set(tuples.slice(i * width, (i + 1) * width));
        expect(index.find(probe)).toBe(i);
      }
      let absent = 0;
      for (let code = 0; code < 30 ** width && code < 30000; code++) {
        let c = code;
        for (let j = 0; j < width; j++) {
          probe[j] = c % 30;
          c = Math.floor(c / 30);
        }
        const expected = reference.get(Array.from(probe).join()) ?? -1;
        if (expected < 0) absent++;
        expect(index.find(probe)).toBe(expected);
      }
      expect(absent).toBeGreaterThan(0);
    }
  });

  it("answers -1 in an empty index", () => {
    expect(new TupleIndex(new Int32Array(0), 3, 0).find(Int32Array.of(0, 1, 2))).toBe(-1);
  });
});
