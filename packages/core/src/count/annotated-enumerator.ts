import type { WorkMonitor } from "../work/work-monitor.js";
import { checkLocalSize } from "./bitset-counter.js";
import { CHECK_EVERY } from "./count-limits.js";
import type { EnumerationGraph } from "./enumeration-graph.js";
import { popcount32 } from "./popcount.js";
import { rootProgress, SimplexBudgetError } from "./simplex-budget-error.js";

/**
 * Simplex enumeration that also records, per simplex, its threshold bin and (optionally) which nodes and
 * edges it contains. Same local universes and bit rows as the plain counter; in addition every candidate
 * carries the largest bin of its edges to the current simplex (`carried`), updated for the members of
 * each new candidate set, so a simplex's bin costs O(1). Without participation, candidate sets in one word
 * run in a single-word routine (grow1), sets of ≤ 32 members spread over words are packed into one word
 * with their edge bins (growPacked), and levels with one or two candidates are settled inline.
 *
 * Participation uses subtrees: a simplex's vertices are the vertices added along its path from the root,
 * so the vertex added at node t lies in exactly the simplices of t's subtree, and so does each edge from
 * an earlier path vertex to it. Per internal node we snapshot the per-dimension totals and credit the
 * difference on return; per leaf we credit 1. Nothing is allocated per simplex.
 */

export interface AnnotateOptions {
  maxDim: number;
  budget: number;
  /** Clock and progress of the computation. */
  monitor: WorkMonitor;
  /** Bin per input CSR slot (all listed edges have bin ≥ 0), or null for a single bin. */
  bins: Int32Array | null;
  binCount: number;
  participation: boolean;
  edgeParticipation: boolean;
  /** Total CSR slots of the input graph (edge participation rows). */
  slotCount: number;
  /** Undirected edge participation: the twin slot of each slot. */
  reverse: Int32Array | null;
}

export interface AnnotatedResult {
  /** hist[k][b] = number of k-simplices entering at bin b. */
  hist: Float64Array[];
  truncated: boolean;
  member?: Float64Array[];
  source?: Float64Array[];
  sink?: Float64Array[];
  edges?: Float64Array[];
}

let loc = new Uint32Array(0);
let stack = new Uint32Array(0);
let lbin = new Int32Array(0); // bin of the edge between local vertices i, j at i*D + j
let lslot = new Int32Array(0); // input slot of that edge
let rootBin = new Int32Array(0);
let rootSlot = new Int32Array(0);
let carried = new Int32Array(0); // carried[level*D + c]
let path = new Int32Array(0);
// one packed universe of ≤ 32 candidates at a time (see packAnnotated)
const packedRows = new Int32Array(32);
const packedBin = new Int32Array(32 * 32);
const packedLocal = new Int32Array(32);
let packedIndex = new Int32Array(0);
let packedCarried = new Int32Array(0); // [level * 32 + packed index]
let run = new Float64Array(0); // simplices counted per dimension
let hist = new Float64Array(0); // flat [dim*G + bin]
let snaps = new Float64Array(0);
let sp = 0;
let W = 1;
let D = 1;
let G = 1;
let undirected = true;
let capDim = 0;
let truncated = false;
const produced = new Float64Array(1); // a typed cell: no boxing in the hot loop
let budget = 0;
/** Simplex count at which the budget and the clock are next checked (≤ budget). */
let checkpoint = 0;
let monitor: WorkMonitor | null = null;
let rootIndex = -1; // root being enumerated (-1: before the first)
let rootOffsets: Int32Array = new Int32Array(1);
let withBins = false;
let credit = false; // any participation
let creditNodes = false;
let creditEdges = false;
let directedRoles = false;
let listBase = 0;
let gTargets: Int32Array = new Int32Array(0);
let vertexOf: Int32Array = new Int32Array(0);
let reverse: Int32Array | null = null;
let nVertices = 0;
let slotCount = 0;
let member: Float64Array[] = [];
let source: Float64Array[] = [];
let sink: Float64Array[] = [];
let edges: Float64Array[] = [];

