import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { WorkMonitor } from "../work/work-monitor.js";
import type { CoboundaryModel, SimplexList } from "./coboundary-model.js";
import type { CofaceSink } from "./coface-sink.js";
import type { ByteLedger } from "./homology-budget.js";
import type { SimplexQuota } from "./simplex-quota.js";
import { TupleIndex } from "./tuple-index.js";
import { TupleTableBuilder } from "./tuple-table-builder.js";

/** One dimension of the directed flag complex, sorted in filtration order: (f, then tuple lexicographically). */
interface DimensionTable {
  readonly count: number;
  readonly f: Float64Array;
  /** Vertex tuples, (dim + 1) per simplex. */
  readonly tuples: Int32Array;
  /** Facets of each simplex as positions in the table below, dropping vertex 0, 1, … in turn. */
  facets: Int32Array | null;
  /** Coboundary rows (cofaces in ascending position) with the sign of this simplex in their boundary. */
  cofaceStart: Int32Array | null;
  cofaces: Int32Array | null;
  cofaceSigns: Int8Array | null;
}

/**
 * Explicit simplex tables of the directed flag complex: a k-simplex is a tuple (v0 … vk) with an arc
 * vi → vj for every i < j, entering at the largest value of those arcs. Simplices are stored up to the
 * top dimension, sorted, and a simplex's key is its position in its table, so key order is filtration
 * order. Coboundaries are stored as rows.
 */
export class DirectedFlagTables implements CoboundaryModel {
  readonly vertexCount: number;
  sign = 1;
  private readonly tables: DimensionTable[];
  private readonly lists: (SimplexList | null)[] = [];

  constructor(
    graph: WeightedGraph,
    edgeF: Float64Array,
    topDim: number,
    ledger: ByteLedger,
    monitor: WorkMonitor,
    quota: SimplexQuota,
  ) {
    this.vertexCount = graph.n;
    this.tables = enumerateDirectedSimplices(graph, edgeF, topDim, ledger, monitor, quota);
    for (let d = 1; d <= topDim; d++) linkFacets(this.tables[d - 1], this.tables[d], d, ledger, monitor);
  }

  /** Number of simplices of each dimension (for statistics). */
  counts(): number[] {
    return this.tables.map((t) => t.count);
  }

  listSimplices(dim: number): SimplexList {
    const cached = this.lists[dim];
    if (cached) return cached;
    const t = this.tables[dim];
    const key = new Float64Array(t.count);
    for (let i = 0; i < t.count; i++) key[i] = i;
    const list = { f: t.f, key, count: t.count };
    this.lists[dim] = list;
    return list;
  }

  cofaceEstimate(dim: number): number {
    const t = this.tables[dim];
    return t.cofaces === null || t.count === 0 ? 1 : Math.max(1, t.cofaces.length / t.count);
  }

  releaseSimplices(dim: number): void {
    this.lists[dim] = null;
  }

  vertices(dim: number, key: number, out: Int32Array): void {
    const t = this.tables[dim];
    for (let i = 0; i <= dim; i++) out[i] = t.tuples[key * (dim + 1) + i];
  }

  pushCoboundary(dim: number, key: number, _f: number, factor: number, p: number, sink: CofaceSink): void {
    const t = this.tables[dim];
    const up = this.tables[dim + 1];
    const start = t.cofaceStart as Int32Array;
    const cofaces = t.cofaces as Int32Array;
    const signs = t.cofaceSigns as Int8Array;
    const negative = p - factor;
    for (let q = start[key]; q < start[key + 1]; q++) {
      const c = cofaces[q];
      sink.push(up.f[c], c, signs[q] > 0 ? factor : negative);
    }
  }

  zeroCoface(dim: number, key: number, f: number): number {
    const t = this.tables[dim];
    const start = t.cofaceStart as Int32Array;
    const q = start[key];
    if (q === start[key + 1]) return -1;
    const c = (t.cofaces as Int32Array)[q];
    if (this.tables[dim + 1].f[c] !== f) return -1;
    this.sign = (t.cofaceSigns as Int8Array)[q];
    return c;
  }

