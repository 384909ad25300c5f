import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { WorkMonitor } from "../work/work-monitor.js";
import { type BinomialTable, binomialTable, decodeSimplex } from "./binomial-table.js";
import type { CoboundaryModel, SimplexList } from "./coboundary-model.js";
import type { CofaceSink } from "./coface-sink.js";
import type { ByteLedger } from "./homology-budget.js";
import { SimplexListBuilder } from "./simplex-list-builder.js";
import type { SimplexQuota } from "./simplex-quota.js";
import { ThresholdBits } from "./threshold-bits.js";
import { VertexMemo } from "./vertex-memo.js";

/** How edge values are looked up: an n×n matrix (fast for dense graphs) or the sparse rows. */
export type CliqueLayout = "dense" | "sparse";

/**
 * Implicit coboundaries of the clique complex of an undirected graph. A simplex is its ascending vertex
 * set, keyed by the combinatorial number system, so nothing but the simplices of the column dimension is
 * ever stored. The cofaces of σ are σ ∪ {v} for common neighbours v; their keys grow with v, so walking v
 * upwards lists cofaces in key order, which is what makes the zero-coface search stop early.
 */
export class CliqueCoboundaries implements CoboundaryModel {
  readonly vertexCount: number;
  sign = 1;
  apparentCoface = -1;
  private readonly n: number;
  private readonly binom: BinomialTable;
  private readonly row: number;
  private readonly dense: Float64Array | null;
  private readonly rowOrder: Int32Array | null;
  private readonly rowSorted: Float64Array | null;
  private readonly offsets: Int32Array;
  private readonly targets: Int32Array;
  private readonly edgeF: Float64Array;
  private readonly lists: (SimplexListBuilder | null)[] = [];
  private readonly ledger: ByteLedger;
  private readonly monitor: WorkMonitor;
  private readonly quota: SimplexQuota;
  private readonly s: Int32Array;
  private readonly low: Float64Array;
  private readonly high: Float64Array;
  private readonly ptr: Int32Array;
  private readonly pairF: Float64Array;
  private readonly rows: Int32Array;
  private readonly bandEnd: Int32Array;

  /** `edgeF` is the filtration value per CSR slot; `maxVertices` the largest simplex (maxDim + 2). */
  constructor(
    graph: WeightedGraph,
    edgeF: Float64Array,
    maxVertices: number,
    layout: CliqueLayout,
    ledger: ByteLedger,
    monitor: WorkMonitor,
    quota: SimplexQuota,
  ) {
    const n = graph.n;
    this.n = n;
    this.vertexCount = n;
    this.binom = binomialTable(n, maxVertices);
    this.row = n + 1;
    this.offsets = graph.offsets;
    this.targets = graph.targets;
    this.edgeF = edgeF;
    this.ledger = ledger;
    this.monitor = monitor;
    this.quota = quota;
    quota.charge(0, n, 1, "vertices");
    if (layout === "dense") {
      ledger.reserve(n * n * 8, "building the dense edge-value matrix");
      const m = new Float64Array(n * n).fill(Infinity);
      for (let u = 0; u < n; u++) {
        for (let slot = graph.offsets[u]; slot < graph.offsets[u + 1]; slot++)
          m[u * n + graph.targets[slot]] = edgeF[slot];
      }
      this.dense = m;
      // Each row's vertices sorted by edge value: the cofaces of σ below a horizon are among the
      // neighbours of any one vertex of σ below it.
      ledger.reserve(n * n * 12, "sorting the dense edge-value rows");
      const order = new Int32Array(n * n);
      const sorted = new Float64Array(n * n);
      const used = new Int32Array(n);
      for (let u = 0; u < n; u++) {
        // The typed array's own sort gives the values; each vertex then takes the next free rank of its
        // value (vertices in ascending order, so equal values keep ascending vertices). A comparator sort
        // of the vertices took a tenth of the batch job's CPU on 100-node graphs.
        const base = u * n;
        const row = sorted.subarray(base, base + n);
        row.set(m.subarray(base, base + n));
        row.sort();
        used.fill(0);
        for (let v = 0; v < n; v++) {
          const x = m[base + v];
          let lo = 0;
          let hi = n;
          while (lo < hi) {
            const mid = (lo + hi) >>> 1;
            if (row[mid] < x) lo = mid + 1;
            else hi = mid;
          }
          order[base + lo + used[lo]++] = v;
        }
      }
      this.rowOrder = order;
      this.rowSorted = sorted;
      this.runs = new VertexMemo(n);
      this.prefixes = new VertexMemo(n);
      this.thresholdBits = new ThresholdBits(n, order, sorted, ledger);
    } else {
      this.dense = null;
      this.rowOrder = null;
      this.rowSorted = null;
      this.runs = new VertexMemo(0);
      this.prefixes = this.runs;
    }
    this.s = new Int32Array(maxVertices + 1);
    this.low = new Float64Array(maxVertices + 2);
    this.high = new Float64Array(maxVertices + 2);
    this.ptr = new Int32Array(maxVertices + 1);
    this.rows = new Int32Array(maxVertices + 1);
    this.bandEnd = new Int32Array(maxVertices + 1);
    this.pairF = new Float64Array((maxVertices + 1) * (maxVertices + 1));
  }

