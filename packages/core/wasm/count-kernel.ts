// The plain simplex counter in WebAssembly (AssemblyScript): the same algorithm as
// packages/core/src/count/bitset-counter.ts, with 64-bit words and the i64.popcnt instruction. JavaScript
// has 32-bit bitwise operators only, so there a set of 33–64 members takes two words and a one-word
// universe holds 32 members; here one word holds 64.
//
// The caller (src/count/wasm/wasm-counter.ts) lays out the memory, writes the enumeration graph into it,
// calls setup() once and countRoots() for runs of roots. Counts, the running simplex total and the next
// checkpoint live in memory the caller reads too; past a checkpoint the kernel calls the imported
// `passCheckpoint`, which may throw (budget or time limit) and so unwind the whole count.

// imported as "count-kernel" "passCheckpoint"
declare function passCheckpoint(depth: i32): void;

// Layout table the caller (countWithWasm) writes at address 0: 13 addresses, capDim, undirected,
// truncated, then the four-member table's address (i32 each).
let offsetsPtr: usize = 0; // i32 × (n + 1): list start of each root
let targetsPtr: usize = 0; // i32: list entries
let markPtr: usize = 0; // i32 × n, all −1 between roots: local index of a vertex in the current list
let locPtr: usize = 0; // u64 × dmax × W: local adjacency of the root universe
let stackPtr: usize = 0; // u64 × levels × W: candidate sets per depth
let repackedPtr: usize = 0; // u64 × dmax × W: the universe of one large renumbered set
let packedIndexPtr: usize = 0; // i32 × 64W: local index → position in a renumbered set
let packedPtr: usize = 0; // u64 × 64: rows of one packed universe of ≤ 64 members
let memberPtr: usize = 0; // i32 × 64: local indices of the members being packed
let kidsPtr: usize = 0; // 64 × (set u64, size u64) per depth: children with ≥ 2 members
let cntPtr: usize = 0; // f64 × (capDim + 2): simplices per dimension
let statePtr: usize = 0; // f64 × 3: simplices so far, next checkpoint, root being counted
let binomPtr: usize = 0; // f64 × 65 × 65: C(c, t) at c * 65 + t
let fourPtr: usize = 0; // u32 × 4096: simplices inside a set of four members, by its 12 arc bits
let capDim: i32 = 0; // highest dimension counted
let undirected: bool = false;
let truncated: bool = false;
let W: i32 = 1; // words per row of the current root universe
let tablesAt: usize = 0; // where the binomial and four-member tables were filled (0: not yet)

export function setup(): void {
  offsetsPtr = load<u32>(0);
  targetsPtr = load<u32>(4);
  markPtr = load<u32>(8);
  locPtr = load<u32>(12);
  stackPtr = load<u32>(16);
  repackedPtr = load<u32>(20);
  packedIndexPtr = load<u32>(24);
  packedPtr = load<u32>(28);
  memberPtr = load<u32>(32);
  kidsPtr = load<u32>(36);
  cntPtr = load<u32>(40);
  statePtr = load<u32>(44);
  binomPtr = load<u32>(48);
  capDim = load<i32>(52);
  undirected = load<i32>(56) !== 0;
  truncated = load<i32>(60) !== 0;
  fourPtr = load<u32>(64);
  if (tablesAt === binomPtr + fourPtr) return; // this instance filled them at the same place before
  tablesAt = binomPtr + fourPtr;
  fillFourTable();
  // Pascal's rule in doubles (exact up to C(56, 28); larger values exceed any budget anyway)
  for (let c = 0; c <= 64; c++) {
    store<f64>(binomPtr + ((<usize>c * 65) << 3), 1);
    for (let t = 1; t <= c; t++) {
      const left = load<f64>(binomPtr + ((<usize>(c - 1) * 65 + t - 1) << 3));
      const right = t < c ? load<f64>(binomPtr + ((<usize>(c - 1) * 65 + t) << 3)) : 0;
      store<f64>(binomPtr + ((<usize>c * 65 + t) << 3), left + right);
    }
  }
}

/**
 * For each of the 2^12 arc patterns among four members (bit 3i + j' for the arc from member i to its j'-th
 * other member, in ascending order), the simplices they span beyond the members themselves: arcs (bits
 * 0–7), ordered triples with all three arcs forward (bits 8–15) and ordered quadruples (bits 16–23).
 */
