import { countAtMost } from "../filtration/count-at-most.js";
import { countBelow } from "../filtration/count-below.js";
import type { WorkMonitor } from "../work/work-monitor.js";
import type { CoboundaryModel } from "./coboundary-model.js";
import type { CofaceSink } from "./coface-sink.js";
import { grownFloat, grownInt } from "./grown-array.js";
import type { ByteLedger } from "./homology-budget.js";
import { ChainSum, IndexChains } from "./index-chains.js";
import { KeyMap } from "./key-map.js";

/** Pairs and essential columns found by sweepBands, and the reach below which they are complete. */
export interface BandSweep {
  /** Every column with f ≤ reach is settled here; the columns above it are left to the caller. */
  reach: number;
  pairs: number;
  /** Column (an index into the caller's keys and fs) and its pivot (key, f), per pair. */
  column: Int32Array;
  pivotKey: Float64Array;
  pivotF: Float64Array;
  /** Columns that reduced to zero over the whole filtration (only when reach is +∞). */
  essential: number;
  essentialColumn: Int32Array;
  /**
   * Columns whose entries up to the reach sum to zero, left for the caller to reduce past it (after every
   * column entering above the reach, latest first as listed), each with its chain.
   */
  handedOff: number;
  handedOffColumn: Int32Array;
  handedOffChains: IndexChains;
  bands: number;
  additions: number;
}

/** When the sweep stops; the defaults suit dense graphs, tests force other values. */
export interface BandSweepPolicy {
  /** Sweep a dimension only when it has at least this many simplices (below, the implicit reduction is quick), */
  fromSimplices: number;
  /**
   * and only up to this dimension: above, a column has many cofaces in its band and most columns are
   * settled as apparent pairs without any (40-node graphs to H4: sweeping H3 and H4 took 0.28 → 0.42 s and
   * 0.38 → 0.58 s).
   */
  upToDim: number;
  /** Columns per band at first; the count adapts so that bands hold about `rowsPerBand` cofaces. */
  firstBandColumns: number;
  rowsPerBand: number;
  /**
   * Stop once at most this many columns are carried over (they go to the caller), if more were carried
   * before (the long-lived classes have died) or the band had at least `stopRows` cofaces;
   */
  handOffAt: number;
  stopRows: number;
  /** and in any case once the bands' cofaces add up to more than this, */
  maxRows: number;
  /**
   * or before a band whose columns would push more coface entries than this (or than a share of the
   * budget's room allows): the columns entering from that band on are left to the caller.
   */
  maxBandEntries: number;
}

export const DEFAULT_BAND_SWEEP: BandSweepPolicy = {
  fromSimplices: 1 << 13,
  upToDim: 2,
  firstBandColumns: 4096,
  rowsPerBand: 1 << 15,
  handOffAt: 32,
  stopRows: 1 << 16,
  maxRows: 1 << 24,
  maxBandEntries: 1 << 23,
};

/**
 * Reduces the coboundary columns of the dim-simplices over Z/2 explicitly, from the first value of the
 * filtration upwards in bands of values, for as long as the columns there are few but costly to reduce
 * implicitly (long-lived classes born early in a dense filtration).
 *
 * Why bands give the pairs of the whole reduction: a column's entries are cofaces entering no earlier than
 * its simplex, and the standard reduction only adds to a column columns of later simplices whose pivot is
 * its current pivot. So while a column's pivot stays at most v, everything it meets lies in the prefix of
 * values ≤ v, and columns of simplices entering after v never touch it. Band (lo, hi] reduces its own new
 * columns (latest first) and then the columns carried over from earlier bands, each restricted to the
 * band's cofaces; a column whose band part reduces to zero is carried to the next band with its chain, from
 * which its entries there are computed. Columns left after the sweep all enter after its reach, and with
 * nothing carried over they do not depend on the swept ones (their pivots lie above the reach, the swept
 * pivots at or below it). Columns still carried when the sweep stops are handed back with their chains:
 * reduced after all of those, from their entries past the reach, they continue as the whole reduction would.
 *
 * `columnsToReduce` lists the columns to reduce (indices into keys/fs: the simplices not cleared), in any
 * order.
 */