  /** Filtration value of edge {u, v}, Infinity when absent. */
  edgeValue(u: number, v: number): number {
    if (this.dense !== null) return this.dense[u * this.n + v];
    let lo = this.offsets[u];
    let hi = this.offsets[u + 1] - 1;
    const t = this.targets;
    while (lo <= hi) {
      const mid = (lo + hi) >>> 1;
      const x = t[mid];
      if (x === v) return this.edgeF[mid];
      if (x < v) lo = mid + 1;
      else hi = mid - 1;
    }
    return Infinity;
  }

  listSimplices(dim: number): SimplexList {
    const cached = this.lists[dim];
    if (cached) return cached;
    const out = new SimplexListBuilder(this.ledger, `listing the ${dim}-simplices`);
    if (dim === 1) {
      for (let u = 0; u < this.n; u++) {
        for (let slot = this.offsets[u]; slot < this.offsets[u + 1]; slot++) {
          const v = this.targets[slot];
          if (v > u) out.push(this.edgeF[slot], this.binom.values[2 * this.row + v] + u);
        }
      }
      this.quota.charge(1, out.count, 1, "edges");
    } else {
      const below = this.listSimplices(dim - 1);
      this.monitor.begin("listing simplices", dim, below.count);
      const unit = `${dim - 1}-simplices`;
      for (let i = 0; i < below.count; i++) {
        if ((i & 4095) === 0) {
          this.monitor.check(i);
          this.quota.charge(dim, out.count, i / below.count, unit);
        }
        this.extendUpwards(dim - 1, below.key[i], below.f[i], out);
      }
      this.quota.charge(dim, out.count, 1, unit);
    }
    this.lists[dim] = out;
    return out;
  }

  cofaceEstimate(dim: number): number {
    if (this.dense !== null) return Math.max(1, this.n - dim - 1);
    return Math.max(1, this.targets.length / Math.max(1, this.n));
  }

  releaseSimplices(dim: number): void {
    const list = this.lists[dim];
    if (list) list.release();
    this.lists[dim] = null;
  }

  vertices(dim: number, key: number, out: Int32Array): void {
    decodeSimplex(this.binom, key, dim + 1, out);
  }