function fillFourTable(): void {
  for (let mask = 0; mask < 4096; mask++) {
    let arcs = 0;
    let triples = 0;
    let quads = 0;
    for (let i = 0; i < 4; i++)
      for (let j = 0; j < 4; j++) {
        if (!arcIn(mask, i, j)) continue;
        arcs++;
        for (let k = 0; k < 4; k++) {
          if (!arcIn(mask, i, k) || !arcIn(mask, j, k)) continue;
          triples++;
          for (let l = 0; l < 4; l++)
            if (arcIn(mask, i, l) && arcIn(mask, j, l) && arcIn(mask, k, l)) quads++;
        }
      }
    store<u32>(fourPtr + ((<usize>mask) << 2), arcs | (triples << 8) | (quads << 16));
  }
}

function arcIn(mask: i32, i: i32, j: i32): bool {
  if (i === j) return false;
  return ((mask >> (i * 3 + (j < i ? j : j - 1))) & 1) !== 0;
}

export function isTruncated(): i32 {
  return truncated ? 1 : 0;
}

function addCount(dim: i32, v: f64): void {
  const p = cntPtr + ((<usize>dim) << 3);
  store<f64>(p, load<f64>(p) + v);
}

function addProduced(v: f64): void {
  store<f64>(statePtr, load<f64>(statePtr) + v);
}

function checkpointAfter(depth: i32): void {
  if (load<f64>(statePtr) > load<f64>(statePtr, 8)) passCheckpoint(depth);
}

function bit(x: u64, b: i32): u64 {
  return (x >> <u64>b) & 1;
}

/** Counts the subtrees of roots from ≤ v < to (their vertices and edges were counted up front). */
export function countRoots(from: i32, to: i32): void {
  if (capDim < 1 || (capDim < 2 && truncated)) return;
  for (let v = from; v < to; v++) {
    const a = load<i32>(offsetsPtr + ((<usize>v) << 2));
    const d = load<i32>(offsetsPtr + ((<usize>(v + 1)) << 2)) - a;
    if (d < 2) continue;
    W = (d + 63) >> 6;
    const list = targetsPtr + ((<usize>a) << 2);
    for (let i = 0; i < d; i++) store<i32>(markPtr + ((<usize>load<i32>(list + ((<usize>i) << 2))) << 2), i);
    memory.fill(locPtr, 0, <usize>d * W * 8);
    for (let i = 0; i < d; i++) {
      const u = load<i32>(list + ((<usize>i) << 2));
      const row = locPtr + ((<usize>i * W) << 3);
      const end = targetsPtr + ((<usize>load<i32>(offsetsPtr + ((<usize>(u + 1)) << 2))) << 2);
      let s = targetsPtr + ((<usize>load<i32>(offsetsPtr + ((<usize>u) << 2))) << 2);
      // unrolled by four: this scan is most of the time on sparse graphs
      for (; s + 12 < end; s += 16) {
        const j0 = load<i32>(markPtr + ((<usize>load<i32>(s)) << 2));
        const j1 = load<i32>(markPtr + ((<usize>load<i32>(s, 4)) << 2));
        const j2 = load<i32>(markPtr + ((<usize>load<i32>(s, 8)) << 2));
        const j3 = load<i32>(markPtr + ((<usize>load<i32>(s, 12)) << 2));
        if ((j0 & j1 & j2 & j3) < 0) continue; // all four outside the universe: the common case
        if (j0 >= 0) setBit(row, j0);
        if (j1 >= 0) setBit(row, j1);
        if (j2 >= 0) setBit(row, j2);
        if (j3 >= 0) setBit(row, j3);
      }
      for (; s < end; s += 4) {
        const j = load<i32>(markPtr + ((<usize>load<i32>(s)) << 2));
        if (j >= 0) setBit(row, j);
      }
    }
    for (let i = 0; i < d; i++) store<i32>(markPtr + ((<usize>load<i32>(list + ((<usize>i) << 2))) << 2), -1);
    store<f64>(statePtr, <f64>v, 16);
    runLocal(d);
  }
}

function setBit(row: usize, j: i32): void {
  const p = row + ((<usize>(j >> 6)) << 3);
  store<u64>(p, load<u64>(p) | ((<u64>1) << (<u64>(j & 63))));
}

