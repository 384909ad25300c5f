import type { WorkMonitor } from "../work/work-monitor.js";
import { CHECK_EVERY } from "./count-limits.js";
import type { EnumerationGraph } from "./enumeration-graph.js";
import { popcount32 } from "./popcount.js";
import { rootProgress, SimplexBudgetError } from "./simplex-budget-error.js";

/**
 * Plain simplex counting, nothing stored: for every root, its list becomes a local universe of d vertices
 * with a d×d bit adjacency (32-bit words); simplices grow by `candidates &= row[i]` and each level is
 * counted with a popcount. Ways to do less per simplex:
 * - a candidate set of ≤ 64 members spread over several words is renumbered once into a one- or two-word
 *   universe for its whole subtree; a larger one of the root universe gets a narrower universe of its own;
 *   a set lying in a single word runs there in place (row stride);
 * - levels with two or three candidates are settled inline;
 * - undirected: a candidate set that is itself a clique adds C(c, t) per dimension without enumeration;
 *   rows only hold later vertices, so words before the current one are skipped.
 *
 * State lives in module variables so the recursive hot functions take only numbers.
 */

let loc = new Int32Array(0); // local adjacency, d rows of W words
let stack = new Int32Array(0); // candidate sets, one block of W words per depth
let repacked = new Int32Array(0); // universe of one large candidate set, rows of ceil(c/32) words
const packed = new Int32Array(128);
// members of a set being packed (≤ 64): word, bit and row start in the universe it comes from
const memberWord = new Int32Array(64);
const memberShift = new Int32Array(64);
const memberRow = new Int32Array(64); // rows (word pairs) of a compacted candidate set of ≤ 64 members
let packedIndex = new Int32Array(0); // local index → position in the compacted set
let cnt = new Float64Array(0);
// children with ≥ 2 members of one two-word level, 64 × (word, word, size) per depth
let kids = new Int32Array(0);
let kids1 = new Int32Array(0); // the same for one-word levels, 32 × (set, size) per depth
/** BINOMIAL[c * 33 + t] = C(c, t) for 0 ≤ t ≤ c ≤ 32 (Pascal's rule; exact in doubles). */
const BINOMIAL = new Float64Array(33 * 33);
for (let c = 0; c <= 32; c++) {
  BINOMIAL[c * 33] = 1;
  for (let t = 1; t <= c; t++)
    BINOMIAL[c * 33 + t] = BINOMIAL[(c - 1) * 33 + t - 1] + BINOMIAL[(c - 1) * 33 + t];
}
let W = 1;
let undirected = true;
let capDim = 0; // highest dimension counted
let truncated = false;
const produced = new Float64Array(1); // simplices counted so far, for the budget (a typed cell: no boxing)
let budget = 0;
/** Simplex count at which the budget and the clock are next checked (≤ budget). */
let checkpoint = 0;
let monitor: WorkMonitor | null = null;
let rootIndex = -1; // root being enumerated (-1: before the first)
let rootOffsets: Int32Array = new Int32Array(1);
let nRoots = 0;

export interface PlainCounts {
  counts: Float64Array;
  truncated: boolean;
}

