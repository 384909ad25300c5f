import { describe, expect, it } from "vitest";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";
import { TupleTableBuilder } from "./tuple-table-builder.js";

// The ledger must hold what the typed arrays hold: their byteLength (8 bytes per Float64Array element,
// 4 per Int32Array element: ECMAScript's typed-array element sizes), 8 + 4·width bytes per tuple.

describe("TupleTableBuilder", () => {
  it("keeps every pushed tuple and value in order through growth, with its bytes in the ledger", () => {
    for (const width of [1, 3, 4]) {
      const ledger = new ByteLedger(undefined);
      const table = new TupleTableBuilder(width, ledger, "test", 2);
      expect(ledger.held).toBe(2 * (8 + 4 * width));
      const f: number[] = [];
      const tuples: number[] = [];
      const tuple = new Int32Array(width + 2).fill(-5); // longer than width: the rest is not read
      for (let i = 0; i < 21; i++) {
        for (let j = 0; j < width; j++) tuple[j] = 100 * i + j;
        table.push(i - 0.5, tuple);
        f.push(i - 0.5);
        tuples.push(...tuple.subarray(0, width));
        expect(ledger.held).toBe(table.f.byteLength + table.tuples.byteLength);
        expect(table.bytes).toBe(ledger.held);
      }
      expect(table.count).toBe(21);
      expect(table.f.length).toBe(32);
      expect(table.tuples.length).toBe(32 * width);
      expect(Array.from(table.f.subarray(0, 21))).toEqual(f);
      expect(Array.from(table.tuples.subarray(0, 21 * width))).toEqual(tuples);
    }
  });

  it("stops with a budget error naming its stage when growing would pass the budget", () => {
    // Width 2: 16 bytes a tuple; 4 tuples = 64 bytes fit in 100, doubling to 8 needs 128.
    const table = new TupleTableBuilder(2, new ByteLedger({ maxBytes: 100 }), "listing directed tables", 4);
    const tuple = Int32Array.of(1, 2);
    for (let i = 0; i < 4; i++) table.push(i, tuple);
    let error: unknown;
    try {
      table.push(4, tuple);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect((error as HomologyBudgetError).stage).toBe("listing directed tables");
    expect((error as HomologyBudgetError).neededBytes).toBe(128);
  });
});