export function sweepBands(
  model: CoboundaryModel,
  dim: number,
  keys: Float64Array,
  fs: Float64Array,
  columnsToReduce: Int32Array,
  ledger: ByteLedger,
  monitor: WorkMonitor,
  policy: BandSweepPolicy = DEFAULT_BAND_SWEEP,
  progress: { readonly done: number; readonly counted: Uint8Array } | null = null,
): BandSweep {
  const total = columnsToReduce.length;
  ledger.reserve(total * 16, "sweeping bands of columns");
  const sortedF = new Float64Array(total);
  for (let i = 0; i < total; i++) sortedF[i] = fs[columnsToReduce[i]];
  sortedF.sort();
  // The columns ascending by f (ties in any order; each band sorts its own by (f, key)), placed for a
  // prefix of the values only, extended as the bands need it: the sweep usually stops early.
  const ascending = new Int32Array(total);
  const placed = new Int32Array(total);
  let placedUpTo = 0;
  const placeUpTo = (count: number): void => {
    const from = placedUpTo === 0 ? Number.NEGATIVE_INFINITY : sortedF[placedUpTo - 1];
    const to = sortedF[count - 1];
    for (let i = 0; i < total; i++) {
      const g = fs[columnsToReduce[i]];
      if (g <= from || g > to) continue;
      const at = countBelow(sortedF, g);
      ascending[at + placed[at]++] = columnsToReduce[i];
    }
    placedUpTo = countAtMost(sortedF, to);
  };
  const out: BandSweep = {
    reach: Number.NEGATIVE_INFINITY,
    pairs: 0,
    column: new Int32Array(256),
    pivotKey: new Float64Array(256),
    pivotF: new Float64Array(256),
    essential: 0,
    essentialColumn: new Int32Array(16),
    handedOff: 0,
    handedOffColumn: new Int32Array(0),
    handedOffChains: new IndexChains(ledger),
    bands: 0,
    additions: 0,
  };
  const entries = new EntryCollector(ledger);
  const chain = new ChainSum(keys.length, ledger);
  // Columns carried into the current band: simplex and chain.
  let carried = new IndexChains(ledger);
  let carriedColumn: Int32Array = new Int32Array(64);
  let everCarried = false;
  let bandColumns = policy.firstBandColumns;
  let rowsSoFar = 0;
  let next = 0;
  let lo = Number.NEGATIVE_INFINITY;
  let reported = 0;
  let done = progress === null ? 0 : progress.done;
  try {
    for (;;) {
      // Progress: the caller's count, plus the columns swept that it had not counted (less the carried ones).
      reported = Math.max(reported, done - carried.count);
      monitor.check(reported);
      const hi = sortedF[Math.min(next + bandColumns, total) - 1];
      const end = countAtMost(sortedF, hi);
      const fresh = end - next;
      // The band's own columns, latest first.
      if (end > placedUpTo) placeUpTo(Math.min(total, Math.max(end, 4 * placedUpTo)));
      const band = ascending.subarray(next, end);
      for (let b = 0; b < band.length; b++) if (progress === null || progress.counted[band[b]] === 0) done++;
      band.sort((a, b) => (fs[a] !== fs[b] ? (fs[a] > fs[b] ? -1 : 1) : keys[b] - keys[a]));
      const columns = fresh + carried.count;
      // The band's columns in reduction order: its own, latest first, then the carried ones (kept latest first).
      ledger.reserve(columns * 12, "sweeping bands of columns"); // these two and carryChains' chain ids
      const colIndex = new Int32Array(columns);
      const entryStart = new Int32Array(columns + 1);
      // Bytes per entry pushed, the band's tables included (rank's map, the rows, the reduced entries).
      const room = (ledger.maxBytes - ledger.held) / 128;
      entries.open(lo, hi, Math.min(policy.maxBandEntries, room));
      for (let c = 0; c < columns && !entries.overflow; c++) {
        if (c < fresh) {
          const i = band[c];
          colIndex[c] = i;
          model.pushCoboundary(dim, keys[i], fs[i], 1, 2, entries);
        } else {
          const a = c - fresh;
          colIndex[c] = carriedColumn[a];
          const from = carried.start[a];
          const to = from + carried.length[a];
          for (let e = from; e < to; e++) {
            const j = carried.pool[e];
            model.pushCoboundary(dim, keys[j], fs[j], 1, 2, entries);
          }
        }
        entryStart[c + 1] = entries.used;
      }
      if (entries.overflow) {
        // Too many entries for one band: stop before it (its columns go to the caller, with those carried).
        ledger.release(columns * 12);
        handOff(out, carried, carriedColumn, lo);
        return out;
      }
      // Rows: the band's distinct cofaces in filtration order (f, key).
      const rows = entries.rank(ledger);
      rowsSoFar += rows;
      const additions = reduceBand(
        entries,
        rows,
        entryStart,
        columns,
        ledger,
        monitor,
        reported,
        (c, pivot) => pushPair(out, colIndex[c], entries.rowKey[pivot], entries.rowF[pivot]),
      );
      out.additions += additions.count;
      const onward = carryChains(additions, colIndex, fresh, carried, chain, ledger);
      additions.release();
      ledger.release(columns * 12);
      carried.dispose();
      carried = onward.chains;
      carriedColumn = onward.column;
      out.bands++;
      next = end;
      lo = hi;
      if (carried.count > policy.handOffAt) everCarried = true;
      if (next === total) {
        // The whole filtration is swept: what is still carried never dies.
        for (let a = 0; a < carried.count; a++) pushEssential(out, carriedColumn[a]);
        out.reach = Number.POSITIVE_INFINITY;
        return out;
      }
      if (
        (carried.count <= policy.handOffAt && (everCarried || rows >= policy.stopRows)) ||
        rowsSoFar > policy.maxRows
      ) {
        handOff(out, carried, carriedColumn, hi);
        return out;
      }
      if (rows > 2 * policy.rowsPerBand && bandColumns > 1) bandColumns >>= 1;
      else if (rows < policy.rowsPerBand / 2) bandColumns *= 2;
    }
  } finally {
    if (carried !== out.handedOffChains) carried.dispose(); // handed-off chains are the caller's to dispose
    chain.dispose();
    entries.dispose();
    ledger.release(total * 16);
  }
}

