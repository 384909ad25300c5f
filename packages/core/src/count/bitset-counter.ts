import type { EnumerationGraph } from "./enumeration-graph.js";
import { popcount32 } from "./popcount.js";
import { SimplexBudgetError } from "./simplex-budget-error.js";

/**
 * Plain simplex counting, nothing stored: for every root, its list becomes a local universe of d vertices
 * with a d×d bit adjacency (Uint32 words); simplices grow by `candidates &= row[i]` and each level is
 * counted with a popcount. A multi-word candidate set with ≤ 32 members is renumbered into one word for
 * its whole subtree, and a level with exactly two candidates is settled inline. Undirected rows only hold
 * later vertices, so words before the current one are skipped.
 *
 * State lives in module variables so the recursive hot functions take only numbers.
 */

let loc = new Uint32Array(0); // local adjacency, d rows of W words
let stack = new Uint32Array(0); // candidate sets, one block of W words per depth
const packed = new Uint32Array(32); // one-word universe of a compacted candidate set
let packedIndex = new Int32Array(0); // local index → position in the compacted set
let cnt = new Float64Array(0);
let W = 1;
let undirected = true;
let capDim = 0; // highest dimension counted
let truncated = false;
let produced = 0; // simplices counted so far, for the budget
let budget = 0;
let progress = 0;

export interface PlainCounts {
  counts: Float64Array;
  truncated: boolean;
}

export function countWithBitsets(g: EnumerationGraph, maxDim: number, simplexBudget: number): PlainCounts {
  const { n, offsets, targets, maxList } = g;
  const dmax = Math.max(maxList, 1);
  const wmax = (dmax + 31) >>> 5;
  checkLocalSize(dmax, wmax);
  loc = new Uint32Array(dmax * wmax);
  capDim = Math.min(maxDim, dmax + 1);
  stack = new Uint32Array((Math.min(dmax, capDim) + 3) * wmax);
  packedIndex = new Int32Array(dmax);
  cnt = new Float64Array(capDim + 2);
  undirected = !g.directed;
  truncated = false;
  budget = simplexBudget;
  produced = n;
  cnt[0] = n;
  progress = 0;
  if (capDim >= 1) cnt[1] = offsets[n];
  else truncated = offsets[n] > 0;
  produced += capDim >= 1 ? offsets[n] : 0;
  if (produced > budget) fail();

  const mark = new Int32Array(n).fill(-1);
  for (let v = 0; v < n; v++) {
    const a = offsets[v];
    const d = offsets[v + 1] - a;
    if (d < 2 || capDim < 1 || (capDim < 2 && truncated)) continue;
    W = (d + 31) >>> 5;
    for (let i = 0; i < d; i++) mark[targets[a + i]] = i;
    loc.fill(0, 0, d * W);
    for (let i = 0; i < d; i++) {
      const u = targets[a + i];
      const row = i * W;
      for (let s = offsets[u]; s < offsets[u + 1]; s++) {
        const j = mark[targets[s]];
        if (j >= 0) loc[row + (j >>> 5)] |= 1 << (j & 31);
      }
    }
    for (let i = 0; i < d; i++) mark[targets[a + i]] = -1;
    progress = v / n;
    runLocal(d);
  }
  let top = cnt.length - 1;
  while (top > 0 && cnt[top] === 0) top--;
  return { counts: cnt.slice(0, n === 0 ? 0 : top + 1), truncated };
}

function runLocal(d: number): void {
  for (let k = 0; k < W; k++) stack[k] = 0;
  for (let i = 0; i < d; i++) stack[i >>> 5] |= 1 << (i & 31);
  if (capDim < 2) {
    if (!truncated) truncated = anyEdgeInside(0);
    return;
  }
  if (W === 1) expand1(loc, stack[0] | 0, 1);
  else expandWide(0, 1);
}

/** Extends by every member of a one-word candidate set `cand` (simplices of dimension depth+1). */
function expand1(rows: Uint32Array, cand: number, depth: number): void {
  let total = 0;
  let bits = cand;
  const deeper = depth + 2 <= capDim;
  while (bits !== 0) {
    const low = bits & -bits;
    bits ^= low;
    const x = cand & rows[31 - Math.clz32(low)];
    if (x === 0) continue;
    const c = popcount32(x);
    total += c;
    if (c === 1) continue;
    if (!deeper) {
      if (!truncated) truncated = anyEdgeIn1(rows, x);
    } else if (c >= 3) {
      cnt[depth + 1] += total;
      produced += total;
      total = 0;
      expand1(rows, x, depth + 1);
    } else {
      const lj = x & -x;
      const lk = x ^ lj;
      const j = 31 - Math.clz32(lj);
      const k = 31 - Math.clz32(lk);
      const e = ((rows[j] >>> k) & 1) + ((rows[k] >>> j) & 1);
      cnt[depth + 2] += e;
      produced += e;
    }
  }
  cnt[depth + 1] += total;
  produced += total;
  if (produced > budget) fail();
}