  /** Every coface σ ∪ {v} with v above the top vertex of σ: each (dim+1)-simplex arises exactly once. */
  private extendUpwards(dim: number, key: number, f: number, out: SimplexListBuilder): void {
    const count = dim + 1;
    const s = this.s;
    decodeSimplex(this.binom, key, count, s);
    const top = s[count - 1];
    const weight = (this.binom.values as Float64Array).subarray((count + 1) * this.row);
    if (this.dense !== null) {
      const m = this.dense;
      const n = this.n;
      for (let v = top + 1; v < n; v++) {
        let fv = f;
        const base = v * n;
        for (let i = 0; i < count; i++) {
          const x = m[base + s[i]];
          if (x > fv) fv = x;
        }
        if (fv !== Infinity) out.push(fv, key + weight[v]);
      }
      return;
    }
    this.startIntersection(count);
    for (;;) {
      const v = this.nextCommonNeighbour(count, top + 1);
      if (v < 0) break;
      out.push(this.lastCofaceF(count, f), key + weight[v]);
    }
  }

  pushCoboundary(dim: number, key: number, f: number, factor: number, p: number, sink: CofaceSink): void {
    const count = dim + 1;
    this.prepareCofaceKeys(key, count);
    const s = this.s;
    const low = this.low;
    const high = this.high;
    const negative = p - factor;
    const values = this.binom.values;
    const row = this.row;
    if (this.dense !== null) {
      // The matrix is symmetric: read the rows of σ's vertices, so v sweeps contiguous memory.
      const m = this.dense;
      const n = this.n;
      let j = 0;
      const horizon = sink.horizon ?? Number.POSITIVE_INFINITY;
      const bandLow = sink.bandLow ?? Number.NEGATIVE_INFINITY;
      const floor = sink.floor ?? Number.NEGATIVE_INFINITY;
      if (count === 3 && horizon !== Number.POSITIVE_INFINITY) {
        this.pushTriangleBits(f, factor, negative, bandLow, horizon, sink);
        return;
      }
      // Three sweeps find the same cofaces; the one with the fewest candidates is taken. Below a finite
      // horizon only the neighbours v of σ's vertex with the fewest edges ≤ horizon can give cofaces ≤
      // horizon (the prefix); a band above σ's value can also be swept run by run (pushBand); else every v.
      const prefixLength = horizon === Number.POSITIVE_INFINITY ? n : this.shortestPrefix(count, horizon);
      if (
        (floor > f || bandLow > f) &&
        this.pushBand(count, f, factor, negative, floor, bandLow, horizon, prefixLength, sink)
      )
        return;
      if (prefixLength < n) {
        const order = this.rowOrder as Int32Array;
        const start = s[this.prefixSlot] * n;
        const rows = this.rows;
        for (let i = 0; i < count; i++) rows[i] = s[i] * n;
        for (let r = 0; r < prefixLength; r++) {
          const v = order[start + r];
          let fv = f;
          for (let i = 0; i < count; i++) {
            const x = m[rows[i] + v];
            if (x > fv) fv = x;
          }
          if (fv > horizon || fv <= bandLow) continue;
          let jv = 0;
          while (jv < count && s[jv] < v) jv++;
          sink.push(fv, low[jv] + values[(jv + 1) * row + v] + high[jv], (jv & 1) === 0 ? factor : negative);
        }
        return;
      }
      if (count === 3) {
        const r0 = s[0] * n;
        const r1 = s[1] * n;
        const r2 = s[2] * n;
        for (let v = 0; v < n; v++) {
          if (j < 3 && v === s[j]) {
            j++;
            continue;
          }
          const fv = triangleCofaceValue(m, f, r0, r1, r2, v);
          if (fv === Infinity || fv > horizon || fv <= bandLow) continue;
          sink.push(fv, low[j] + values[(j + 1) * row + v] + high[j], (j & 1) === 0 ? factor : negative);
        }
        return;
      }
      const rows = this.rows;
      for (let i = 0; i < count; i++) rows[i] = s[i] * n;
      for (let v = 0; v < n; v++) {
        if (j < count && v === s[j]) {
          j++;
          continue;
        }
        let fv = f;
        for (let i = 0; i < count; i++) {
          const x = m[rows[i] + v];
          if (x > fv) fv = x;
        }
        if (fv === Infinity || fv > horizon || fv <= bandLow) continue;
        sink.push(fv, low[j] + values[(j + 1) * row + v] + high[j], (j & 1) === 0 ? factor : negative);
      }
      return;
    }
    this.startIntersection(count);
    for (;;) {
      const v = this.nextCommonNeighbour(count, 0);
      if (v < 0) break;
      let j = 0;
      while (j < count && s[j] < v) j++;
      sink.push(
        this.lastCofaceF(count, f),
        low[j] + values[(j + 1) * row + v] + high[j],
        (j & 1) === 0 ? factor : negative,
      );
    }
  }