export function enumerateAnnotated(g: EnumerationGraph, o: AnnotateOptions): AnnotatedResult {
  const { n, offsets, targets, slots, maxList } = g;
  const dmax = Math.max(maxList, 1);
  const wmax = (dmax + 31) >>> 5;
  checkLocalSize(dmax, wmax);
  capDim = Math.min(o.maxDim, dmax + 1);
  const levels = Math.min(dmax, capDim) + 3;
  withBins = o.bins !== null;
  creditNodes = o.participation;
  creditEdges = o.edgeParticipation;
  credit = creditNodes || creditEdges;
  directedRoles = creditNodes && g.directed;
  if ((withBins || creditEdges) && dmax * dmax > 2 ** 28) {
    throw new RangeError(`a local universe of ${dmax} vertices is too large for per-edge annotations`);
  }
  loc = new Uint32Array(dmax * wmax);
  stack = new Uint32Array(levels * wmax);
  lbin = withBins ? new Int32Array(dmax * dmax) : new Int32Array(0);
  lslot = creditEdges ? new Int32Array(dmax * dmax) : new Int32Array(0);
  rootBin = new Int32Array(dmax);
  rootSlot = new Int32Array(dmax);
  carried = withBins ? new Int32Array(levels * dmax) : new Int32Array(0);
  path = new Int32Array(levels + 1);
  packedIndex = new Int32Array(dmax);
  packedCarried = withBins ? new Int32Array((levels + 1) * 32) : new Int32Array(0);
  G = withBins ? o.binCount : 1;
  run = new Float64Array(capDim + 2);
  hist = new Float64Array((capDim + 2) * G);
  snaps = new Float64Array(credit ? 4 * (dmax + 2) : 0);
  sp = 0;
  undirected = !g.directed;
  truncated = false;
  budget = o.budget;
  monitor = o.monitor;
  checkpoint = 0;
  produced[0] = n;
  rootIndex = -1;
  rootOffsets = offsets;
  gTargets = targets;
  vertexOf = g.vertexOf;
  reverse = o.reverse;
  nVertices = n;
  slotCount = o.slotCount;
  member = [];
  source = [];
  sink = [];
  edges = [];
  if (credit) ensureRows(Math.min(1, capDim));
  if (creditNodes) {
    member[0].fill(1);
    if (directedRoles) {
      source[0].fill(1);
      sink[0].fill(1);
    }
  }
  hist[0] = n;
  run[0] = n;
  if (produced[0] > checkpoint) passCheckpoint(false);
  if (capDim < 1) {
    truncated = offsets[n] > 0;
    return finish();
  }

  const bins = o.bins;
  const mark = new Int32Array(n).fill(-1);
  for (let v = 0; v < n; v++) {
    const a = offsets[v];
    const d = offsets[v + 1] - a;
    if (d === 0) continue;
    W = (d + 31) >>> 5;
    D = d;
    listBase = a;
    for (let i = 0; i < d; i++) {
      mark[targets[a + i]] = i;
      if (withBins) rootBin[i] = bins![slots[a + i]];
      rootSlot[i] = slots[a + i];
    }
    loc.fill(0, 0, d * W);
    // The widest row bounds the dimension of the root's simplices: (v, u, w, …) needs w, … in u's row.
    let widest = 0;
    for (let i = 0; i < d; i++) {
      const u = targets[a + i];
      const row = i * W;
      let width = 0;
      for (let s = offsets[u]; s < offsets[u + 1]; s++) {
        const j = mark[targets[s]];
        if (j < 0) continue;
        width++;
        loc[row + (j >>> 5)] |= 1 << (j & 31);
        if (withBins) lbin[i * d + j] = bins![slots[s]];
        if (creditEdges) lslot[i * d + j] = slots[s];
      }
      if (width > widest) widest = width;
    }
    for (let i = 0; i < d; i++) mark[targets[a + i]] = -1;
    rootIndex = v;
    if ((v & 255) === 0) o.monitor.check(v);
    for (let k = 0; k < W; k++) stack[k] = 0;
    for (let i = 0; i < d; i++) {
      stack[i >>> 5] |= 1 << (i & 31);
      if (withBins) carried[i] = rootBin[i];
    }
    const root = vertexOf[v];
    if (credit) {
      // Rows for the dimensions this root can reach, not for d of them (a hub of 16,385 leaves asked for
      // 6 GB of participation rows).
      const hi = Math.min(capDim, d, widest + 1);
      ensureRows(hi);
      const base = push(1, hi);
      grow(0, 0, 0);
      if (creditNodes) {
        for (let k = 1; k <= hi; k++) {
          const diff = run[k] - snaps[base + k - 1];
          member[k][root] += diff;
          if (directedRoles) source[k][root] += diff;
        }
      }
      sp = base;
    } else if (W === 1) {
      grow1(0, stack[0], 0, 0);
    } else {
      grow(0, 0, 0);
    }
  }
  return finish();
}

