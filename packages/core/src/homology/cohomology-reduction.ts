import { countAtMost } from "../filtration/count-at-most.js";
import type { WorkMonitor } from "../work/work-monitor.js";
import { type BandSweep, type BandSweepPolicy, sweepBands } from "./band-sweep.js";
import { ChainBuilder } from "./chain-builder.js";
import type { CoboundaryModel } from "./coboundary-model.js";
import { ColumnStore } from "./column-store.js";
import { grownFloat, grownInt } from "./grown-array.js";
import type { ByteLedger } from "./homology-budget.js";
import { KeyMap } from "./key-map.js";
import { LazyColumn } from "./lazy-column.js";
import { modP, type PrimeField } from "./prime-field.js";
import { ReducedEntries } from "./reduced-entries.js";
import type { PairSink } from "./union-find-pairs.js";

/** Work counters of one dimension. */
export interface ReductionCounters {
  simplices: number;
  cleared: number;
  apparent: number;
  emergent: number;
  reduced: number;
  additions: number;
  stored: number;
  /** Columns that would have been reduced one by one, settled by the sweep over bands instead. */
  swept: number;
}

/**
 * Persistent cohomology of one dimension (V. de Silva, D. Morozov, M. Vejdemo-Johansson, "Dualities in
 * persistent (co)homology", Inverse Problems 27, 2011): the coboundary columns of the dim-simplices are
 * reduced from the last simplex of the filtration to the first, a column's pivot being its earliest
 * coface. The pairs are those of the persistent homology of the filtration (H. Edelsbrunner, D. Letscher,
 * A. Zomorodian, "Topological persistence and simplification", Discrete Comput. Geom. 28, 2002).
 *
 * Work is skipped three ways:
 * - clearing (C. Chen, M. Kerber, "Persistent homology computation with a twist", EuroCG 2011): a simplex
 *   that killed a class one dimension lower has a column that reduces to zero, so it is never built
 *   (`cleared` holds those from the previous reduction; apparent ones are recognised on the fly);
 * - apparent pairs of zero persistence: σ whose earliest coface τ enters at the same value and whose latest
 *   facet is σ is paired with τ without touching the matrix;
 * - emergent pairs: when the earliest coface of σ enters with σ and no earlier column claimed it, σ pairs
 *   with it at once and the rest of the coboundary is never produced.
 *
 * Finished columns whose chains are long also keep their reduced entries, sorted, up to a cover value;
 * adding one reads them through a cursor only as far as the pivot search goes. A cursor that runs out
 * reads on in the column's extension, computed from its chain once for the next band of values and kept;
 * without room for it, the chain is pushed past the cover one band of values at a time behind a marker
 * (see ReducedEntries, LazyColumn.addStored, LazyColumn.continueCursor and LazyColumn.pushMarker).
 *
 * Returns the pivots found (keys of dim+1 simplices that killed a class): the next dimension clears them.
 */