  /**
   * The cofaces of a triangle σ = {s0, s1, s2} with a value ≤ horizon (finite) and > bandLow: σ ∪ {v} for
   * the v whose edges to all three vertices are ≤ horizon and not all ≤ bandLow, read off the three
   * vertices' threshold sets word by word (the H2 columns, where most of the time goes). Expects
   * prepareCofaceKeys to have run.
   */
  private pushTriangleBits(
    f: number,
    factor: number,
    negative: number,
    bandLow: number,
    horizon: number,
    sink: CofaceSink,
  ): void {
    const bits = this.thresholdBits as ThresholdBits;
    const data = bits.data;
    const words = bits.words;
    const s = this.s;
    const s0 = s[0];
    const s1 = s[1];
    const s2 = s[2];
    const high = bits.use(horizon);
    const a = bits.row(high, s0);
    const b = bits.row(high, s1);
    const c = bits.row(high, s2);
    // Below bandLow σ's own value: every coface lies above it.
    const band = bandLow > f;
    let la = a;
    let lb = b;
    let lc = c;
    if (band) {
      const below = bits.use(bandLow);
      la = bits.row(below, s0);
      lb = bits.row(below, s1);
      lc = bits.row(below, s2);
    }
    const m = this.dense as Float64Array;
    const n = this.n;
    const r0 = s0 * n;
    const r1 = s1 * n;
    const r2 = s2 * n;
    const low = this.low;
    const highKey = this.high;
    const values = this.binom.values;
    const row = this.row;
    for (let w = 0; w < words; w++) {
      let x = data[a + w] & data[b + w] & data[c + w];
      if (band) x &= ~(data[la + w] & data[lb + w] & data[lc + w]);
      while (x !== 0) {
        const lowest = x & -x;
        x ^= lowest;
        const v = (w << 5) | (31 - Math.clz32(lowest));
        const fv = triangleCofaceValue(m, f, r0, r1, r2, v);
        const j = (v > s0 ? 1 : 0) + (v > s1 ? 1 : 0) + (v > s2 ? 1 : 0);
        sink.push(fv, low[j] + values[(j + 1) * row + v] + highKey[j], (j & 1) === 0 ? factor : negative);
      }
    }
  }

  /** Where shortestPrefix found its row among σ's vertices. */
  private prefixSlot = 0;

  /**
   * The number of edges ≤ horizon in the sorted row of σ's vertex that has the fewest (every coface ≤
   * horizon is σ ∪ {v} for v among them); sets prefixSlot. Expects prepareCofaceKeys to have run.
   */
  private shortestPrefix(count: number, horizon: number): number {
    const n = this.n;
    const s = this.s;
    const sorted = this.rowSorted as Float64Array;
    const prefixes = this.prefixes;
    prefixes.use(horizon, 0, 0);
    let best = -1;
    let bestLength = n + 1;
    for (let i = 0; i < count; i++) {
      const u = s[i];
      let lo = prefixes.first[u];
      if (!prefixes.has(u)) {
        const base = u * n;
        lo = 0;
        let hi = n;
        while (lo < hi) {
          const mid = (lo + hi) >>> 1;
          if (sorted[base + mid] <= horizon) lo = mid + 1;
          else hi = mid;
        }
        prefixes.set(u, lo, 0);
      }
      if (lo < bestLength) {
        bestLength = lo;
        best = i;
      }
    }
    this.prefixSlot = best;
    return bestLength;
  }

