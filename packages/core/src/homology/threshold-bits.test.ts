import { describe, expect, it } from "vitest";
import { ByteLedger, HomologyBudgetError } from "./homology-budget.js";
import { ThresholdBits } from "./threshold-bits.js";

/** Small seeded generator (a linear congruential one) so that the cases are reproducible. */
function generator(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

/** A symmetric n × n value matrix (Infinity on the diagonal and for absent edges) and its sorted rows. */
function rows(n: number, levels: number, random: () => number) {
  const m = new Float64Array(n * n).fill(Infinity);
  for (let u = 0; u < n; u++)
    for (let v = u + 1; v < n; v++) {
      if (random() < 0.2) continue; // absent
      const x = Math.floor(random() * levels) - levels / 2; // ties, negative values
      m[u * n + v] = x;
      m[v * n + u] = x;
    }
  const order = new Int32Array(n * n);
  const sorted = new Float64Array(n * n);
  for (let u = 0; u < n; u++) {
    const vs = Array.from({ length: n }, (_, v) => v).sort((a, b) => m[u * n + a] - m[u * n + b] || a - b);
    for (let r = 0; r < n; r++) {
      order[u * n + r] = vs[r];
      sorted[u * n + r] = m[u * n + vs[r]];
    }
  }
  return { m, order, sorted };
}

/** The members of vertex u's set in `bits`, read bit by bit. */
function members(bits: ThresholdBits, at: number, n: number): number[] {
  const out: number[] = [];
  for (let v = 0; v < n; v++) if ((bits.data[at + (v >>> 5)] >>> (v & 31)) & 1) out.push(v);
  return out;
}

describe("ThresholdBits", () => {
  it("holds, for each vertex, exactly the neighbours with edge value ≤ the threshold (direct filter, common practice)", () => {
    const random = generator(3122026);
    for (const n of [1, 31, 32, 33, 45, 70, 130]) {
      const { m, order, sorted } = rows(n, 9, random);
      const bits = new ThresholdBits(n, order, sorted, new ByteLedger(undefined));
      expect(bits.words).toBe(Math.ceil(n / 32));
      // More thresholds than slots, in turns, so slots are handed on and their sets rebuilt.
      const thresholds = [-4.5, -1, 0, 2, 3.5, Number.NEGATIVE_INFINITY, 1e300, -1, 2];
      for (let round = 0; round < 3; round++)
        for (const t of thresholds) {
          const slot = bits.use(t);
          for (let k = 0; k < Math.min(n, 12); k++) {
            const u = Math.floor(random() * n);
            const expected = [];
            for (let v = 0; v < n; v++) if (m[u * n + v] <= t) expected.push(v);
            expect(members(bits, bits.row(slot, u), n), `n=${n}, t=${t}, u=${u}`).toEqual(expected);
          }
        }
    }
  });

  it("keeps the last four thresholds, giving a new one the slot asked least recently (worked by hand)", () => {
    const { order, sorted } = rows(40, 5, generator(7));
    const bits = new ThresholdBits(40, order, sorted, new ByteLedger(undefined));
    const a = bits.use(1);
    const b = bits.use(2);
    const c = bits.use(3);
    const d = bits.use(4);
    expect(new Set([a, b, c, d]).size).toBe(4);
    expect(bits.use(1)).toBe(a); // kept, and now the most recent
    expect(bits.use(5)).toBe(b); // 2 was asked least recently
    expect(bits.use(3)).toBe(c);
    expect(bits.use(4)).toBe(d);
    expect(bits.use(6)).toBe(a); // 1 is now the least recent
    expect(bits.use(2)).toBe(b); // 5 was
  });

  it("rebuilds a vertex's set when its slot passes to another threshold, not only when the vertex is new", () => {
    // Vertex 0's edges: 1 → 1, 2 → 2, 3 → 3 (worked by hand).
    const n = 4;
    const m = new Float64Array(n * n).fill(Infinity);
    for (const [v, x] of [
      [1, 1],
      [2, 2],
      [3, 3],
    ]) {
      m[v] = x;
      m[v * n] = x;
    }
    const order = new Int32Array([1, 2, 3, 0, 0, 2, 3, 1, 0, 1, 3, 2, 0, 1, 2, 3]);
    const sorted = new Float64Array(n * n);
    for (let u = 0; u < n; u++) for (let r = 0; r < n; r++) sorted[u * n + r] = m[u * n + order[u * n + r]];
    const bits = new ThresholdBits(n, order, sorted, new ByteLedger(undefined));
    expect(members(bits, bits.row(bits.use(2), 0), n)).toEqual([1, 2]);
    for (const t of [10, 11, 12, 13]) bits.use(t); // the slot of 2 passes to 13
    expect(members(bits, bits.row(bits.use(1), 0), n)).toEqual([1]);
    expect(members(bits, bits.row(bits.use(3), 0), n)).toEqual([1, 2, 3]);
    expect(members(bits, bits.row(bits.use(2.5), 0), n)).toEqual([1, 2]);
    expect(members(bits, bits.row(bits.use(0), 0), n)).toEqual([]);
  });

  it("hands out stamps that its Int32Array stamps hold exactly across the wrap after 2^31 − 1 thresholds (white-box)", () => {
    // A set is current when its stamp equals its slot's (Int32Array), and each new threshold takes the next
    // stamp, so a stamp must never be handed out again while an old set may still hold it. The counter
    // counts new thresholds; after 2^31 − 1 of them it restarts with every stamp cleared. Were it to run on,
    // the stored stamps would go negative and, 2^32 thresholds from the start, repeat ones still held (0,
    // a set never built, first): a stale set read as current. From the state set here that is 2^31 + 5 more
    // thresholds, about 30 s of calls (measured at 13–15 ns a call), so this test puts the counter 4 short of
    // the wrap (through a cast) and checks, across the wrap, that each slot's stamp is the counter itself
    // and every set asked for equals the direct filter.
    const n = 45;
    const { m, order, sorted } = rows(n, 9, generator(31));
    const bits = new ThresholdBits(n, order, sorted, new ByteLedger(undefined));
    const inside = bits as unknown as { stamp: number; slotStamp: Int32Array };
    const check = (t: number, vertices: number[]) => {
      const slot = bits.use(t);
      expect(inside.slotStamp[slot], `the stamp of threshold ${t}'s slot`).toBe(inside.stamp);
      for (const u of vertices) {
        const expected = [];
        for (let v = 0; v < n; v++) if (m[u * n + v] <= t) expected.push(v);
        expect(members(bits, bits.row(slot, u), n), `t=${t}, u=${u}`).toEqual(expected);
      }
      return inside.stamp;
    };
    const all = Array.from({ length: n }, (_, u) => u);
    const even = all.filter((u) => u % 2 === 0);
    // Stamps 1–4 in the four slots, every set built.
    expect([-2, 0, 2, 4].map((t) => check(t, all))).toEqual([1, 2, 3, 4]);
    // As after 2^31 − 5 thresholds: the four slots pass to new thresholds (only the even vertices' sets
    // built again), then the counter wraps, and the first slot comes back with stamp 1, which its odd
    // vertices' sets still hold from threshold −2 unless the wrap cleared them.
    inside.stamp = 0x7fffffff - 4;
    expect([-3, -1, 1, 3].map((t) => check(t, even))).toEqual([
      0x7ffffffc, 0x7ffffffd, 0x7ffffffe, 0x7fffffff,
    ]);
    expect([5, -4, 1e300, 0.5, -2].map((t) => check(t, all))).toEqual([1, 2, 3, 4, 5]);
  });

  it("charges its sets and stamps to the budget, naming the stage", () => {
    const { order, sorted } = rows(70, 5, generator(9));
    const ledger = new ByteLedger(undefined);
    const bits = new ThresholdBits(70, order, sorted, ledger);
    expect(ledger.held).toBe(4 * 70 * (3 + 1) * 4); // 4 slots, 70 vertices, 3 words and a stamp each
    expect(bits.data.byteLength).toBeLessThan(ledger.held);
    let error: unknown;
    try {
      new ThresholdBits(70, order, sorted, new ByteLedger({ maxBytes: 4000 }));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HomologyBudgetError);
    expect((error as HomologyBudgetError).stage).toBe("building the dense rows' threshold sets");
  });
});