  zeroFacet(dim: number, key: number, f: number): number {
    const t = this.tables[dim];
    const below = this.tables[dim - 1];
    const facets = t.facets as Int32Array;
    let best = -1;
    let bestI = 0;
    for (let i = 0; i <= dim; i++) {
      const g = facets[key * (dim + 1) + i];
      if (g > best) {
        best = g;
        bestI = i;
      }
    }
    if (best < 0 || below.f[best] !== f) return -1;
    this.sign = (bestI & 1) === 0 ? 1 : -1;
    return best;
  }
}

/**
 * Depth-first enumeration of all directed flag simplices up to `topDim`, then a sort per dimension. Roots
 * go up and every candidate list is ascending, so each table is filled in lexicographic tuple order: a
 * stable sort on f alone gives the (f, tuple) order.
 */
function enumerateDirectedSimplices(
  graph: WeightedGraph,
  edgeF: Float64Array,
  topDim: number,
  ledger: ByteLedger,
  monitor: WorkMonitor,
  quota: SimplexQuota,
): DimensionTable[] {
  const n = graph.n;
  monitor.begin("building directed tables", topDim, n);
  const { offsets, targets } = graph;
  const built: TupleTableBuilder[] = [];
  for (let d = 0; d <= topDim; d++)
    built.push(new TupleTableBuilder(d + 1, ledger, `listing directed ${d}-simplices`));
  let maxOut = 0;
  for (let u = 0; u < n; u++) maxOut = Math.max(maxOut, offsets[u + 1] - offsets[u]);
  // Candidate extensions per depth: vertex and running value of the simplex extended by it.
  const candV: Int32Array[] = [];
  const candF: Float64Array[] = [];
  const candCount = new Int32Array(topDim + 2);
  for (let d = 0; d <= topDim; d++) {
    candV.push(new Int32Array(maxOut));
    candF.push(new Float64Array(maxOut));
  }
  const tuple = new Int32Array(topDim + 1);

  const extend = (depth: number) => {
    // tuple[0 .. depth] is a simplex; its extensions are candV[depth][0 .. candCount[depth]).
    if (depth === topDim) return;
    const cv = candV[depth];
    const cf = candF[depth];
    const m = candCount[depth];
    for (let c = 0; c < m; c++) {
      if (depth === 0) monitor.check(tuple[0]);
      const v = cv[c];
      tuple[depth + 1] = v;
      built[depth + 1].push(cf[c], tuple);
      if (depth + 1 === topDim) continue;
      // Next candidates: current candidates w that v also reaches (v → w). The value of tuple + v + w is
      // the largest of: tuple + v (cf[c]), the arcs from the tuple to w (cf[c2]) and v → w.
      const base = cf[c];
      const nv = candV[depth + 1];
      const nf = candF[depth + 1];
      let k = 0;
      let q = offsets[v];
      const end = offsets[v + 1];
      for (let c2 = 0; c2 < m; c2++) {
        const w = cv[c2];
        while (q < end && targets[q] < w) q++;
        if (q === end) break;
        if (targets[q] === w) {
          nv[k] = w;
          nf[k] = Math.max(base, cf[c2], edgeF[q]);
          k++;
        }
      }
      candCount[depth + 1] = k;
      extend(depth + 1);
    }
  };

  for (let u = 0; u < n; u++) {
    monitor.check(u);
    if ((u & 63) === 0) {
      for (let d = 0; d <= topDim; d++) quota.charge(d, built[d].count, u / n, "root vertices");
    }
    tuple[0] = u;
    built[0].push(Number.NEGATIVE_INFINITY, tuple);
    let k = 0;
    for (let q = offsets[u]; q < offsets[u + 1]; q++) {
      candV[0][k] = targets[q];
      candF[0][k] = edgeF[q];
      k++;
    }
    candCount[0] = k;
    extend(0);
  }

  for (let d = 0; d <= topDim; d++) quota.charge(d, built[d].count, 1, "root vertices");
  // Every simplex value is an edge value (vertices: -∞), so ranks among the sorted edge values sort them.
  const levels = new Float64Array(edgeF.length + 1);
  levels[0] = Number.NEGATIVE_INFINITY;
  levels.set(edgeF, 1);
  levels.sort();
  const out: DimensionTable[] = [];
  for (let d = 0; d <= topDim; d++) {
    const count = built[d].count;
    const fd = built[d].f;
    const td = built[d].tuples;
    const w = d + 1;
    monitor.begin("building directed tables", d, count);
    const order = stableOrderByValue(fd, count, levels, monitor);
    const sortedF = new Float64Array(count);
    const sortedT = new Int32Array(count * w);
    for (let i = 0; i < count; i++) {
      sortedF[i] = fd[order[i]];
      for (let j = 0; j < w; j++) sortedT[i * w + j] = td[order[i] * w + j];
    }
    out.push({
      count,
      f: sortedF,
      tuples: sortedT,
      facets: null,
      cofaceStart: null,
      cofaces: null,
      cofaceSigns: null,
    });
  }
  return out;
}