/**
 * Reduces a band's columns (latest first) as bitsets of its rows: each column's entries toggled in, then,
 * while its lowest set row is some earlier column's pivot, that column's reduced entries toggled in too.
 * Calls `paired` with each column that keeps a pivot; returns which columns reduced to zero and which
 * columns each one added (release() gives their bytes back).
 */
function reduceBand(
  entries: EntryCollector,
  rows: number,
  entryStart: Int32Array,
  columns: number,
  ledger: ByteLedger,
  monitor: WorkMonitor,
  reported: number,
  paired: (column: number, pivotRow: number) => void,
): { count: number; zero: Uint8Array; addedStart: Int32Array; addedPool: Int32Array; release(): void } {
  const owner = new Int32Array(rows).fill(-1);
  const words = (rows + 31) >>> 5;
  const bits = new Int32Array(words);
  const fixedBytes = rows * 4 + words * 4 + columns * 13;
  ledger.reserve(fixedBytes, "sweeping bands of columns");
  let reduced: Int32Array = new Int32Array(Math.max(1024, entries.used));
  let reducedUsed = 0;
  const reducedStart = new Int32Array(columns);
  const reducedLength = new Int32Array(columns);
  // The columns each column added (its chain is formed later, only if a carried column needs it).
  let addedPool: Int32Array = new Int32Array(Math.max(1024, columns));
  let addedUsed = 0;
  const addedStart = new Int32Array(columns + 1);
  const zero = new Uint8Array(columns);
  let count = 0;
  // The reduced entries and the columns added grow with the additions: charged as they grow.
  let grownBytes = 4 * (reduced.length + addedPool.length);
  ledger.reserve(grownBytes, "sweeping bands of columns");
  const grow = (a: Int32Array, size: number): Int32Array => {
    ledger.reserve(4 * (size - a.length), "sweeping bands of columns");
    grownBytes += 4 * (size - a.length);
    return grownInt(a, size);
  };
  for (let c = 0; c < columns; c++) {
    if ((c & 63) === 0) monitor.check(reported); // the clock, within a band too
    // Set bits lie in words low … high.
    let low = words;
    let high = -1;
    for (let e = entryStart[c]; e < entryStart[c + 1]; e++) {
      const r = entries.row[e];
      bits[r >>> 5] ^= 1 << (r & 31);
      if (r >>> 5 < low) low = r >>> 5;
      if (r >>> 5 > high) high = r >>> 5;
    }
    let pivot = -1;
    for (;;) {
      while (low <= high && bits[low] === 0) low++;
      if (low > high) break;
      const word = bits[low];
      const row = (low << 5) + (31 - Math.clz32(word & -word));
      const o = owner[row];
      if (o < 0) {
        pivot = row;
        break;
      }
      if (addedUsed === addedPool.length) addedPool = grow(addedPool, addedUsed * 2);
      addedPool[addedUsed++] = o;
      if ((++count & 63) === 0) monitor.check(reported);
      const from = reducedStart[o];
      const to = from + reducedLength[o];
      toggleRows(bits, reduced, from, to);
      // A reduced column's entries are ascending: its last is its highest.
      if (reduced[to - 1] >>> 5 > high) high = reduced[to - 1] >>> 5;
    }
    addedStart[c + 1] = addedUsed;
    if (pivot < 0) {
      zero[c] = 1;
      continue;
    }
    owner[pivot] = c;
    // Its reduced entries, for the columns of this band that will add it: read off the rows toggled when
    // they are fewer than the words spanned (then sorted), else off the words.
    reducedStart[c] = reducedUsed;
    let toggled = entryStart[c + 1] - entryStart[c];
    for (let e = addedStart[c]; e < addedStart[c + 1]; e++) toggled += reducedLength[addedPool[e]];
    if (reducedUsed + toggled > reduced.length)
      reduced = grow(reduced, Math.max(2 * reduced.length, reducedUsed + toggled));
    if (toggled < high - low) {
      reducedUsed = takeRows(bits, entries.row, entryStart[c], entryStart[c + 1], reduced, reducedUsed);
      for (let e = addedStart[c]; e < addedStart[c + 1]; e++) {
        const o = addedPool[e];
        const from = reducedStart[o];
        reducedUsed = takeRows(bits, reduced, from, from + reducedLength[o], reduced, reducedUsed);
      }
      reduced.subarray(reducedStart[c], reducedUsed).sort();
    } else reducedUsed = takeWords(bits, low, high, reduced, reducedUsed);
    reducedLength[c] = reducedUsed - reducedStart[c];
    paired(c, pivot);
  }
  return {
    count,
    zero,
    addedStart,
    addedPool,
    release: () => ledger.release(fixedBytes + grownBytes),
  };
}