/** Extends simplex path[0..level] (entering at bin `simplexBin`) by each candidate in stack[at..). */
function grow(level: number, at: number, simplexBin: number): void {
  const dim = level + 1;
  const deeper = dim + 1 <= capDim;
  const next = at + W;
  const cRow = level * D;
  const nRow = cRow + D;
  const histRow = dim * G;
  let made = 0;
  for (let w = 0; w < W; w++) {
    let bits = stack[at + w] | 0;
    while (bits !== 0) {
      const lowBit = 31 - Math.clz32(bits);
      bits ^= 1 << lowBit;
      const i = (w << 5) + lowBit;
      let b = simplexBin;
      if (withBins) {
        const ci = carried[cRow + i];
        if (ci > b) b = ci;
      }
      hist[histRow + b]++;
      made++;
      if (directedRoles) sink[dim][vertexOf[gTargets[listBase + i]]]++;
      const row = i * W;
      let c = 0;
      let words = 0;
      let only = 0;
      let members = 0;
      const k0 = undirected ? w : 0;
      for (let k = 0; k < k0; k++) stack[next + k] = 0;
      for (let k = k0; k < W; k++) {
        const x = stack[at + k] & loc[row + k];
        stack[next + k] = x;
        c |= x;
        if (x !== 0) {
          words++;
          only = k;
          members += popcount32(x);
        }
      }
      if (c !== 0 && !deeper) {
        truncated = true;
        c = 0;
      }
      if (c === 0) {
        if (credit) creditLeaf(dim, i);
        continue;
      }
      path[dim] = i;
      if (words === 1 && !credit) {
        // the candidates lie in one word: carry their bins there and go on with single words
        const off = only << 5;
        let y = stack[next + only];
        if (withBins) {
          while (y !== 0) {
            const yb = 31 - Math.clz32(y);
            y ^= 1 << yb;
            const j = off + yb;
            carried[nRow + j] = Math.max(lbin[i * D + j], carried[cRow + j]);
          }
        }
        grow1(level + 1, stack[next + only], b, only);
        continue;
      }
      if (members >= 3 && members <= 32 && !credit) {
        packAnnotated(i, next, cRow, level + 1, members);
        growPacked(level + 1, members === 32 ? -1 : (1 << members) - 1, b);
        continue;
      }
      let size = 0;
      let first = -1;
      let second = -1;
      for (let k = k0; k < W; k++) {
        let y = stack[next + k] | 0;
        while (y !== 0) {
          const lyBit = 31 - Math.clz32(y);
          y ^= 1 << lyBit;
          const j = (k << 5) + lyBit;
          size++;
          second = first;
          first = j;
          if (withBins) {
            const e = lbin[i * D + j];
            const cj = carried[cRow + j];
            carried[nRow + j] = Math.max(e, cj);
          }
        }
      }
      if (size <= 2 && !credit) {
        // one or two candidates: their simplices (and the one or two above, directed) are settled here
        const up = histRow + G;
        const bj = withBins ? Math.max(b, carried[nRow + first]) : 0;
        hist[up + bj]++;
        if (size === 1) {
          run[dim + 1]++;
          produced[0]++;
          continue;
        }
        const bk = withBins ? Math.max(b, carried[nRow + second]) : 0;
        hist[up + bk]++;
        run[dim + 1] += 2;
        produced[0] += 2;
        const arcs =
          ((loc[first * W + (second >>> 5)] >>> (second & 31)) & 1) +
          ((loc[second * W + (first >>> 5)] >>> (first & 31)) & 1);
        if (arcs === 0) continue;
        if (dim + 2 > capDim) {
          truncated = true;
          continue;
        }
        const both = Math.max(bj, bk);
        if ((loc[first * W + (second >>> 5)] >>> (second & 31)) & 1) {
          hist[up + G + (withBins ? Math.max(both, lbin[first * D + second]) : 0)]++;
        }
        if ((loc[second * W + (first >>> 5)] >>> (first & 31)) & 1) {
          hist[up + G + (withBins ? Math.max(both, lbin[second * D + first]) : 0)]++;
        }
        run[dim + 2] += arcs;
        produced[0] += arcs;
        continue;
      }
      if (credit) {
        const hi = Math.min(capDim, dim + size);
        ensureRows(hi);
        const base = push(dim + 1, hi);
        grow(level + 1, next, b);
        creditSubtree(dim, i, hi, base);
        sp = base;
      } else {
        grow(level + 1, next, b);
      }
    }
  }
  run[dim] += made;
  produced[0] += made;
  if (produced[0] > checkpoint) passCheckpoint(level === 0);
}