export function countWithBitsets(
  g: EnumerationGraph,
  maxDim: number,
  simplexBudget: number,
  work: WorkMonitor,
): PlainCounts {
  const { n, offsets, targets, maxList } = g;
  const dmax = Math.max(maxList, 1);
  const wmax = (dmax + 31) >>> 5;
  checkLocalSize(dmax, wmax);
  loc = new Int32Array(dmax * wmax);
  capDim = Math.min(maxDim, dmax + 1);
  stack = new Int32Array((Math.min(dmax, capDim) + 3) * wmax);
  packedIndex = new Int32Array(dmax);
  kids = new Int32Array((Math.min(dmax, capDim) + 3) * 192);
  kids1 = new Int32Array((Math.min(dmax, capDim) + 3) * 64);
  repacked = new Int32Array(dmax * wmax);
  cnt = new Float64Array(capDim + 2);
  undirected = !g.directed;
  truncated = false;
  budget = simplexBudget;
  monitor = work;
  checkpoint = 0;
  produced[0] = n;
  cnt[0] = n;
  rootIndex = -1;
  rootOffsets = offsets;
  nRoots = n;
  if (capDim >= 1) cnt[1] = offsets[n];
  else truncated = offsets[n] > 0;
  produced[0] += capDim >= 1 ? offsets[n] : 0;
  if (produced[0] > checkpoint) passCheckpoint(0);

  const mark = new Int32Array(n).fill(-1);
  for (let v = 0; v < n; v++) {
    const a = offsets[v];
    const d = offsets[v + 1] - a;
    if (d < 2 || capDim < 1 || (capDim < 2 && truncated)) continue;
    W = (d + 31) >>> 5;
    for (let i = 0; i < d; i++) mark[targets[a + i]] = i;
    const rows = loc;
    rows.fill(0, 0, d * W);
    for (let i = 0; i < d; i++) {
      const u = targets[a + i];
      const row = i * W;
      const end = offsets[u + 1];
      let s = offsets[u];
      // unrolled by four: this scan is most of the time on sparse graphs
      for (; s + 3 < end; s += 4) {
        const j0 = mark[targets[s]];
        const j1 = mark[targets[s + 1]];
        const j2 = mark[targets[s + 2]];
        const j3 = mark[targets[s + 3]];
        if ((j0 & j1 & j2 & j3) < 0) continue; // all four outside the universe: the common case
        if (j0 >= 0) rows[row + (j0 >>> 5)] |= 1 << (j0 & 31);
        if (j1 >= 0) rows[row + (j1 >>> 5)] |= 1 << (j1 & 31);
        if (j2 >= 0) rows[row + (j2 >>> 5)] |= 1 << (j2 & 31);
        if (j3 >= 0) rows[row + (j3 >>> 5)] |= 1 << (j3 & 31);
      }
      for (; s < end; s++) {
        const j = mark[targets[s]];
        if (j >= 0) rows[row + (j >>> 5)] |= 1 << (j & 31);
      }
    }
    for (let i = 0; i < d; i++) mark[targets[a + i]] = -1;
    rootIndex = v;
    if ((v & 255) === 0) work.check(v);
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
    if (!truncated) truncated = anyEdgeInside(loc, W, 0);
    return;
  }
  if (W === 1) expand1(loc, 0, 1, stack[0], 1);
  else if (W === 2) expand2(loc, stack[0], stack[1], 1);
  else expandWide(loc, W, 0, 1);
}

/**
 * Extends by every member of a one-word candidate set `cand` (simplices of dimension depth+1 and up).
 * Row of member b: rows[base + b * stride], so a set lying in one word of a wider universe runs here
 * without being copied.
 */