/**
 * The chains of a band's zero columns, carried to the next band: each column's simplex (or the chain it was
 * carried in with) plus the chains of the columns it added, formed only for the zero columns and the
 * columns they added (and so on). Added columns come earlier in the band, so one pass in order suffices.
 */
function carryChains(
  band: { zero: Uint8Array; addedStart: Int32Array; addedPool: Int32Array },
  colIndex: Int32Array,
  fresh: number,
  carried: IndexChains,
  chain: ChainSum,
  ledger: ByteLedger,
): { chains: IndexChains; column: Int32Array } {
  const { zero, addedStart, addedPool } = band;
  const columns = zero.length;
  const needed = zero.slice();
  for (let c = columns - 1; c >= 0; c--) {
    if (needed[c] === 0) continue;
    for (let e = addedStart[c]; e < addedStart[c + 1]; e++) needed[addedPool[e]] = 1;
  }
  const bandChains = new IndexChains(ledger);
  const chains = new IndexChains(ledger);
  let column: Int32Array = new Int32Array(64);
  const chainOf = new Int32Array(columns); // the chain id of a needed column that owns a pivot
  for (let c = 0; c < columns; c++) {
    if (needed[c] === 0) continue;
    if (c < fresh) chain.toggle(colIndex[c]);
    else chain.add(carried, c - fresh);
    for (let e = addedStart[c]; e < addedStart[c + 1]; e++) chain.add(bandChains, chainOf[addedPool[e]]);
    if (zero[c] === 0) {
      chainOf[c] = chain.takeInto(bandChains);
      continue;
    }
    const id = chain.takeInto(chains);
    if (id === column.length) column = grownInt(column, id * 2);
    column[id] = colIndex[c];
  }
  bandChains.dispose();
  return { chains, column };
}