/**
 * grow() for a candidate set lying in one word `word` of the universe (no participation): the set is a
 * number, member b is local vertex 32·word + b, its row word is loc[(32·word + b)·W + word].
 */
function grow1(level: number, cand: number, simplexBin: number, word: number): void {
  const dim = level + 1;
  const deeper = dim + 1 <= capDim;
  const cRow = level * D;
  const nRow = cRow + D;
  const histRow = dim * G;
  const off = word << 5;
  let made = 0;
  let above = 0;
  let aboveTwo = 0;
  let bits = cand;
  while (bits !== 0) {
    const ib = 31 - Math.clz32(bits);
    bits ^= 1 << ib;
    const i = off + ib;
    let b = simplexBin;
    if (withBins) {
      const ci = carried[cRow + i];
      if (ci > b) b = ci;
    }
    hist[histRow + b]++;
    made++;
    if (directedRoles) sink[dim][vertexOf[gTargets[listBase + i]]]++;
    const x = cand & loc[i * W + word];
    if (x === 0) continue;
    if (!deeper) {
      truncated = true;
      continue;
    }
    const first = 31 - Math.clz32(x);
    const rest = x ^ (1 << first);
    if (rest === 0 || (rest & (rest - 1)) === 0) {
      // one or two candidates: settled here, like grow()
      const j = off + first;
      const up = histRow + G;
      const bj = withBins ? Math.max(b, lbin[i * D + j], carried[cRow + j]) : 0;
      hist[up + bj]++;
      if (rest === 0) {
        above++;
        continue;
      }
      const k = off + 31 - Math.clz32(rest);
      const bk = withBins ? Math.max(b, lbin[i * D + k], carried[cRow + k]) : 0;
      hist[up + bk]++;
      above += 2;
      const jk = (loc[j * W + word] >>> (k - off)) & 1;
      const kj = (loc[k * W + word] >>> (j - off)) & 1;
      if (jk + kj === 0) continue;
      if (dim + 2 > capDim) {
        truncated = true;
        continue;
      }
      const both = Math.max(bj, bk);
      if (jk !== 0) hist[up + G + (withBins ? Math.max(both, lbin[j * D + k]) : 0)]++;
      if (kj !== 0) hist[up + G + (withBins ? Math.max(both, lbin[k * D + j]) : 0)]++;
      aboveTwo += jk + kj;
      continue;
    }
    if (withBins) {
      let y = x;
      while (y !== 0) {
        const yb = 31 - Math.clz32(y);
        y ^= 1 << yb;
        const j = off + yb;
        carried[nRow + j] = Math.max(lbin[i * D + j], carried[cRow + j]);
      }
    }
    path[dim] = i;
    grow1(level + 1, x, b, word);
  }
  run[dim] += made;
  if (above !== 0) run[dim + 1] += above;
  if (aboveTwo !== 0) run[dim + 2] += aboveTwo;
  produced[0] += made + above + aboveTwo;
  if (produced[0] > checkpoint) passCheckpoint(level === 0);
}