function expand1(rows: Int32Array, base: number, stride: number, cand: number, depth: number): void {
  // first pass without a branch on the child's size (as in expand2): those with ≥ 2 members are kept
  const kv = kids1;
  const at = depth << 6;
  let n = 0;
  let total = 0;
  let bits = cand;
  while (bits !== 0) {
    const lowBit = 31 - Math.clz32(bits);
    bits ^= 1 << lowBit;
    const x = cand & rows[base + lowBit * stride];
    const c = popcount32(x);
    total += c;
    const e = at + (n << 1);
    kv[e] = x;
    kv[e + 1] = c;
    n += (1 - c) >>> 31; // c ≥ 2
  }
  cnt[depth + 1] += total;
  produced[0] += total;
  const deeper = depth + 2 <= capDim;
  let pairs = 0;
  let triples = 0;
  for (let i = 0; i < n; i++) {
    const e = at + (i << 1);
    const x = kv[e];
    const c = kv[e + 1];
    if (!deeper) {
      if (!truncated) truncated = anyEdgeIn1(rows, base, stride, x);
    } else if (c === 3 && depth + 3 <= capDim) {
      // three candidates a, b, c: both remaining levels settled inline from the six arc bits, no branch
      const a = 31 - Math.clz32(x);
      const r = x ^ (1 << a);
      const b = 31 - Math.clz32(r);
      const cc = 31 - Math.clz32(r ^ (1 << b));
      const ra = rows[base + a * stride];
      const rb = rows[base + b * stride];
      const rc = rows[base + cc * stride];
      const ab = (ra >>> b) & 1;
      const ac = (ra >>> cc) & 1;
      const ba = (rb >>> a) & 1;
      const bc = (rb >>> cc) & 1;
      const ca = (rc >>> a) & 1;
      const cb = (rc >>> b) & 1;
      pairs += ab + ac + ba + bc + ca + cb;
      triples += (ab & ac) * (bc + cb) + (ba & bc) * (ac + ca) + (ca & cb) * (ab + ba);
    } else if (c >= 3) {
      if (undirected && isClique(rows, base, stride, x)) countClique(c, depth + 1);
      else expand1(rows, base, stride, x, depth + 1);
    } else {
      const j = 31 - Math.clz32(x);
      const k = 31 - Math.clz32(x ^ (1 << j));
      pairs += ((rows[base + j * stride] >>> k) & 1) + ((rows[base + k * stride] >>> j) & 1);
    }
  }
  if (pairs !== 0) {
    cnt[depth + 2] += pairs;
    produced[0] += pairs;
    if (triples !== 0) {
      cnt[depth + 3] += triples;
      produced[0] += triples;
    }
  }
  if (produced[0] > checkpoint) passCheckpoint(depth);
}

/**
 * Undirected only: whether every member of x is adjacent to every later member (rows hold later
 * neighbours only). Stops at the first member that misses one, so failing is cheap.
 */
function isClique(rows: Int32Array, base: number, stride: number, x: number): boolean {
  let bits = x;
  while (bits !== 0) {
    const b = 31 - Math.clz32(bits);
    bits ^= 1 << b;
    // members below b must all list b... equivalently each member lists every member above it
    const above = x & ~((2 << b) - 1);
    if ((rows[base + b * stride] & above) !== above) return false;
  }
  return true;
}

/**
 * The subtree of a candidate set that is itself a clique of c members (already counted at dimension
 * depth): any t of them extend the simplex, C(c, t) simplices of dimension depth + t − 1 for t ≥ 2.
 */
function countClique(c: number, depth: number): void {
  let made = 0;
  for (let t = 2; t <= c; t++) {
    const dim = depth + t - 1;
    if (dim > capDim) {
      truncated = true;
      break;
    }
    const ways = BINOMIAL[c * 33 + t];
    cnt[dim] += ways;
    made += ways;
  }
  produced[0] += made;
}

/**
 * Two-word universe (≤ 64 members, rows are word pairs): the candidate set is held in two numbers.
 * First pass: every member's child set and its size, no branch on the size (most children have fewer
 * than two members; a branch on that mispredicts often); children with ≥ 2 members are kept in
 * `kids` (per depth) and settled in a second pass.
 */