  /**
   * Dense sweep of the cofaces with a value in the band [floor, horizon] (and > bandLow) when that band
   * starts above σ's value f: such a coface σ ∪ {v} has an edge {s_i, v} in the band, and the edges of
   * each row in the band are a contiguous run of its sorted order. v is emitted from the first row whose
   * edge reaches the band. False (nothing pushed) when the runs are too long to beat a full sweep.
   * Expects prepareCofaceKeys to have run.
   */
  private pushBand(
    count: number,
    f: number,
    factor: number,
    negative: number,
    floor: number,
    bandLow: number,
    horizon: number,
    prefixLength: number,
    sink: CofaceSink,
  ): boolean {
    const n = this.n;
    const m = this.dense as Float64Array;
    const sorted = this.rowSorted as Float64Array;
    const order = this.rowOrder as Int32Array;
    const s = this.s;
    const rows = this.rows;
    const ptr = this.ptr;
    const ends = this.bandEnd;
    let total = 0;
    const runs = this.runs;
    runs.use(floor, bandLow, horizon);
    for (let i = 0; i < count; i++) {
      const u = s[i];
      const base = u * n;
      rows[i] = base;
      if (runs.has(u)) {
        ptr[i] = runs.first[u];
        ends[i] = runs.second[u];
        total += ends[i] - ptr[i];
        continue;
      }
      // First rank with value ≥ floor and > bandLow.
      let lo = 0;
      let hi = n;
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        const x = sorted[base + mid];
        if (x < floor || x <= bandLow) lo = mid + 1;
        else hi = mid;
      }
      ptr[i] = lo;
      // First rank with value > horizon (or infinite: absent edge).
      hi = n;
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        const x = sorted[base + mid];
        if (x <= horizon && x !== Infinity) lo = mid + 1;
        else hi = mid;
      }
      ends[i] = lo;
      total += lo - ptr[i];
      runs.set(u, ptr[i], lo);
    }
    // Runs are read through the sorted order, the full sweep straight along the rows: against it the runs
    // must be shorter by half; against the prefix, which is read the same way, just shorter.
    if (total > (prefixLength < n ? prefixLength : n / 2)) return false;
    if (count === 3) {
      this.pushTriangleBand(floor, bandLow, horizon, factor, negative, sink);
      return true;
    }
    const low = this.low;
    const high = this.high;
    const values = this.binom.values;
    const row = this.row;
    for (let i = 0; i < count; i++) {
      const base = rows[i];
      for (let r = ptr[i]; r < ends[i]; r++) {
        const v = order[base + r];
        let fv = f;
        let earlier = false;
        for (let k = 0; k < count; k++) {
          const x = m[rows[k] + v];
          if (k < i && x >= floor && x > bandLow) {
            earlier = true;
            break;
          }
          if (x > fv) fv = x;
        }
        if (earlier || fv > horizon || fv === Infinity) continue;
        let jv = 0;
        while (jv < count && s[jv] < v) jv++;
        if (jv < count && s[jv] === v) continue;
        sink.push(fv, low[jv] + values[(jv + 1) * row + v] + high[jv], (jv & 1) === 0 ? factor : negative);
      }
    }
    return true;
  }

  /**
   * pushBand for a triangle σ = {s0, s1, s2}, the columns of H2 where most of the time goes. A run's own
   * edge value is read from the sorted row, and an earlier row's edge is tested first, so a coface found
   * from an earlier run costs one matrix read. No vertex of σ is in a run: σ's own edges are ≤ its value.
   */
  private pushTriangleBand(
    floor: number,
    bandLow: number,
    horizon: number,
    factor: number,
    negative: number,
    sink: CofaceSink,
  ): void {
    const m = this.dense as Float64Array;
    const sorted = this.rowSorted as Float64Array;
    const order = this.rowOrder as Int32Array;
    const s = this.s;
    const s0 = s[0];
    const s1 = s[1];
    const s2 = s[2];
    const r0 = this.rows[0];
    const r1 = this.rows[1];
    const r2 = this.rows[2];
    const ptr = this.ptr;
    const ends = this.bandEnd;
    const low = this.low;
    const high = this.high;
    const values = this.binom.values;
    const row = this.row;
    // An absent edge (Infinity) must fail the horizon test even when the horizon is +∞.
    const limit = Math.min(horizon, Number.MAX_VALUE);
    // An edge value x with x ≥ floor and x > bandLow is in the band or past it (the runs are empty unless
    // floor and bandLow lie below the horizon); any such value is above σ's own. In the second and third
    // runs an earlier row's edge there drops v: that coface came from an earlier run, or lies past the
    // horizon.
    for (let r = ptr[0]; r < ends[0]; r++) {
      const v = order[r0 + r];
      let fv = sorted[r0 + r];
      const x1 = m[r1 + v];
      if (x1 > limit) continue;
      const x2 = m[r2 + v];
      if (x2 > limit) continue;
      if (x1 > fv) fv = x1;
      if (x2 > fv) fv = x2;
      const j = (v > s0 ? 1 : 0) + (v > s1 ? 1 : 0) + (v > s2 ? 1 : 0);
      sink.push(fv, low[j] + values[(j + 1) * row + v] + high[j], (j & 1) === 0 ? factor : negative);
    }
    for (let r = ptr[1]; r < ends[1]; r++) {
      const v = order[r1 + r];
      const x0 = m[r0 + v];
      if (x0 >= floor && x0 > bandLow) continue;
      const x2 = m[r2 + v];
      if (x2 > limit) continue;
      let fv = sorted[r1 + r];
      if (x2 > fv) fv = x2;
      const j = (v > s0 ? 1 : 0) + (v > s1 ? 1 : 0) + (v > s2 ? 1 : 0);
      sink.push(fv, low[j] + values[(j + 1) * row + v] + high[j], (j & 1) === 0 ? factor : negative);
    }
    for (let r = ptr[2]; r < ends[2]; r++) {
      const v = order[r2 + r];
      const x0 = m[r0 + v];
      if (x0 >= floor && x0 > bandLow) continue;
      const x1 = m[r1 + v];
      if (x1 >= floor && x1 > bandLow) continue;
      const j = (v > s0 ? 1 : 0) + (v > s1 ? 1 : 0) + (v > s2 ? 1 : 0);
      sink.push(
        sorted[r2 + r],
        low[j] + values[(j + 1) * row + v] + high[j],
        (j & 1) === 0 ? factor : negative,
      );
    }
  }

  zeroCoface(dim: number, key: number, f: number): number {
    const count = dim + 1;
    this.prepareCofaceKeys(key, count);
    const s = this.s;
    if (this.dense !== null) {
      for (let i = 0; i < count; i++) this.rows[i] = s[i] * this.n;
      const v = this.earliestDenseCoface(count, f);
      return v < 0 ? -1 : this.cofaceKey(this.cofaceSlot, v);
    }
    this.startIntersection(count);
    for (;;) {
      const v = this.nextCommonNeighbour(count, 0);
      if (v < 0) return -1;
      if (this.lastCofaceF(count, f) === f) {
        let j = 0;
        while (j < count && s[j] < v) j++;
        return this.cofaceKey(j, v);
      }
    }
  }

  /**
   * pushBand's runs of each vertex for the band last asked (at correlation n = 300, 87 % of the runs were
   * found here instead of by two binary searches), and pushCoboundary's prefix of each vertex's row up to
   * the horizon last asked.
   */
  private readonly runs: VertexMemo;
  private readonly prefixes: VertexMemo;
  /** The dense layout's threshold sets of each vertex (null in the sparse layout). */
  private readonly thresholdBits: ThresholdBits | null = null;

  /** Where earliestDenseCoface found its vertex among σ's vertices. */
  private cofaceSlot = 0;

  /**
   * Dense layout: the smallest vertex v ∉ σ whose edges to σ are all ≤ f, so that σ ∪ {v} is σ's earliest
   * coface with value f; -1 if there is none. Sets cofaceSlot. Expects prepareCofaceKeys and rows[i] = s_i·n.
   */
  private earliestDenseCoface(count: number, f: number): number {
    const s = this.s;
    const m = this.dense as Float64Array;
    const rows = this.rows;
    const n = this.n;
    let j = 0;
    for (let v = 0; v < n; v++) {
      if (j < count && v === s[j]) {
        j++;
        continue;
      }
      let i = 0;
      while (i < count && m[rows[i] + v] <= f) i++;
      if (i === count) {
        this.cofaceSlot = j;
        return v;
      }
    }
    return -1;
  }

  /** Key of the coface σ ∪ {v}, v coming after j of σ's vertices; sets sign, its coefficient in δσ. */
  private cofaceKey(j: number, v: number): number {
    this.sign = (j & 1) === 0 ? 1 : -1;
    return this.low[j] + this.binom.values[(j + 1) * this.row + v] + this.high[j];
  }

  /**
   * The up-front tests of the reduction on the dense matrix with one decoding of σ (zeroFacet and
   * zeroCoface decode σ, its facet and its coface each time): see CoboundaryModel.settleUpFront.
   */
  settleUpFront(dim: number, key: number, f: number): number {
    if (this.dense === null) return -1;
    const count = dim + 1;
    this.prepareCofaceKeys(key, count);
    const s = this.s;
    const m = this.dense;
    const n = this.n;
    const rows = this.rows;
    const pf = this.pairF;
    for (let a = 0; a < count; a++) rows[a] = s[a] * n;
    for (let a = 0; a < count; a++) {
      for (let b = a + 1; b < count; b++) {
        const x = m[rows[a] + s[b]];
        pf[a * count + b] = x;
        pf[b * count + a] = x;
      }
    }
    if (dim >= 2) {
      // The latest facet with value f drops the smallest vertex whose removal keeps an edge of value f;
      // σ is that facet's earliest coface with value f unless a vertex below the dropped one also is.
      const drop = this.latestFacetDrop(count, -1, f);
      if (drop >= 0) {
        const u = s[drop];
        let earlier = false;
        let j = 0;
        for (let v = 0; v < u && !earlier; v++) {
          if (j < count && v === s[j]) {
            j++;
            continue;
          }
          let i = 0;
          while (i < count && (i === drop || m[rows[i] + v] <= f)) i++;
          earlier = i === count;
        }
        if (!earlier) return 1;
      }
    }
    // σ opens an apparent pair with its earliest coface of value f when no vertex of σ below the added one
    // can be dropped from that coface keeping value f.
    const v = this.earliestDenseCoface(count, f);
    if (v < 0 || this.latestFacetDrop(count, v, f) >= 0) return 0;
    this.apparentCoface = this.cofaceKey(this.cofaceSlot, v);
    return 2;
  }

  /**
   * With `extra` < 0: the smallest i such that σ without s_i keeps value f (-1 if none). With a vertex
   * `extra` ∉ σ (edges to σ all ≤ f): the smallest i with s_i < extra such that σ ∪ {extra} without s_i
   * keeps value f (-1 if none). Reads the pairwise values of σ from pairF.
   */
  private latestFacetDrop(count: number, extra: number, f: number): number {
    const s = this.s;
    const pf = this.pairF;
    const m = this.dense as Float64Array;
    const rows = this.rows;
    for (let i = 0; i < count; i++) {
      if (extra >= 0 && s[i] > extra) return -1;
      let facetF = Number.NEGATIVE_INFINITY;
      for (let a = 0; a < count; a++) {
        if (a === i) continue;
        for (let b = a + 1; b < count; b++) {
          if (b === i) continue;
          const x = pf[a * count + b];
          if (x > facetF) facetF = x;
        }
        if (extra >= 0) {
          const x = m[rows[a] + extra];
          if (x > facetF) facetF = x;
        }
      }
      if (facetF === f) return i;
    }
    return -1;
  }

  zeroFacet(dim: number, key: number, f: number): number {
    const count = dim + 1;
    const s = this.s;
    decodeSimplex(this.binom, key, count, s);
    // Dropping a smaller vertex gives a larger key, so the latest facet with value f drops the smallest
    // vertex i whose removal leaves every remaining edge ≤ f... and some edge equal to f.
    const pf = this.pairF;
    const width = count;
    for (let a = 0; a < count; a++) {
      for (let b = a + 1; b < count; b++) {
        const x = this.edgeValue(s[a], s[b]);
        pf[a * width + b] = x;
        pf[b * width + a] = x;
      }
    }
    const values = this.binom.values;
    const row = this.row;
    for (let i = 0; i < count; i++) {
      let facetF = Number.NEGATIVE_INFINITY;
      for (let a = 0; a < count; a++) {
        if (a === i) continue;
        for (let b = a + 1; b < count; b++) {
          if (b === i) continue;
          const x = pf[a * width + b];
          if (x > facetF) facetF = x;
        }
      }
      if (facetF === f) {
        let facetKey = 0;
        for (let a = 0; a < count; a++) {
          if (a < i) facetKey += values[(a + 1) * row + s[a]];
          else if (a > i) facetKey += values[a * row + s[a]];
        }
        this.sign = (i & 1) === 0 ? 1 : -1;
        return facetKey;
      }
    }
    return -1;
  }

  /**
   * Decodes σ into `s` and tabulates, for j vertices of σ below the new vertex, the key parts of the
   * vertices below (low[j] = Σ_{i<j} C(s_i, i+1)) and above (high[j] = Σ_{i≥j} C(s_i, i+2)).
   */
  private prepareCofaceKeys(key: number, count: number): void {
    const s = this.s;
    decodeSimplex(this.binom, key, count, s);
    const values = this.binom.values;
    const row = this.row;
    const low = this.low;
    const high = this.high;
    low[0] = 0;
    for (let j = 0; j < count; j++) low[j + 1] = low[j] + values[(j + 1) * row + s[j]];
    high[count] = 0;
    for (let j = count - 1; j >= 0; j--) high[j] = high[j + 1] + values[(j + 2) * row + s[j]];
  }

  private startIntersection(count: number): void {
    for (let i = 0; i < count; i++) this.ptr[i] = this.offsets[this.s[i]];
  }

  /** Next common neighbour ≥ `from` of the vertices in `s` (sorted rows merged in step), or -1. */
  private nextCommonNeighbour(count: number, from: number): number {
    const ptr = this.ptr;
    const t = this.targets;
    const s = this.s;
    const offsets = this.offsets;
    let candidate = from;
    for (;;) {
      let agreed = true;
      for (let i = 0; i < count; i++) {
        const end = offsets[s[i] + 1];
        let q = ptr[i];
        while (q < end && t[q] < candidate) q++;
        ptr[i] = q;
        if (q === end) return -1;
        if (t[q] > candidate) {
          candidate = t[q];
          agreed = false;
        }
      }
      if (agreed) {
        for (let i = 0; i < count; i++) ptr[i]++;
        return candidate;
      }
    }
  }

  /** Value of σ ∪ {v} for the neighbour just returned (each ptr[i] - 1 points at the edge {s_i, v}). */
  private lastCofaceF(count: number, f: number): number {
    let fv = f;
    for (let i = 0; i < count; i++) {
      const x = this.edgeF[this.ptr[i] - 1];
      if (x > fv) fv = x;
    }
    return fv;
  }
}

/** The value of the coface σ ∪ {v} of a triangle σ of value f whose vertices' matrix rows start at r0, r1, r2. */
function triangleCofaceValue(
  m: Float64Array,
  f: number,
  r0: number,
  r1: number,
  r2: number,
  v: number,
): number {
  let fv = f;
  const x0 = m[r0 + v];
  const x1 = m[r1 + v];
  const x2 = m[r2 + v];
  if (x0 > fv) fv = x0;
  if (x1 > fv) fv = x1;
  if (x2 > fv) fv = x2;
  return fv;
}