/**
 * Renumbers the candidate set in stack[at..) (≤ 32 members, children of local vertex i) into one word:
 * packed rows, the bins of the edges among the members, and each member's carried bin at `level`.
 */
function packAnnotated(i: number, at: number, cRow: number, level: number, members: number): void {
  let q = 0;
  for (let k = 0; k < W; k++) {
    let y = stack[at + k];
    while (y !== 0) {
      const yb = 31 - Math.clz32(y);
      y ^= 1 << yb;
      const j = (k << 5) + yb;
      packedIndex[j] = q;
      packedLocal[q] = j;
      if (withBins) packedCarried[level * 32 + q] = Math.max(lbin[i * D + j], carried[cRow + j]);
      q++;
    }
  }
  for (let p = 0; p < members; p++) {
    const lp = packedLocal[p];
    let row = 0;
    for (let m = undirected ? lp >>> 5 : 0; m < W; m++) {
      let z = stack[at + m] & loc[lp * W + m];
      while (z !== 0) {
        const zb = 31 - Math.clz32(z);
        z ^= 1 << zb;
        const lj = (m << 5) + zb;
        const pj = packedIndex[lj];
        row |= 1 << pj;
        if (withBins) packedBin[(p << 5) + pj] = lbin[lp * D + lj];
      }
    }
    packedRows[p] = row;
  }
}

/** grow1() on the packed universe (no participation): rows, edge bins and carried bins of ≤ 32 members. */
function growPacked(level: number, cand: number, simplexBin: number): void {
  const dim = level + 1;
  const deeper = dim + 1 <= capDim;
  const cRow = level * 32;
  const nRow = cRow + 32;
  const histRow = dim * G;
  let made = 0;
  let above = 0;
  let aboveTwo = 0;
  let bits = cand;
  while (bits !== 0) {
    const i = 31 - Math.clz32(bits);
    bits ^= 1 << i;
    let b = simplexBin;
    if (withBins) {
      const ci = packedCarried[cRow + i];
      if (ci > b) b = ci;
    }
    hist[histRow + b]++;
    made++;
    const x = cand & packedRows[i];
    if (x === 0) continue;
    if (!deeper) {
      truncated = true;
      continue;
    }
    const j = 31 - Math.clz32(x);
    const rest = x ^ (1 << j);
    if (rest === 0 || (rest & (rest - 1)) === 0) {
      const up = histRow + G;
      const bj = withBins ? Math.max(b, packedBin[(i << 5) + j], packedCarried[cRow + j]) : 0;
      hist[up + bj]++;
      if (rest === 0) {
        above++;
        continue;
      }
      const k = 31 - Math.clz32(rest);
      const bk = withBins ? Math.max(b, packedBin[(i << 5) + k], packedCarried[cRow + k]) : 0;
      hist[up + bk]++;
      above += 2;
      const jk = (packedRows[j] >>> k) & 1;
      const kj = (packedRows[k] >>> j) & 1;
      if (jk + kj === 0) continue;
      if (dim + 2 > capDim) {
        truncated = true;
        continue;
      }
      const both = Math.max(bj, bk);
      if (jk !== 0) hist[up + G + (withBins ? Math.max(both, packedBin[(j << 5) + k]) : 0)]++;
      if (kj !== 0) hist[up + G + (withBins ? Math.max(both, packedBin[(k << 5) + j]) : 0)]++;
      aboveTwo += jk + kj;
      continue;
    }
    if (withBins) {
      let y = x;
      while (y !== 0) {
        const m = 31 - Math.clz32(y);
        y ^= 1 << m;
        packedCarried[nRow + m] = Math.max(packedBin[(i << 5) + m], packedCarried[cRow + m]);
      }
    }
    growPacked(level + 1, x, b);
  }
  run[dim] += made;
  if (above !== 0) run[dim + 1] += above;
  if (aboveTwo !== 0) run[dim + 2] += aboveTwo;
  produced[0] += made + above + aboveTwo;
  if (produced[0] > checkpoint) passCheckpoint(false);
}