/**
 * Positions 0 … count-1 in ascending f, ties kept in position order: a counting sort on the rank of each
 * f among `levels` (sorted, holding every value of f).
 */
function stableOrderByValue(
  f: Float64Array,
  count: number,
  levels: Float64Array,
  monitor: WorkMonitor,
): Int32Array {
  const rank = new Int32Array(count);
  const start = new Int32Array(levels.length + 1);
  for (let i = 0; i < count; i++) {
    if ((i & 65535) === 0) monitor.check(i);
    const x = f[i];
    let lo = 0;
    let hi = levels.length - 1;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (levels[mid] < x) lo = mid + 1;
      else hi = mid;
    }
    rank[i] = lo;
    start[lo + 1]++;
  }
  for (let r = 0; r < levels.length; r++) start[r + 1] += start[r];
  const order = new Int32Array(count);
  for (let i = 0; i < count; i++) order[start[rank[i]]++] = i;
  return order;
}

/** Fills `upper.facets` and the coboundary rows of `lower` (tuples of `lower` have dim vertices). */
function linkFacets(
  lower: DimensionTable,
  upper: DimensionTable,
  dim: number,
  ledger: ByteLedger,
  monitor: WorkMonitor,
): void {
  const w = dim; // vertices per facet
  monitor.begin("building directed tables", dim, upper.count);
  ledger.reserve(upper.count * (dim + 1) * 4 + lower.count * 12 + 64, "linking directed facets");
  const index = new TupleIndex(lower.tuples, w, lower.count);
  const facets = new Int32Array(upper.count * (dim + 1));
  const probe = new Int32Array(w);
  const degree = new Int32Array(lower.count + 1);
  for (let q = 0; q < upper.count; q++) {
    if ((q & 4095) === 0) monitor.check(q);
    for (let i = 0; i <= dim; i++) {
      let k = 0;
      for (let j = 0; j <= dim; j++) if (j !== i) probe[k++] = upper.tuples[q * (dim + 1) + j];
      const g = index.find(probe);
      facets[q * (dim + 1) + i] = g;
      degree[g + 1]++;
    }
  }
  for (let g = 0; g < lower.count; g++) degree[g + 1] += degree[g];
  const total = degree[lower.count];
  ledger.reserve(total * 5, "linking directed cofaces");
  const cofaces = new Int32Array(total);
  const signs = new Int8Array(total);
  const fill = degree.slice(0, lower.count);
  // Cofaces visited in ascending position, so every row comes out sorted.
  for (let q = 0; q < upper.count; q++) {
    for (let i = 0; i <= dim; i++) {
      const g = facets[q * (dim + 1) + i];
      cofaces[fill[g]] = q;
      signs[fill[g]] = (i & 1) === 0 ? 1 : -1;
      fill[g]++;
    }
  }
  upper.facets = facets;
  lower.cofaceStart = degree;
  lower.cofaces = cofaces;
  lower.cofaceSigns = signs;
}
