import { describe, expect, it } from "vitest";
import { ByteLedger } from "./homology-budget.js";
import { ChainSum, IndexChains } from "./index-chains.js";

/** The chain `id` of `chains` as a sorted list. */
function chainOf(chains: IndexChains, id: number): number[] {
  const from = chains.start[id];
  return Array.from(chains.pool.subarray(from, from + chains.length[id])).sort((a, b) => a - b);
}

describe("ChainSum", () => {
  it("sums chains over Z/2: an index met an even number of times cancels", () => {
    const ledger = new ByteLedger(undefined);
    const chains = new IndexChains(ledger);
    const sum = new ChainSum(200, ledger);
    const a = chains.open();
    for (const i of [3, 31, 32, 100]) chains.push(i);
    const b = chains.open();
    for (const i of [31, 32, 33, 199]) chains.push(i);
    sum.add(chains, a);
    sum.add(chains, b);
    sum.toggle(0);
    const id = sum.takeInto(chains);
    expect(chainOf(chains, id)).toEqual([0, 3, 33, 100, 199]);
    // Taken out, the sum is empty again.
    expect(chainOf(chains, sum.takeInto(chains))).toEqual([]);
  });

  it("reads a word once even when it emptied and filled again (listed twice)", () => {
    const ledger = new ByteLedger(undefined);
    const chains = new IndexChains(ledger);
    const sum = new ChainSum(64, ledger);
    sum.toggle(5);
    sum.toggle(5); // the word empties
    sum.toggle(6); // and is listed again
    sum.toggle(40);
    expect(chainOf(chains, sum.takeInto(chains))).toEqual([6, 40]);
  });

  it("against a set, over thousands of random toggles in chains that grow their pool", () => {
    // Common practice: a Set toggled by the same indices is the reference for the Z/2 sum.
    const ledger = new ByteLedger(undefined);
    const chains = new IndexChains(ledger);
    const sum = new ChainSum(5000, ledger);
    let state = 7;
    const next = () => {
      state = (Math.imul(state, 1103515245) + 12345) >>> 0;
      return state % 5000;
    };
    for (let round = 0; round < 20; round++) {
      const reference = new Set<number>();
      for (let k = 0; k < 3000; k++) {
        const i = next();
        sum.toggle(i);
        if (reference.has(i)) reference.delete(i);
        else reference.add(i);
      }
      const id = sum.takeInto(chains);
      expect(chainOf(chains, id)).toEqual([...reference].sort((a, b) => a - b));
    }
  });

  it("charges its bitset and the chains' pools to the ledger, and gives them back", () => {
    const ledger = new ByteLedger(undefined);
    const chains = new IndexChains(ledger);
    const sum = new ChainSum(1 << 16, ledger);
    expect(ledger.held).toBeGreaterThanOrEqual((1 << 16) / 8);
    chains.open();
    for (let i = 0; i < 10_000; i++) chains.push(i);
    expect(ledger.held).toBeGreaterThanOrEqual((1 << 16) / 8 + 4 * 10_000);
    sum.dispose();
    chains.dispose();
    expect(ledger.held).toBe(0);
  });
});