/** Saves run[lo..hi] on the snapshot stack; returns where it starts. */
function push(lo: number, hi: number): number {
  const base = sp;
  const need = base + hi - lo + 1;
  if (need > snaps.length) {
    const bigger = new Float64Array(Math.max(need, 2 * snaps.length));
    bigger.set(snaps.subarray(0, base));
    snaps = bigger;
  }
  for (let k = lo; k <= hi; k++) snaps[sp++] = run[k];
  return base;
}

function creditLeaf(dim: number, i: number): void {
  if (creditNodes) member[dim][vertexOf[gTargets[listBase + i]]]++;
  if (creditEdges) {
    const row = edges[dim];
    for (let a = 0; a < dim; a++) {
      const s = a === 0 ? rootSlot[i] : lslot[path[a] * D + i];
      row[s]++;
      if (reverse !== null) row[reverse[s]]++;
    }
  }
}

/** Credits the simplices of the subtree of node (dim, i): 1 at dim, run[k] − snapshot above. */
function creditSubtree(dim: number, i: number, hi: number, base: number): void {
  if (creditNodes) {
    const v = vertexOf[gTargets[listBase + i]];
    member[dim][v]++;
    for (let k = dim + 1; k <= hi; k++) member[k][v] += run[k] - snaps[base + k - dim - 1];
  }
  if (creditEdges) {
    for (let a = 0; a < dim; a++) {
      const s = a === 0 ? rootSlot[i] : lslot[path[a] * D + i];
      const t = reverse === null ? -1 : reverse[s];
      edges[dim][s]++;
      if (t >= 0) edges[dim][t]++;
      for (let k = dim + 1; k <= hi; k++) {
        const diff = run[k] - snaps[base + k - dim - 1];
        edges[k][s] += diff;
        if (t >= 0) edges[k][t] += diff;
      }
    }
  }
}

function ensureRows(k: number): void {
  if (creditNodes) {
    while (member.length <= k) {
      member.push(new Float64Array(nVertices));
      if (directedRoles) {
        source.push(new Float64Array(nVertices));
        sink.push(new Float64Array(nVertices));
      }
    }
  }
  if (creditEdges) while (edges.length <= k) edges.push(new Float64Array(slotCount));
}

function topDim(): number {
  let top = run.length - 1;
  while (top > 0 && run[top] === 0) top--;
  return nVertices === 0 ? -1 : top;
}

function finish(): AnnotatedResult {
  const top = topDim();
  const rows: Float64Array[] = [];
  for (let k = 0; k <= top; k++) rows.push(hist.slice(k * G, (k + 1) * G));
  const result: AnnotatedResult = { hist: rows, truncated };
  const cut = (a: Float64Array[], size: number) => {
    const out = a.slice(0, top + 1);
    while (out.length < top + 1) out.push(new Float64Array(size));
    return out;
  };
  if (creditNodes) {
    result.member = cut(member, nVertices);
    if (directedRoles) {
      result.source = cut(source, nVertices);
      result.sink = cut(sink, nVertices);
    }
  }
  if (creditEdges) result.edges = cut(edges, slotCount);
  return result;
}

/** Past a checkpoint: stop on the budget or the clock, else set the next checkpoint. */
function passCheckpoint(rootDone: boolean): void {
  if (produced[0] > budget) fail(rootDone);
  monitor?.check(rootIndex + 1);
  checkpoint = Math.min(budget, produced[0] + CHECK_EVERY);
}

/** `rootDone`: the check after a root's top-level expansion, so that root is finished. */
function fail(rootDone: boolean): never {
  const top = Math.max(topDim(), 0);
  // vertices were counted up front; every root with a neighbour adds its edges and more
  throw new SimplexBudgetError(
    budget,
    run.slice(0, top + 1),
    rootProgress(rootOffsets, nVertices, rootIndex, rootDone, 1),
    run[0],
  );
}