function runLocal(d: i32): void {
  const at = stackPtr;
  for (let k = 0; k < W; k++) {
    const left = d - (k << 6);
    store<u64>(at + ((<usize>k) << 3), left >= 64 ? ~(<u64>0) : ((<u64>1) << (<u64>left)) - 1);
  }
  if (capDim < 2) {
    if (!truncated) truncated = anyEdgeInside(locPtr, W, at);
    return;
  }
  if (W === 1) expandWord(locPtr, 8, load<u64>(at), 1);
  else expandWide(locPtr, W, at, 1);
}

/**
 * Extends by every member of a one-word candidate set (simplices of dimension depth+1 and up). Row of
 * member b at rows + b * stride, so a set lying in one word of a wider universe runs here in place.
 * First pass: every member's child set and its size, with no branch on the size; children with ≥ 2
 * members are kept per depth and settled in a second pass.
 */
function expandWord(rows: usize, stride: usize, cand: u64, depth: i32): void {
  const at = kidsPtr + ((<usize>depth) << 10);
  let n: usize = 0;
  let total: u64 = 0;
  let bits = cand;
  while (bits !== 0) {
    const b = <usize>ctz(bits);
    bits &= bits - 1;
    const x = cand & load<u64>(rows + b * stride);
    const c = popcnt(x);
    total += c;
    const e = at + (n << 4);
    store<u64>(e, x);
    store<u64>(e, c, 8);
    n += <usize>(c >= 2);
  }
  addCount(depth + 1, <f64>total);
  addProduced(<f64>total);
  const deeper = depth + 2 <= capDim;
  const three = depth + 3 <= capDim;
  const four = depth + 4 <= capDim;
  let pairs: u64 = 0;
  let triples: u64 = 0;
  let quads: u64 = 0;
  for (let i: usize = 0; i < n; i++) {
    const e = at + (i << 4);
    const x = load<u64>(e);
    const c = load<u64>(e, 8);
    if (!deeper) {
      if (!truncated) truncated = anyEdgeInWord(rows, stride, x);
      continue;
    }
    if (c === 2) {
      // two candidates j, k: the next simplex exists once per arc between them
      const j = <i32>ctz(x);
      const k = <i32>ctz(x & (x - 1));
      pairs += bit(load<u64>(rows + <usize>j * stride), k) + bit(load<u64>(rows + <usize>k * stride), j);
      continue;
    }
    if (c === 3 && three) {
      // three candidates a, b, c: both remaining levels from the six arc bits, no branch
      const a = <i32>ctz(x);
      const r = x & (x - 1);
      const b = <i32>ctz(r);
      const cc = <i32>ctz(r & (r - 1));
      const ra = load<u64>(rows + <usize>a * stride);
      const rb = load<u64>(rows + <usize>b * stride);
      const rc = load<u64>(rows + <usize>cc * stride);
      const ab = bit(ra, b);
      const ac = bit(ra, cc);
      const ba = bit(rb, a);
      const bc = bit(rb, cc);
      const ca = bit(rc, a);
      const cb = bit(rc, b);
      pairs += ab + ac + ba + bc + ca + cb;
      triples += (ab & ac) * (bc + cb) + (ba & bc) * (ac + ca) + (ca & cb) * (ab + ba);
      continue;
    }
    if (c === 4 && four) {
      // four candidates: the three remaining levels from a table over their twelve arc bits
      const a = <i32>ctz(x);
      const r1 = x & (x - 1);
      const b = <i32>ctz(r1);
      const r2 = r1 & (r1 - 1);
      const cc = <i32>ctz(r2);
      const d = <i32>ctz(r2 & (r2 - 1));
      const ra = load<u64>(rows + <usize>a * stride);
      const rb = load<u64>(rows + <usize>b * stride);
      const rc = load<u64>(rows + <usize>cc * stride);
      const rd = load<u64>(rows + <usize>d * stride);
      const index =
        bit(ra, b) |
        (bit(ra, cc) << 1) |
        (bit(ra, d) << 2) |
        (bit(rb, a) << 3) |
        (bit(rb, cc) << 4) |
        (bit(rb, d) << 5) |
        (bit(rc, a) << 6) |
        (bit(rc, b) << 7) |
        (bit(rc, d) << 8) |
        (bit(rd, a) << 9) |
        (bit(rd, b) << 10) |
        (bit(rd, cc) << 11);
      const v = load<u32>(fourPtr + ((<usize>index) << 2));
      pairs += v & 255;
      triples += (v >> 8) & 255;
      quads += v >> 16;
      continue;
    }
    if (undirected && isClique(rows, stride, x)) countClique(<i32>c, depth + 1);
    else expandWord(rows, stride, x, depth + 1);
  }
  if (pairs !== 0) {
    addCount(depth + 2, <f64>pairs);
    addProduced(<f64>pairs);
    if (triples !== 0) {
      addCount(depth + 3, <f64>triples);
      addProduced(<f64>triples);
      if (quads !== 0) {
        addCount(depth + 4, <f64>quads);
        addProduced(<f64>quads);
      }
    }
  }
  checkpointAfter(depth);
}