/** Ends the sweep at `reach`, the columns still carried going to the caller. */
function handOff(out: BandSweep, carried: IndexChains, carriedColumn: Int32Array, reach: number): void {
  out.reach = reach;
  out.handedOff = carried.count;
  out.handedOffColumn = carriedColumn;
  out.handedOffChains.dispose();
  out.handedOffChains = carried;
}

function pushPair(out: BandSweep, column: number, pivotKey: number, pivotF: number): void {
  if (out.pairs === out.column.length) {
    const size = out.pairs * 2;
    out.column = grownInt(out.column, size);
    out.pivotKey = grownFloat(out.pivotKey, size);
    out.pivotF = grownFloat(out.pivotF, size);
  }
  out.column[out.pairs] = column;
  out.pivotKey[out.pairs] = pivotKey;
  out.pivotF[out.pairs++] = pivotF;
}

function pushEssential(out: BandSweep, column: number): void {
  if (out.essential === out.essentialColumn.length)
    out.essentialColumn = grownInt(out.essentialColumn, out.essential * 2);
  out.essentialColumn[out.essential++] = column;
}

/** Bytes per entry of EntryCollector: f, key and row. */
const ENTRY_BYTES = 20;

/**
 * The cofaces of a band's columns as pushed (duplicates included), then numbered by their rank among the
 * band's distinct cofaces in filtration order; each column's entries become row numbers, and entries met
 * an even number of times within a column cancel when their bits are toggled.
 */
class EntryCollector implements CofaceSink {
  bandLow = Number.NEGATIVE_INFINITY;
  horizon = Number.POSITIVE_INFINITY;
  f: Float64Array = new Float64Array(1024);
  key: Float64Array = new Float64Array(1024);
  row: Int32Array = new Int32Array(1024);
  used = 0;
  /** Set when a push found `limit` entries already: the band is given up. */
  overflow = false;
  rowF = new Float64Array(0);
  rowKey = new Float64Array(0);
  private limit = Number.POSITIVE_INFINITY;
  private rowBytes = 0;
  private readonly ledger: ByteLedger;

  constructor(ledger: ByteLedger) {
    this.ledger = ledger;
    ledger.reserve(1024 * ENTRY_BYTES, "sweeping bands of columns");
  }

  open(lo: number, hi: number, limit: number): void {
    this.bandLow = lo;
    this.horizon = hi;
    this.used = 0;
    this.limit = limit;
    this.overflow = false;
  }