export function reduceDimension(
  model: CoboundaryModel,
  dim: number,
  cleared: KeyMap,
  field: PrimeField,
  ledger: ByteLedger,
  sink: PairSink,
  keepZeroLength: boolean,
  monitor: WorkMonitor,
  sweepPolicy: BandSweepPolicy | null = null,
): { pivots: KeyMap; counters: ReductionCounters } {
  const p = field.p;
  const inverse = field.inverse;
  const list = model.listSimplices(dim);
  const counters: ReductionCounters = {
    simplices: list.count,
    cleared: 0,
    apparent: 0,
    emergent: 0,
    reduced: 0,
    additions: 0,
    stored: 0,
    swept: 0,
  };

  // Which columns need work.
  ledger.reserve(list.count * 4, `choosing the ${dim}-simplex columns`);
  const todo = new Int32Array(list.count);
  let todoCount = 0;
  // The sweep over bands (Z/2 only) reduces every column not cleared, apparent ones included.
  const sweeping =
    sweepPolicy !== null && p === 2 && dim <= sweepPolicy.upToDim && list.count >= sweepPolicy.fromSimplices;
  if (sweeping) ledger.reserve(list.count * 5, `choosing the ${dim}-simplex columns to sweep`);
  const toSweep = sweeping ? new Int32Array(list.count) : null;
  const apparent = sweeping ? new Uint8Array(list.count) : null;
  let toSweepCount = 0;
  const sweepLater = (i: number, isApparent: boolean): void => {
    if (toSweep === null || apparent === null) return;
    toSweep[toSweepCount++] = i;
    if (isApparent) apparent[i] = 1;
  };
  monitor.begin("reducing columns", dim, list.count);
  for (let i = 0; i < list.count; i++) {
    if ((i & 4095) === 0) monitor.check(i - todoCount); // columns settled without work so far
    const key = list.key[i];
    const f = list.f[i];
    if (cleared.has(key)) {
      counters.cleared++;
      continue;
    }
    const settled = model.settleUpFront === undefined ? -1 : model.settleUpFront(dim, key, f);
    if (settled === 1) {
      counters.cleared++;
      continue;
    }
    if (settled === 2) {
      counters.apparent++;
      if (keepZeroLength) sink.pair(dim, key, f, model.apparentCoface as number, f);
      sweepLater(i, true);
      continue;
    }
    if (settled === 0) {
      sweepLater(i, false);
      todo[todoCount++] = i;
      continue;
    }
    if (dim >= 2) {
      const facet = model.zeroFacet(dim, key, f);
      if (facet >= 0 && model.zeroCoface(dim - 1, facet, f) === key) {
        counters.cleared++;
        continue;
      }
    }
    const coface = model.zeroCoface(dim, key, f);
    if (coface >= 0 && model.zeroFacet(dim + 1, coface, f) === key) {
      counters.apparent++;
      if (keepZeroLength) sink.pair(dim, key, f, coface, f);
      sweepLater(i, true);
      continue;
    }
    sweepLater(i, false);
    todo[todoCount++] = i;
  }
  // Columns entering up to the sweep's reach are settled by it; the loop below reduces the rest.
  let swept: BandSweep | null = null;
  if (toSweep !== null)
    swept = sweepBands(
      model,
      dim,
      list.key,
      list.f,
      toSweep.subarray(0, toSweepCount),
      ledger,
      monitor,
      sweepPolicy ?? undefined,
      { done: list.count - todoCount, counted: apparent as Uint8Array },
    );
  const reach = swept === null ? Number.NEGATIVE_INFINITY : swept.reach;
  // Latest simplex first: (f, key) descending.
  const columns = todo.subarray(0, todoCount);
  const lf = list.f;
  const lk = list.key;
  columns.sort((a, b) => (lf[a] !== lf[b] ? (lf[a] > lf[b] ? -1 : 1) : lk[b] - lk[a]));

  const pivots = new KeyMap(ledger, `recording the pivots of dimension ${dim}`, Math.max(16, todoCount));
  // Implicit reduction: a finished column keeps only its chain (the simplices whose coboundaries sum to
  // it); its entries are regenerated from the chain whenever it is added.
  const store = new ColumnStore(ledger);
  const work = new LazyColumn(ledger);
  const chain = new ChainBuilder(ledger);
  // Columns with long chains also keep their sorted reduced entries (up to a cover value): adding one
  // then reads entries only as far as the pivot search goes, instead of regenerating the coboundary of
  // every chain simplex. The stored columns added to the working column are listed apart from its chain.
  const entries = new ReducedEntries(ledger);
  let storedAdded: Int32Array = new Int32Array(64);
  let storedFactor: Int32Array = new Int32Array(64);
  let storedDone: Int32Array = new Int32Array(64);
  // How far (in value) the chain of a stored column whose cursor ran out has been pushed, and how many
  // column values its next band spans (doubling from band to band).
  let storedPushedTo: Float64Array = new Float64Array(64);
  let storedStep: Int32Array = new Int32Array(64);
  let storedCount = 0;
  // Pushes the next band of stored column a's chain: past its cover the chain is pushed band by band, a
  // marker after each band, because the pivot search usually stops long before the horizon (most of what
  // a push up to the horizon produced was never popped).
  const pushNextBand = (a: number): void => {
    const horizon = work.horizon;
    const from = storedPushedTo[a];
    const to = valueAfter(sortedF, from, storedStep[a], horizon);
    storedStep[a] *= 2;
    const bandLow = work.bandLow;
    work.bandLow = from;
    work.horizon = to;
    pushChain(model, dim, store, storedAdded[a], storedFactor[a], p, work);
    work.horizon = horizon;
    work.bandLow = bandLow;
    storedPushedTo[a] = to;
    if (to < horizon) work.pushMarker(to, a);
  };
  // Stored columns are added to many working columns, and the pivot searches often run past their
  // cover: then the column's entries are computed once for the next band of values and stored after the
  // rest (so the cursor reads on), instead of each working column pushing the chain's coboundary again.
  const extender = new LazyColumn(ledger, 256);
  const extension = new ReducedEntries(ledger);
  const drained = new ReducedEntries(ledger);
  // Appends the owner's entries of the next bands (passing over empty ones) as a segment and returns it,
  // or -1 when the column has no more entries or there is no room for them.
  const extendStored = (owner: number): number => {
    let cover = entries.cover[owner];
    extension.used = 0;
    while (cover !== Number.POSITIVE_INFINITY && extension.used === 0) {
      extender.reset(p);
      extender.bandLow = cover;
      extender.horizon = valueAfter(sortedF, cover, EXTENSION_BAND, Number.POSITIVE_INFINITY);
      pushChain(model, dim, store, owner, 1, p, extender);
      const reached = extender.drainInto(extension, Number.POSITIVE_INFINITY, cover);
      if (reached <= cover) break;
      cover = reached;
    }
    if (extension.used === 0) return -1;
    return entries.extend(owner, extension, cover);
  };
  // The segment each stored column's cursor reads (-1: the column's first entries).
  let storedSegment: Int32Array = new Int32Array(64);
  // A stored column whose cursor ran out reads on in its extended entries; when there is no room for them,
  // its entries past the cover go to the heap, band by band.
  work.attach(
    entries,
    (a) => {
      const owner = storedAdded[a];
      const read = storedSegment[a];
      let next = read < 0 ? entries.firstSegment[owner] : entries.segmentNext[read];
      if (next < 0) next = extendStored(owner);
      if (next >= 0) {
        storedSegment[a] = next;
        const start = entries.segmentStart[next];
        work.continueCursor(a, start, start + entries.segmentLength[next]);
        return;
      }
      storedDone[a] = 1;
      const cover = entries.cover[owner];
      storedPushedTo[a] = cover;
      storedStep[a] = FIRST_BAND;
      if (cover < work.horizon) pushNextBand(a);
    },
    pushNextBand,
  );
  let compactAt = 1024;
  ledger.reserve(todoCount * 8, `sorting the ${dim}-simplex values`);
  const sortedCount = todoCount;
  const sortedF = new Float64Array(sortedCount);
  for (let c = 0; c < todoCount; c++) sortedF[c] = lf[columns[c]];
  sortedF.sort();
  const firstWindow = 64;
  let window = firstWindow;
  let horizonRank = 0;
  // The heap ran dry below the horizon: double the window and push every source again for the new band.
  const raiseHorizon = (): void => {
    window *= 2;
    horizonRank += window;
    const oldHorizon = work.horizon;
    work.bandLow = oldHorizon;
    work.horizon = horizonRank < sortedCount ? sortedF[horizonRank] : Number.POSITIVE_INFINITY;
    if (chain.size > compactAt) {
      chain.compact(p);
      compactAt = Math.max(1024, chain.size * 2);
    }
    for (let e = 0; e < chain.size; e++)
      model.pushCoboundary(dim, chain.key[e], chain.f[e], chain.coef[e], p, work);
    // Stored columns read their entries up to their cover; past it (once read), their chains are pushed
    // band by band, from the old horizon: each has pushed up to it (or its cover lies past it), for no
    // marker is left when the heap runs dry.
    for (let a = 0; a < storedCount; a++) {
      if (storedDone[a] === 0 || storedPushedTo[a] >= work.horizon) continue;
      pushNextBand(a);
    }
    work.bandLow = Number.NEGATIVE_INFINITY;
  };

  // The loop reduces the columns entering after the sweep's reach (latest first), then those it handed back.
  let lazyCount = todoCount;
  while (lazyCount > 0 && lf[columns[lazyCount - 1]] <= reach) lazyCount--;
  const handedOff = swept === null ? 0 : swept.handedOff;
  const handedColumn = swept === null ? null : swept.handedOffColumn;
  const handedChains = swept === null ? null : swept.handedOffChains;
  // Progress counts every column: those settled while choosing or by the sweep, then the ones reduced here.
  const settledUpFront = list.count - lazyCount - handedOff;
  for (let c = 0; c < lazyCount + handedOff; c++) {
    if ((c & 63) === 0) monitor.check(settledUpFront + c);
    const handed = c - lazyCount; // ≥ 0 for a handed-back column
    const i = handed < 0 || handedColumn === null ? columns[c] : handedColumn[handed];
    const key = lk[i];
    const f = lf[i];
    chain.clear();
    if (handed < 0 || handedChains === null) chain.push(key, f, 1);
    else {
      const from = handedChains.start[handed];
      const pool = handedChains.pool;
      for (let e = from; e < from + handedChains.length[handed]; e++) chain.push(lk[pool[e]], lf[pool[e]], 1);
    }
    compactAt = 1024;
    storedCount = 0;

    // Emergent pair: the earliest coface enters with σ and nobody has claimed it.
    const first = handed < 0 ? model.zeroCoface(dim, key, f) : -1;
    if (first >= 0) {
      const firstCoef = modP(model.sign, p);
      if (pivots.get(first) < 0 && !claimedByApparentPair(model, dim, first, f, key)) {
        const id = store.open(firstCoef);
        store.setChain(id, chain.key, chain.f, chain.coef, 1);
        pivots.set(first, id);
        counters.emergent++;
        if (keepZeroLength) sink.pair(dim, key, f, first, f);
        continue;
      }
    }

    counters.reduced++;
    work.reset(p);
    // Cofaces are heaped only up to a horizon `window` values past σ's (in the sorted values of the
    // dim-simplices); when the heap runs dry before a pivot shows up, the window doubles and the
    // chain is pushed again for the new band.
    window = firstWindow;
    horizonRank = countAtMost(sortedF, handed < 0 ? f : reach) + window;
    work.horizon = horizonRank < sortedCount ? sortedF[horizonRank] : Number.POSITIVE_INFINITY;
    if (handed < 0) model.pushCoboundary(dim, key, f, 1, p, work);
    else {
      work.bandLow = reach;
      for (let e = 0; e < chain.size; e++) model.pushCoboundary(dim, chain.key[e], chain.f[e], 1, p, work);
      work.bandLow = Number.NEGATIVE_INFINITY;
    }
    for (;;) {
      if (!work.settle()) {
        if (work.deferred) {
          raiseHorizon();
          continue;
        }
        sink.essential(dim, key, f);
        break;
      }
      const pivotKey = work.pivotKey;
      const pivotF = work.pivotF;
      const pivotCoef = work.pivotCoef;
      const owner = pivots.get(pivotKey);
      if (owner >= 0) {
        // Cancel the pivot with the column that owns it: add -(c / c_owner) times that column, regenerated
        // from its chain.
        const factor = ((p - pivotCoef) * inverse[store.pivotCoef[owner]]) % p;
        if (entries.has(owner)) {
          if (storedCount === storedAdded.length) {
            storedAdded = grownInt(storedAdded, storedCount * 2);
            storedFactor = grownInt(storedFactor, storedCount * 2);
            storedStep = grownInt(storedStep, storedCount * 2);
            storedPushedTo = grownFloat(storedPushedTo, storedCount * 2);
            storedSegment = grownInt(storedSegment, storedCount * 2);
            storedDone = grownInt(storedDone, storedCount * 2);
          }
          storedAdded[storedCount] = owner;
          storedFactor[storedCount] = factor;
          storedSegment[storedCount] = -1;
          storedDone[storedCount++] = 0;
          const from = entries.start[owner];
          work.addStored(from, from + entries.length[owner], factor);
          if ((counters.additions & 63) === 0) monitor.check(settledUpFront + c);
          counters.additions++;
          continue;
        }
        const chainFrom = store.chainStart[owner];
        const chainTo = chainFrom + store.chainLength[owner];
        const ck = store.chainKey;
        const cf = store.chainF;
        const cc = store.chainCoef;
        for (let e = chainFrom; e < chainTo; e++) {
          const g = (factor * cc[e]) % p;
          model.pushCoboundary(dim, ck[e], cf[e], g, p, work);
          chain.push(ck[e], cf[e], g);
        }
        if ((counters.additions & 63) === 0) monitor.check(settledUpFront + c);
        if (chain.size > compactAt) {
          chain.compact(p);
          compactAt = Math.max(1024, chain.size * 2);
        }
        counters.additions++;
        continue;
      }
      const facet = model.zeroFacet(dim + 1, pivotKey, pivotF);
      if (facet >= 0) {
        const facetSign = model.sign;
        if (model.zeroCoface(dim, facet, pivotF) === pivotKey) {
          // The pivot belongs to an apparent pair (facet, pivot) whose column is just δ(facet).
          const factor = ((p - pivotCoef) * inverse[modP(facetSign, p)]) % p;
          model.pushCoboundary(dim, facet, pivotF, factor, p, work);
          chain.push(facet, pivotF, factor);
          counters.additions++;
          continue;
        }
      }
      // A new pivot: keep the chain (with the chains of the stored columns added), and the reduced
      // entries up to the horizon when the chain is long.
      let incoming = 0;
      for (let a = 0; a < storedCount; a++) incoming += store.chainLength[storedAdded[a]];
      chain.openTally(incoming);
      for (let a = 0; a < storedCount; a++) {
        const owner = storedAdded[a];
        const from = store.chainStart[owner];
        const to = from + store.chainLength[owner];
        chain.addScaled(store.chainKey, store.chainF, store.chainCoef, from, to, storedFactor[a], p);
      }
      const id = store.open(pivotCoef);
      chain.compact(p);
      store.setChain(id, chain.key, chain.f, chain.coef, chain.size);
      if (chain.size >= STORE_ENTRIES_FROM_CHAIN) {
        // Drained apart first: cursors running out during the drain append their extensions to the store.
        drained.used = 0;
        const cover = work.drainInto(drained, STORED_ENTRIES_PER_COLUMN, Number.NEGATIVE_INFINITY);
        if (cover !== Number.NEGATIVE_INFINITY && entries.appendAll(drained)) {
          entries.close(id, entries.used - drained.used, cover);
          counters.stored++;
        }
      }
      pivots.set(pivotKey, id);
      if (pivotF > f || keepZeroLength) sink.pair(dim, key, f, pivotKey, pivotF);
      break;
    }
  }
  if (swept !== null && apparent !== null) {
    // The swept pairs, after the loop so that its columns never see them (their pivots lie above the reach).
    for (let q = 0; q < swept.pairs; q++) {
      const i = swept.column[q];
      if (apparent[i] === 1) continue; // paired and counted while choosing
      counters.swept++;
      pivots.set(swept.pivotKey[q], 0); // only whether it is a pivot is read (the next dimension's clearing)
      if (swept.pivotF[q] > lf[i] || keepZeroLength)
        sink.pair(dim, lk[i], lf[i], swept.pivotKey[q], swept.pivotF[q]);
    }
    for (let q = 0; q < swept.essential; q++) {
      const i = swept.essentialColumn[q];
      counters.swept++;
      sink.essential(dim, lk[i], lf[i]);
    }
    counters.additions += swept.additions;
    swept.handedOffChains.dispose();
  }
  if (sweeping) ledger.release(list.count * 5);
  work.dispose();
  extender.dispose();
  extension.dispose();
  drained.dispose();
  chain.dispose();
  entries.dispose();
  ledger.release(sortedCount * 8);
  store.dispose();
  ledger.release(list.count * 4);
  return { pivots, counters };
}