/** Undirected only (rows hold later members): whether every member lists every member above it. */
function isClique(rows: usize, stride: usize, x: u64): bool {
  let bits = x;
  while (bits !== 0) {
    const b = <usize>ctz(bits);
    bits &= bits - 1;
    if ((load<u64>(rows + b * stride) & bits) !== bits) return false;
  }
  return true;
}

/** A candidate set that is a clique of c members (counted at `depth`): C(c, t) simplices per dimension. */
function countClique(c: i32, depth: i32): void {
  let made: f64 = 0;
  for (let t = 2; t <= c; t++) {
    const dim = depth + t - 1;
    if (dim > capDim) {
      truncated = true;
      break;
    }
    const ways = load<f64>(binomPtr + ((<usize>c * 65 + t) << 3));
    addCount(dim, ways);
    made += ways;
  }
  addProduced(made);
}

/** Multi-word version: candidate set at `at` (Wc words) over a universe with rows of Wc words. */
function expandWide(rows: usize, Wc: i32, at: usize, depth: i32): void {
  const next = at + ((<usize>Wc) << 3);
  const deeper = depth + 2 <= capDim;
  const rowBytes = (<usize>Wc) << 3;
  let total: u64 = 0;
  // A child of c members has about c * c / size members of its own: packing costs c * c bit tests, which
  // pays off only when the child's subtree goes a few levels deeper (sparse universes: it does not).
  let size: u64 = 0;
  for (let k = 0; k < Wc; k++) size += popcnt(load<u64>(at + ((<usize>k) << 3)));
  for (let w = 0; w < Wc; w++) {
    let bits = load<u64>(at + ((<usize>w) << 3));
    while (bits !== 0) {
      const lowBit = <i32>ctz(bits);
      bits &= bits - 1;
      const row = rows + <usize>((w << 6) + lowBit) * rowBytes;
      let c: u64 = 0;
      let words = 0;
      let only = 0;
      const k0 = undirected ? w : 0;
      for (let k = 0; k < k0; k++) store<u64>(next + ((<usize>k) << 3), 0);
      for (let k = k0; k < Wc; k++) {
        const x = load<u64>(at + ((<usize>k) << 3)) & load<u64>(row + ((<usize>k) << 3));
        store<u64>(next + ((<usize>k) << 3), x);
        if (x !== 0) {
          c += popcnt(x);
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
      addCount(depth + 1, <f64>total);
      addProduced(<f64>total);
      total = 0;
      if (words === 1) {
        const base = rows + <usize>(only << 6) * rowBytes + ((<usize>only) << 3);
        expandWord(base, rowBytes, load<u64>(next + ((<usize>only) << 3)), depth + 1);
      } else if (c === 2) settlePair(rows, Wc, next, depth);
      else if (c <= 64 && c * c >= 2 * size) expandPacked(rows, Wc, next, <i32>c, depth + 1);
      else if (c <= 64) expandWide(rows, Wc, next, depth + 1);
      else if (rows === locPtr && Wc > ((<i32>c + 63) >> 6) + 1) expandRepacked(next, <i32>c, depth + 1);
      else expandWide(rows, Wc, next, depth + 1);
    }
  }
  addCount(depth + 1, <f64>total);
  addProduced(<f64>total);
  checkpointAfter(depth);
}

/** Exactly two candidates j, k in a multi-word set: the (depth+2)-simplex exists once per arc. */
function settlePair(rows: usize, Wc: i32, at: usize, depth: i32): void {
  let j = -1;
  let k = -1;
  for (let q = 0; q < Wc; q++) {
    let y = load<u64>(at + ((<usize>q) << 3));
    while (y !== 0) {
      const b = (q << 6) + <i32>ctz(y);
      y &= y - 1;
      if (j < 0) j = b;
      else k = b;
    }
  }
  const e =
    bit(load<u64>(rows + ((<usize>j * Wc + (k >> 6)) << 3)), k & 63) +
    bit(load<u64>(rows + ((<usize>k * Wc + (j >> 6)) << 3)), j & 63);
  addCount(depth + 2, <f64>e);
  addProduced(<f64>e);
}

/**
 * A large candidate set (> 64 members) of the root universe, renumbered in order into a universe of its
 * own with ceil(c/64)-word rows: its subtree then scans fewer words.
 */
function expandRepacked(at: usize, c: i32, depth: i32): void {
  const W2 = (c + 63) >> 6;
  let q = 0;
  for (let k = 0; k < W; k++) {
    let y = load<u64>(at + ((<usize>k) << 3));
    while (y !== 0) {
      const b = <i32>ctz(y);
      y &= y - 1;
      store<i32>(packedIndexPtr + ((<usize>((k << 6) + b)) << 2), q++);
    }
  }
  memory.fill(repackedPtr, 0, <usize>c * W2 * 8);
  q = 0;
  for (let k = 0; k < W; k++) {
    let y = load<u64>(at + ((<usize>k) << 3));
    while (y !== 0) {
      const b = <i32>ctz(y);
      y &= y - 1;
      const row = locPtr + ((<usize>((k << 6) + b) * W) << 3);
      const out = repackedPtr + ((<usize>q * W2) << 3);
      for (let m = undirected ? k : 0; m < W; m++) {
        let z = load<u64>(at + ((<usize>m) << 3)) & load<u64>(row + ((<usize>m) << 3));
        while (z !== 0) {
          const zb = <i32>ctz(z);
          z &= z - 1;
          setBit(out, load<i32>(packedIndexPtr + ((<usize>((m << 6) + zb)) << 2)));
        }
      }
      q++;
    }
  }
  for (let k = 0; k < W2; k++) {
    const left = c - (k << 6);
    store<u64>(at + ((<usize>k) << 3), left >= 64 ? ~(<u64>0) : ((<u64>1) << (<u64>left)) - 1);
  }
  expandWide(repackedPtr, W2, at, depth);
}

/** Renumbers a candidate set of c ≤ 64 members into a one-word universe and runs its subtree there. */
function expandPacked(rows: usize, Wc: i32, at: usize, c: i32, depth: i32): void {
  const indexOf = memberPtr; // local index of each member, ascending
  let q: usize = 0;
  for (let k = 0; k < Wc; k++) {
    let y = load<u64>(at + ((<usize>k) << 3));
    while (y !== 0) {
      store<i32>(indexOf + (q << 2), (k << 6) + <i32>ctz(y));
      y &= y - 1;
      q++;
    }
  }
  // Bit p of packed row r is bit (member p) of row (member r): one test per pair, no data-dependent branch
  // (a 64-bit shift by the member's local index uses its low six bits, its place in the word).
  for (let r = 0; r < c; r++) {
    const row = rows + ((<usize>load<i32>(indexOf + ((<usize>r) << 2)) * Wc) << 3);
    let out: u64 = 0;
    for (let p = undirected ? r + 1 : 0; p < c; p++) {
      const j = load<i32>(indexOf + ((<usize>p) << 2));
      out |= ((load<u64>(row + ((<usize>(j >> 6)) << 3)) >> <u64>j) & 1) << (<u64>p);
    }
    store<u64>(packedPtr + ((<usize>r) << 3), out);
  }
  expandWord(packedPtr, 8, c === 64 ? ~(<u64>0) : ((<u64>1) << (<u64>c)) - 1, depth);
}

function anyEdgeInWord(rows: usize, stride: usize, set: u64): bool {
  let bits = set;
  while (bits !== 0) {
    const b = <usize>ctz(bits);
    bits &= bits - 1;
    if ((set & load<u64>(rows + b * stride)) !== 0) return true;
  }
  return false;
}

function anyEdgeInside(rows: usize, Wc: i32, at: usize): bool {
  for (let w = 0; w < Wc; w++) {
    let bits = load<u64>(at + ((<usize>w) << 3));
    while (bits !== 0) {
      const b = <i32>ctz(bits);
      bits &= bits - 1;
      const row = rows + ((<usize>((w << 6) + b) * Wc) << 3);
      for (let k = 0; k < Wc; k++) {
        if ((load<u64>(at + ((<usize>k) << 3)) & load<u64>(row + ((<usize>k) << 3))) !== 0) return true;
      }
    }
  }
  return false;
}