function expand2(rows: Int32Array, c0: number, c1: number, depth: number): void {
  const deeper = depth + 2 <= capDim;
  const kv = kids;
  const at = depth * 192;
  let n = 0;
  let total = 0;
  let bits = c0;
  while (bits !== 0) {
    const b = 31 - Math.clz32(bits);
    bits ^= 1 << b;
    const x0 = c0 & rows[b << 1];
    const x1 = c1 & rows[(b << 1) + 1];
    const c = popcount32(x0) + popcount32(x1);
    total += c;
    const e = at + n * 3;
    kv[e] = x0;
    kv[e + 1] = x1;
    kv[e + 2] = c;
    n += (1 - c) >>> 31; // c ≥ 2
  }
  bits = c1;
  while (bits !== 0) {
    const b = 31 - Math.clz32(bits);
    bits ^= 1 << b;
    const x0 = c0 & rows[(b + 32) << 1];
    const x1 = c1 & rows[((b + 32) << 1) + 1];
    const c = popcount32(x0) + popcount32(x1);
    total += c;
    const e = at + n * 3;
    kv[e] = x0;
    kv[e + 1] = x1;
    kv[e + 2] = c;
    n += (1 - c) >>> 31;
  }
  cnt[depth + 1] += total;
  produced[0] += total;
  let pairs = 0;
  let triples = 0;
  for (let i = 0; i < n; i++) {
    const e = at + i * 3;
    const x0 = kv[e];
    const x1 = kv[e + 1];
    const c = kv[e + 2];
    if (!deeper) {
      if (!truncated) truncated = anyEdgeIn2(rows, x0, x1);
      continue;
    }
    if (c === 2) {
      // two candidates j > k: the next simplex exists once per arc between them
      const j = x1 !== 0 ? 63 - Math.clz32(x1) : 31 - Math.clz32(x0);
      const r0 = j < 32 ? x0 ^ (1 << j) : x0;
      const r1 = j < 32 ? x1 : x1 ^ (1 << (j - 32));
      const k = r1 !== 0 ? 63 - Math.clz32(r1) : 31 - Math.clz32(r0);
      pairs +=
        ((rows[(j << 1) + (k >>> 5)] >>> (k & 31)) & 1) + ((rows[(k << 1) + (j >>> 5)] >>> (j & 31)) & 1);
      continue;
    }
    if (c === 3 && depth + 3 <= capDim) {
      // three candidates: both remaining levels settled inline from the six arc bits, as in expand1
      const a = x1 !== 0 ? 63 - Math.clz32(x1) : 31 - Math.clz32(x0);
      const ha = (31 - a) >> 31; // -1 when a lies in the second word
      const y0 = x0 ^ ((1 << a) & ~ha);
      const y1 = x1 ^ ((1 << a) & ha);
      const b = y1 !== 0 ? 63 - Math.clz32(y1) : 31 - Math.clz32(y0);
      const hb = (31 - b) >> 31;
      const w0 = y0 ^ ((1 << b) & ~hb);
      const w1 = y1 ^ ((1 << b) & hb);
      const cc = w1 !== 0 ? 63 - Math.clz32(w1) : 31 - Math.clz32(w0);
      const ab = (rows[(a << 1) + (b >>> 5)] >>> b) & 1;
      const ac = (rows[(a << 1) + (cc >>> 5)] >>> cc) & 1;
      const ba = (rows[(b << 1) + (a >>> 5)] >>> a) & 1;
      const bc = (rows[(b << 1) + (cc >>> 5)] >>> cc) & 1;
      const ca = (rows[(cc << 1) + (a >>> 5)] >>> a) & 1;
      const cb = (rows[(cc << 1) + (b >>> 5)] >>> b) & 1;
      pairs += ab + ac + ba + bc + ca + cb;
      triples += (ab & ac) * (bc + cb) + (ba & bc) * (ac + ca) + (ca & cb) * (ab + ba);
      continue;
    }
    if (x1 === 0) expand1(rows, 0, 2, x0, depth + 1);
    else if (x0 === 0) expand1(rows, 65, 2, x1, depth + 1);
    else expand2(rows, x0, x1, depth + 1);
  }
  produced[0] += pairs + triples;
  if (pairs !== 0) cnt[depth + 2] += pairs;
  if (triples !== 0) cnt[depth + 3] += triples;
  if (produced[0] > checkpoint) passCheckpoint(depth);
}

function anyEdgeIn2(rows: Int32Array, x0: number, x1: number): boolean {
  for (let w = 0; w < 2; w++) {
    let bits = w === 0 ? x0 : x1;
    while (bits !== 0) {
      const b = 31 - Math.clz32(bits);
      bits ^= 1 << b;
      const row = ((w << 5) + b) << 1;
      if (((x0 & rows[row]) | (x1 & rows[row + 1])) !== 0) return true;
    }
  }
  return false;
}