/**
 * Chains at least this long keep their reduced entries. Even a short chain's coboundary is swept anew
 * whenever it is added (uniform weights, n = 160: 16 → 4 took 12 % of the CPU time, 8 nothing).
 */
const STORE_ENTRIES_FROM_CHAIN = 4;
/**
 * Reduced entries a new column keeps at first (more when entries tie at the last value); later ones are
 * added by extensions when a column that adds it reads that far. Draining 2,048 at each new pivot computed
 * entries nobody read, and ran out the cursors of the columns added, extending those too (uniform weights,
 * n = 200: 2,048 → 16 took the CPU time from 50 to 27 s and the peak memory from 1.3 to 0.5 GiB).
 */
const STORED_ENTRIES_PER_COLUMN = 16;

/** Column values spanned by the first band of a stored column's chain pushed past its cover. */
const FIRST_BAND = 256;
/**
 * Column values spanned by each extension of a stored column's entries (uniform weights, n = 200, with 16
 * entries kept at first: 256 → 24.5, 25.1 CPU s; 1,024 → 22.1, 23.9, 23.1; 2,048 → 24.7).
 */
const EXTENSION_BAND = 1024;

/**
 * The end of a band that starts at `from` and spans `step` of the sorted column values past it, at most
 * `horizon`.
 */
function valueAfter(sorted: Float64Array, from: number, step: number, horizon: number): number {
  const at = countAtMost(sorted, from) + step - 1;
  return at < sorted.length && sorted[at] < horizon ? sorted[at] : horizon;
}

/** Pushes factor × the coboundary of a finished column, regenerated from its chain. */
function pushChain(
  model: CoboundaryModel,
  dim: number,
  store: ColumnStore,
  owner: number,
  factor: number,
  p: number,
  work: LazyColumn,
): void {
  const chainTo = store.chainStart[owner] + store.chainLength[owner];
  const ck = store.chainKey;
  const cf = store.chainF;
  const cc = store.chainCoef;
  for (let e = store.chainStart[owner]; e < chainTo; e++)
    model.pushCoboundary(dim, ck[e], cf[e], (factor * cc[e]) % p, p, work);
}

/** Whether `coface` is the partner of an apparent pair with a facet other than `self`. */
function claimedByApparentPair(
  model: CoboundaryModel,
  dim: number,
  coface: number,
  f: number,
  self: number,
): boolean {
  const facet = model.zeroFacet(dim + 1, coface, f);
  return facet >= 0 && facet !== self && model.zeroCoface(dim, facet, f) === coface;
}
