import { describe, expect, it } from "vitest";
import { ByteLedger, DEFAULT_HOMOLOGY_BYTES, HomologyBudgetError } from "./homology-budget.js";

const TAIL = "lower maxDim, keep fewer edges, or raise budget.maxBytes";

describe("ByteLedger", () => {
  it("lets the held bytes reach the budget exactly, keeps the peak, and stops one byte past it", () => {
    const ledger = new ByteLedger({ maxBytes: 1000 });
    ledger.reserve(600, "a");
    ledger.release(200);
    ledger.reserve(600, "b"); // 1000 held: exactly the budget
    expect([ledger.held, ledger.peak]).toEqual([1000, 1000]);
    ledger.release(1000);
    ledger.reserve(10, "c");
    expect([ledger.held, ledger.peak]).toEqual([10, 1000]);
    let error: unknown;
    try {
      ledger.reserve(991, "listing the edges");
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect(error).toMatchObject({
      name: "HomologyBudgetError",
      stage: "listing the edges",
      neededBytes: 1001,
      maxBytes: 1000,
    });
    expect(ledger.held).toBe(10); // a refused reservation holds nothing
  });

  it("defaults to 2 GiB and refuses a budget that is not positive", () => {
    expect(new ByteLedger(undefined).maxBytes).toBe(2 * 1024 ** 3);
    expect(new ByteLedger({}).maxBytes).toBe(DEFAULT_HOMOLOGY_BYTES);
    for (const bad of [0, -5, Number.NaN])
      expect(() => new ByteLedger({ maxBytes: bad })).toThrow(
        new RangeError(`budget.maxBytes must be positive, got ${bad}`),
      );
  });
});

describe("HomologyBudgetError", () => {
  it("writes sizes in GiB, MiB or KiB (1 KiB = 1024 bytes; figures worked by hand)", () => {
    // 3 GiB = 3 · 1024³; 1.5 GiB = 1610612736 bytes; 2,500,000 bytes = 2.38 MiB; 1,048,576 = 1.0 MiB;
    // 1,048,575 bytes is just under 1 MiB: ⌈1048575 / 1024⌉ = 1024 KiB; 1,500 bytes: ⌈1.46⌉ = 2 KiB.
    expect(new HomologyBudgetError("reducing columns", 3 * 1024 ** 3, 1610612736).message).toBe(
      `homology needs more than 1.50 GiB (at least 3.00 GiB) while reducing columns; ${TAIL}`,
    );
    // Exactly 1 GiB and exactly 1 MiB already take the larger unit.
    expect(new HomologyBudgetError("x", 1024 ** 3, 1024 ** 2).message).toBe(
      `homology needs more than 1.0 MiB (at least 1.00 GiB) while x; ${TAIL}`,
    );
    expect(new HomologyBudgetError("x", 2_500_000, 1_048_576).message).toBe(
      `homology needs more than 1.0 MiB (at least 2.4 MiB) while x; ${TAIL}`,
    );
    expect(new HomologyBudgetError("x", 1_048_575, 1_500).message).toBe(
      `homology needs more than 2 KiB (at least 1024 KiB) while x; ${TAIL}`,
    );
  });
});