/** Multi-word version: candidate set in stack[at .. at+W). */
function expandWide(at: number, depth: number): void {
  const next = at + W;
  const deeper = depth + 2 <= capDim;
  let total = 0;
  for (let w = 0; w < W; w++) {
    let bits = stack[at + w] | 0;
    while (bits !== 0) {
      const low = bits & -bits;
      bits ^= low;
      const row = ((w << 5) + 31 - Math.clz32(low)) * W;
      let c = 0;
      const k0 = undirected ? w : 0;
      for (let k = 0; k < k0; k++) stack[next + k] = 0;
      for (let k = k0; k < W; k++) {
        const x = stack[at + k] & loc[row + k];
        stack[next + k] = x;
        if (x !== 0) c += popcount32(x);
      }
      if (c === 0) continue;
      total += c;
      if (c === 1) continue;
      if (!deeper) {
        if (!truncated) truncated = anyEdgeInside(next);
      } else if (c >= 3) {
        cnt[depth + 1] += total;
        produced += total;
        total = 0;
        if (c <= 32) expandPacked(next, c, depth + 1);
        else expandWide(next, depth + 1);
      } else {
        settlePair(next, depth);
      }
    }
  }
  cnt[depth + 1] += total;
  produced += total;
  if (produced > budget) fail();
}

/** Exactly two candidates j, k in a multi-word set: the (depth+2)-simplex exists iff j~k. */
function settlePair(at: number, depth: number): void {
  let j = -1;
  let k = -1;
  for (let q = 0; q < W; q++) {
    let y = stack[at + q] | 0;
    while (y !== 0) {
      const low = y & -y;
      y ^= low;
      const b = (q << 5) + 31 - Math.clz32(low);
      if (j < 0) j = b;
      else k = b;
    }
  }
  const e = ((loc[j * W + (k >>> 5)] >>> (k & 31)) & 1) + ((loc[k * W + (j >>> 5)] >>> (j & 31)) & 1);
  cnt[depth + 2] += e;
  produced += e;
}

/** Renumbers a candidate set of c ≤ 32 members into one word and runs its subtree there. */
function expandPacked(at: number, c: number, depth: number): void {
  let q = 0;
  for (let k = 0; k < W; k++) {
    let y = stack[at + k] | 0;
    while (y !== 0) {
      const low = y & -y;
      y ^= low;
      packedIndex[(k << 5) + 31 - Math.clz32(low)] = q++;
    }
  }
  q = 0;
  for (let k = 0; k < W; k++) {
    let y = stack[at + k] | 0;
    while (y !== 0) {
      const low = y & -y;
      y ^= low;
      const row = ((k << 5) + 31 - Math.clz32(low)) * W;
      let packedRow = 0;
      for (let m = undirected ? k : 0; m < W; m++) {
        let z = stack[at + m] & loc[row + m];
        while (z !== 0) {
          const lz = z & -z;
          z ^= lz;
          packedRow |= 1 << packedIndex[(m << 5) + 31 - Math.clz32(lz)];
        }
      }
      packed[q++] = packedRow;
    }
  }
  expand1(packed, c === 32 ? -1 : (1 << c) - 1, depth);
}

function anyEdgeIn1(rows: Uint32Array, set: number): boolean {
  let bits = set;
  while (bits !== 0) {
    const low = bits & -bits;
    bits ^= low;
    if ((set & rows[31 - Math.clz32(low)]) !== 0) return true;
  }
  return false;
}

function anyEdgeInside(at: number): boolean {
  for (let w = 0; w < W; w++) {
    let bits = stack[at + w] | 0;
    while (bits !== 0) {
      const low = bits & -bits;
      bits ^= low;
      const row = ((w << 5) + 31 - Math.clz32(low)) * W;
      for (let k = 0; k < W; k++) if ((stack[at + k] & loc[row + k]) !== 0) return true;
    }
  }
  return false;
}

function fail(): never {
  let top = cnt.length - 1;
  while (top > 0 && cnt[top] === 0) top--;
  throw new SimplexBudgetError(budget, cnt.slice(0, top + 1), progress);
}

/** Local bit matrices are d×d bits; refuse clearly rather than run out of memory on a huge hub. */
export function checkLocalSize(dmax: number, wmax: number): void {
  const bytes = dmax * wmax * 4;
  if (bytes > 2 ** 30) {
    throw new RangeError(
      `a local universe of ${dmax} vertices needs a ${(bytes / 2 ** 30).toFixed(1)} GiB bit matrix; ` +
        "the counter supports local universes up to about 90,000 vertices (threshold the graph more strictly)",
    );
  }
}