/** Multi-word version: candidate set in stack[at .. at+Wc) over a universe with rows of Wc words. */
function expandWide(rows: Int32Array, Wc: number, at: number, depth: number): void {
  const st = stack; // module array held in a local for the hot loops
  const next = at + Wc;
  const deeper = depth + 2 <= capDim;
  let total = 0;
  for (let w = 0; w < Wc; w++) {
    let bits = st[at + w];
    while (bits !== 0) {
      const lowBit = 31 - Math.clz32(bits);
      bits ^= 1 << lowBit;
      const row = ((w << 5) + lowBit) * Wc;
      let c = 0;
      let words = 0;
      let only = 0;
      const k0 = undirected ? w : 0;
      for (let k = 0; k < k0; k++) st[next + k] = 0;
      for (let k = k0; k < Wc; k++) {
        const x = st[at + k] & rows[row + k];
        st[next + k] = x;
        if (x !== 0) {
          c += popcount32(x);
          words++;
          only = k;
        }
      }
      if (c === 0) continue;
      total += c;
      if (c === 1) continue;
      if (!deeper) {
        if (!truncated) truncated = anyEdgeInside(rows, Wc, next);
        continue;
      }
      cnt[depth + 1] += total;
      produced[0] += total;
      total = 0;
      if (words === 1) expand1(rows, (only << 5) * Wc + only, Wc, st[next + only], depth + 1);
      else if (c === 2) settlePair(rows, Wc, next, depth);
      else if (c <= 64) expandPacked(rows, Wc, next, c, depth + 1);
      else if (rows === loc && Wc > ((c + 31) >>> 5) + 1) expandRepacked(next, c, depth + 1);
      else expandWide(rows, Wc, next, depth + 1);
    }
  }
  cnt[depth + 1] += total;
  produced[0] += total;
  if (produced[0] > checkpoint) passCheckpoint(depth);
}

/**
 * A large candidate set (> 64 members) of the root universe, renumbered in order into a universe of its
 * own with ceil(c/32)-word rows: its subtree then scans fewer words, and its children pack cheaper.
 */
function expandRepacked(at: number, c: number, depth: number): void {
  const W2 = (c + 31) >>> 5;
  let q = 0;
  for (let k = 0; k < W; k++) {
    for (let b = 0; b < 32; b++) if ((stack[at + k] >>> b) & 1) packedIndex[(k << 5) + b] = q++;
  }
  repacked.fill(0, 0, c * W2);
  q = 0;
  for (let k = 0; k < W; k++) {
    const y = stack[at + k];
    for (let b = 0; b < 32; b++) {
      if (((y >>> b) & 1) === 0) continue;
      const row = ((k << 5) + b) * W;
      const out = q * W2;
      for (let m = undirected ? k : 0; m < W; m++) {
        let z = stack[at + m] & loc[row + m];
        while (z !== 0) {
          const zb = 31 - Math.clz32(z);
          z ^= 1 << zb;
          const p = packedIndex[(m << 5) + zb];
          repacked[out + (p >>> 5)] |= 1 << (p & 31);
        }
      }
      q++;
    }
  }
  for (let k = 0; k < W2; k++) stack[at + k] = 0;
  for (let p = 0; p < c; p++) stack[at + (p >>> 5)] |= 1 << (p & 31);
  expandWide(repacked, W2, at, depth);
}

/** Exactly two candidates j, k in a multi-word set: the (depth+2)-simplex exists iff j~k. */
function settlePair(rows: Int32Array, Wc: number, at: number, depth: number): void {
  let j = -1;
  let k = -1;
  for (let q = 0; q < Wc; q++) {
    let y = stack[at + q];
    while (y !== 0) {
      const lowBit = 31 - Math.clz32(y);
      y ^= 1 << lowBit;
      const b = (q << 5) + lowBit;
      if (j < 0) j = b;
      else k = b;
    }
  }
  const e = ((rows[j * Wc + (k >>> 5)] >>> (k & 31)) & 1) + ((rows[k * Wc + (j >>> 5)] >>> (j & 31)) & 1);
  cnt[depth + 2] += e;
  produced[0] += e;
}

