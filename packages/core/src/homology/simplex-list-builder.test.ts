import { describe, expect, it } from "vitest";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";
import { SimplexListBuilder } from "./simplex-list-builder.js";

// The ledger must hold what the typed arrays hold: their byteLength (8 bytes per Float64Array element,
// ECMAScript's typed-array element sizes), 16 bytes per (f, key) slot.

describe("SimplexListBuilder", () => {
  it("keeps every pushed (f, key) in order through growth, with its bytes in the ledger", () => {
    const ledger = new ByteLedger(undefined);
    const list = new SimplexListBuilder(ledger, "listing", 4);
    expect(ledger.held).toBe(64);
    const f: number[] = [];
    const key: number[] = [];
    for (let i = 0; i < 37; i++) {
      f.push(i / 3);
      key.push(2 ** 40 + 7 * i);
      list.push(i / 3, 2 ** 40 + 7 * i);
      // Whatever the arrays are now, the ledger holds exactly their bytes, and so does `bytes`.
      expect(ledger.held).toBe(list.f.byteLength + list.key.byteLength);
      expect(list.bytes).toBe(ledger.held);
    }
    expect(list.count).toBe(37);
    expect(list.f.length).toBe(64); // 4 doubled four times: the first power-of-two multiple ≥ 37
    expect(Array.from(list.f.subarray(0, 37))).toEqual(f);
    expect(Array.from(list.key.subarray(0, 37))).toEqual(key);
    list.release();
    expect(ledger.held).toBe(0);
    expect(list.count).toBe(0);
    expect(list.f.length + list.key.length).toBe(0);
  });

  it("stops with a budget error naming its stage when growing would pass the budget", () => {
    // 8 slots = 128 bytes fit; doubling to 16 needs 256.
    const list = new SimplexListBuilder(new ByteLedger({ maxBytes: 200 }), "listing the triangles", 8);
    for (let i = 0; i < 8; i++) list.push(i, i);
    let error: unknown;
    try {
      list.push(8, 8);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect((error as HomologyBudgetError).stage).toBe("listing the triangles");
    expect((error as HomologyBudgetError).neededBytes).toBe(256);
  });
});
