import { describe, expect, it } from "vitest";
import { ByteLedger } from "./homology-budget.js";
import { WorkingColumn } from "./working-column.js";

/** Reference column: a Map from key to coefficient mod p; f = floor(key / 5) so ties in f are common. */
function smallest(column: Map<number, number>): number | null {
  let best: number | null = null;
  for (const [k, c] of column) if (c !== 0 && (best === null || k < best)) best = k;
  return best;
}

describe("WorkingColumn", () => {
  for (const p of [2, 3]) {
    it(`finds the same pivots as a plain tally while columns are added (Z/${p}; common practice)`, () => {
      const work = new WorkingColumn(new ByteLedger(undefined), 16);
      let x = 5;
      const next = () => {
        x = (x * 1103515245 + 12345) % 2147483648;
        return x;
      };
      for (let round = 0; round < 30; round++) {
        work.reset(p);
        const reference = new Map<number, number>();
        const add = (key: number, coef: number) => {
          work.push(Math.floor(key / 5), key, coef);
          reference.set(key, ((reference.get(key) ?? 0) + coef) % p);
        };
        for (let i = 0; i < 40; i++) add(next() % 3000, 1 + (next() % (p - 1)));
        work.commit();
        for (let step = 0; step < 300; step++) {
          const expected = smallest(reference);
          const found = work.settle();
          expect(found ? work.pivotKey : null).toBe(expected);
          if (!found) break;
          expect(work.pivotCoef).toBe(reference.get(work.pivotKey));
          expect(work.pivotF).toBe(Math.floor(work.pivotKey / 5));
          // Cancel the pivot with a column starting at it, as the reduction does; half the time as a
          // sorted run (addSorted), half as loose pushes (commit); some entries repeat.
          const pivot = work.pivotKey;
          const keys = [pivot];
          const length = next() % 3000 === 0 ? 5000 : next() % 60;
          for (let i = 0; i < length; i++) keys.push(pivot + 1 + (next() % 2000));
          const coefs = keys.map((_, i) => (i === 0 ? p - work.pivotCoef : 1 + (next() % (p - 1))));
          // Rebuilt columns may carry entries before the pivot that cancel among themselves.
          if (pivot > 10 && next() % 2 === 0) {
            const early = next() % pivot;
            keys.push(early, early);
            coefs.push(1, p - 1);
          }
          if (step % 2 === 0 || keys.some((k) => k < pivot)) {
            for (let i = 0; i < keys.length; i++) add(keys[i], coefs[i]);
            work.commit();
          } else {
            const order = keys.map((_, i) => i).sort((a, b) => keys[a] - keys[b]);
            const f = Float64Array.from(order, (i) => Math.floor(keys[i] / 5));
            const k = Float64Array.from(order, (i) => keys[i]);
            const c = Int32Array.from(order, (i) => coefs[i]);
            for (let i = 0; i < keys.length; i++)
              reference.set(keys[i], ((reference.get(keys[i]) ?? 0) + coefs[i]) % p);
            work.addSorted(f, k, c, 0, keys.length, 1);
          }
        }
      }
    });
  }
});