/** Renumbers a candidate set of c ≤ 64 members into a one- or two-word universe and runs its subtree there. */
function expandPacked(rows: Int32Array, Wc: number, at: number, c: number, depth: number): void {
  const st = stack; // module arrays held in locals for the hot loops
  const word = memberWord;
  const shift = memberShift;
  const base = memberRow;
  let q = 0;
  for (let k = 0; k < Wc; k++) {
    let y = st[at + k];
    while (y !== 0) {
      // ascending, so a packed row of the undirected complex holds later members only, like its source
      const low = y & -y;
      const b = 31 - Math.clz32(low);
      y ^= low;
      word[q] = k;
      shift[q] = b;
      base[q++] = ((k << 5) + b) * Wc;
    }
  }
  // Bit p of packed row q is bit (member p) of row (member q): one test per pair, no data-dependent
  // branches (a loop over the set bits of each row word mispredicts on most words).
  const lowEnd = Math.min(c, 32);
  for (q = 0; q < c; q++) {
    const row = base[q];
    let lo = 0;
    let hi = 0;
    let p = undirected ? q + 1 : 0;
    for (; p < lowEnd; p++) lo |= ((rows[row + word[p]] >>> shift[p]) & 1) << p;
    for (; p < c; p++) hi |= ((rows[row + word[p]] >>> shift[p]) & 1) << p;
    packed[q << 1] = lo;
    packed[(q << 1) + 1] = hi;
  }
  if (c <= 32) expand1(packed, 0, 2, c === 32 ? -1 : (1 << c) - 1, depth);
  else expand2(packed, -1, c === 64 ? -1 : (1 << (c - 32)) - 1, depth);
}

function anyEdgeIn1(rows: Int32Array, base: number, stride: number, set: number): boolean {
  let bits = set;
  while (bits !== 0) {
    const lowBit = 31 - Math.clz32(bits);
    bits ^= 1 << lowBit;
    if ((set & rows[base + lowBit * stride]) !== 0) return true;
  }
  return false;
}

function anyEdgeInside(rows: Int32Array, Wc: number, at: number): boolean {
  for (let w = 0; w < Wc; w++) {
    let bits = stack[at + w];
    while (bits !== 0) {
      const lowBit = 31 - Math.clz32(bits);
      bits ^= 1 << lowBit;
      const row = ((w << 5) + lowBit) * Wc;
      for (let k = 0; k < Wc; k++) if ((stack[at + k] & rows[row + k]) !== 0) return true;
    }
  }
  return false;
}

/** Past a checkpoint: stop on the budget or the clock, else set the next checkpoint. */
function passCheckpoint(depth: number): void {
  if (produced[0] > budget) fail(depth);
  monitor?.check(rootIndex + 1);
  checkpoint = Math.min(budget, produced[0] + CHECK_EVERY);
}

/** `depth` 1: the check after a root's top-level expansion, so that root is finished. */
function fail(depth: number): never {
  throw plainBudgetError(budget, cnt, rootOffsets, nRoots, rootIndex, depth === 1, capDim);
}

/**
 * The error of a plain count stopped by its budget at root `root` (`finished`: its subtree is done), with
 * the counts so far (cnt[k], trailing zeros dropped). Shared by the TypeScript and WebAssembly counters.
 */
export function plainBudgetError(
  budget: number,
  cnt: Float64Array,
  offsets: Int32Array,
  n: number,
  root: number,
  finished: boolean,
  capDim: number,
): SimplexBudgetError {
  let top = cnt.length - 1;
  while (top > 0 && cnt[top] === 0) top--;
  // vertices and edges were all counted up front; only roots with ≥ 2 neighbours add more
  const progress = rootProgress(offsets, n, root, finished, 2);
  const upFront = cnt[0] + (capDim >= 1 ? cnt[1] : 0);
  return new SimplexBudgetError(budget, cnt.slice(0, top + 1), progress, upFront);
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