  push(f: number, key: number, _coef: number): void {
    if (f > this.horizon || f <= this.bandLow) return;
    if (this.used >= this.limit) {
      this.overflow = true;
      return;
    }
    if (this.used === this.f.length) {
      this.ledger.reserve(this.used * ENTRY_BYTES, "sweeping bands of columns");
      this.f = grownFloat(this.f, this.used * 2);
      this.key = grownFloat(this.key, this.used * 2);
      this.row = grownInt(this.row, this.used * 2);
    }
    this.f[this.used] = f;
    this.key[this.used++] = key;
  }

  dispose(): void {
    this.ledger.release(this.f.length * ENTRY_BYTES + this.rowBytes);
  }

  /** Numbers the distinct cofaces by (f, key) and fills `row`; returns how many there are. */
  rank(ledger: ByteLedger): number {
    const used = this.used;
    const ids = new KeyMap(ledger, "sweeping bands of columns", Math.max(16, used));
    let distinct = 0;
    ledger.reserve(used * 4, "sweeping bands of columns");
    const firstAt = new Int32Array(used);
    for (let e = 0; e < used; e++) {
      let id = ids.get(this.key[e]);
      if (id < 0) {
        id = distinct++;
        ids.set(this.key[e], id);
        firstAt[id] = e;
      }
      this.row[e] = id;
    }
    ids.dispose();
    // The rows' values and keys are kept for the band; the rest is given back below.
    ledger.release(this.rowBytes);
    this.rowBytes = 16 * distinct;
    ledger.reserve(this.rowBytes + 8 * distinct, "sweeping bands of columns");
    const byOrder = new Int32Array(distinct);
    for (let i = 0; i < distinct; i++) byOrder[i] = i;
    const f = this.f;
    const key = this.key;
    byOrder.sort((a, b) => {
      const fa = f[firstAt[a]];
      const fb = f[firstAt[b]];
      return fa !== fb ? (fa < fb ? -1 : 1) : key[firstAt[a]] - key[firstAt[b]];
    });
    const rankOf = new Int32Array(distinct);
    this.rowF = new Float64Array(distinct);
    this.rowKey = new Float64Array(distinct);
    for (let r = 0; r < distinct; r++) {
      rankOf[byOrder[r]] = r;
      this.rowF[r] = f[firstAt[byOrder[r]]];
      this.rowKey[r] = key[firstAt[byOrder[r]]];
    }
    for (let e = 0; e < used; e++) this.row[e] = rankOf[this.row[e]];
    ledger.release(used * 4 + 8 * distinct);
    return distinct;
  }
}

function toggleRows(bits: Int32Array, rows: Int32Array, from: number, to: number): void {
  for (let e = from; e < to; e++) {
    const r = rows[e];
    bits[r >>> 5] ^= 1 << (r & 31);
  }
}

/** Appends the set bits of words low … high to out as row numbers (clearing them); returns the new end. */
function takeWords(bits: Int32Array, low: number, high: number, out: Int32Array, used: number): number {
  for (let w = low; w <= high; w++) {
    let word = bits[w];
    if (word === 0) continue;
    bits[w] = 0;
    while (word !== 0) {
      const bit = word & -word;
      word ^= bit;
      out[used++] = (w << 5) + (31 - Math.clz32(bit));
    }
  }
  return used;
}

/** Appends the rows of list[from, to) whose bits are set to out (clearing them) and returns the new end. */
function takeRows(
  bits: Int32Array,
  list: Int32Array,
  from: number,
  to: number,
  out: Int32Array,
  used: number,
): number {
  for (let e = from; e < to; e++) {
    const r = list[e];
    const bit = 1 << (r & 31);
    if ((bits[r >>> 5] & bit) === 0) continue;
    bits[r >>> 5] ^= bit;
    out[used++] = r;
  }
  return used;
}
