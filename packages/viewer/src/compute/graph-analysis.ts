import {
  type Barcode,
  bettiCurves,
  computeBarcode,
  edgeFiltration,
  explicitGrid,
  fromFiltrationValue,
  mostPersistentBars,
  nodeLabel,
  sweepSimplexCounts,
  toFiltrationValue,
  type WeightedGraph,
  type WeightSemantics,
} from "@cliquescape/core";

/** What the page computes on a graph, and within which limits. */
export interface AnalysisSettings {
  semantics: WeightSemantics;
  /** Highest simplex dimension counted; null counts every dimension (as `inspect` does by default). */
  topDim: number | null;
  /** Homology in dimensions 0 … maxHomologyDim (the CLI's default is 2). */
  maxHomologyDim: number;
  prime: number;
  /** Simplices the counting may enumerate before it stops with a message. */
  simplexBudget: number;
}

export const DEFAULT_SETTINGS: Omit<AnalysisSettings, "semantics"> = {
  topDim: null,
  maxHomologyDim: 2,
  prime: 2,
  simplexBudget: 5e7,
};

export interface BarSummary {
  dim: number;
  birth: number;
  death: number | null;
}

/**
 * Everything the page shows about one graph, at every threshold where something changes: the distinct edge
 * values in the order edges enter. Flat typed arrays so the worker can hand them over without copying.
 */
export interface GraphAnalysis {
  n: number;
  directed: boolean;
  semantics: WeightSemantics;
  labels: string[];
  /** Each edge once (undirected: source < target), in the order edges enter the filtration. */
  sources: Int32Array;
  targets: Int32Array;
  weights: Float64Array;
  /** Distinct edge values (user units) in entering order: the steps of the threshold control. */
  thresholds: Float64Array;
  /** edgesAt[t]: edges present at thresholds[t] (the first edgesAt[t] edges of the list above). */
  edgesAt: Int32Array;
  /** counts[t * countDims + k]: k-simplices at thresholds[t]. */
  countDims: number;
  counts: Float64Array;
  euler: Float64Array;
  /** True when topDim hid simplices that exist (euler is then a partial sum). */
  truncated: boolean;
  /** betti[t * bettiDims + k]: β_k over Z/prime at thresholds[t], read off the barcode. */
  bettiDims: number;
  betti: Float64Array;
  prime: number;
  bars: BarSummary[];
  /** Where every vertex is born, in weight units. */
  start: number;
  /** The most persistent H1 bars (at most LISTED_LOOPS), longest first, as `barcode --cycles` picks them. */
  loopBars: number[];
}

/** How many of the most persistent loops the page lists and names. */
export const LISTED_LOOPS = 10;

/** Counts at every distinct edge value from one enumeration, the barcode, and Betti numbers from it. */
export function analyseGraph(
  graph: WeightedGraph,
  settings: AnalysisSettings,
): { analysis: GraphAnalysis; barcode: Barcode } {
  const { semantics } = settings;
  const edges = edgesInOrder(graph, semantics);
  const thresholds = distinctValues(edges.f, semantics);
  const edgesAt = new Int32Array(thresholds.length);
  for (let t = 0, e = 0; t < thresholds.length; t++) {
    const f = toFiltrationValue(thresholds[t], semantics);
    while (e < edges.f.length && edges.f[e] <= f) e++;
    edgesAt[t] = e;
  }
  const grid = explicitGrid(thresholds.length > 0 ? Array.from(thresholds) : [0], semantics);
  const sweep = sweepSimplexCounts(graph, grid, {
    maxDim: settings.topDim ?? undefined,
    budget: settings.simplexBudget,
  });
  const countDims = Math.max(1, ...sweep.counts.map((c) => c.length));
  const counts = new Float64Array(thresholds.length * countDims);
  for (let t = 0; t < thresholds.length; t++) counts.set(sweep.counts[t], t * countDims);
  const barcode = computeBarcode(graph, {
    semantics,
    maxDim: settings.maxHomologyDim,
    prime: settings.prime,
  });
  const bettiDims = settings.maxHomologyDim + 1;
  const betti = new Float64Array(thresholds.length * bettiDims);
  bettiCurves(barcode, grid).forEach((row, t) => {
    if (t < thresholds.length) betti.set(row, t * bettiDims);
  });
  const labels = Array.from({ length: graph.n }, (_, v) => nodeLabel(graph, v));
  return {
    barcode,
    analysis: {
      n: graph.n,
      directed: graph.directed,
      semantics,
      labels,
      sources: edges.sources,
      targets: edges.targets,
      weights: edges.weights,
      thresholds,
      edgesAt,
      countDims,
      counts: thresholds.length > 0 ? counts : new Float64Array(0),
      euler: thresholds.length > 0 ? sweep.euler : new Float64Array(0),
      truncated: sweep.truncated,
      bettiDims,
      betti,
      prime: barcode.prime,
      bars: barcode.bars.map(({ dim, birth, death }) => ({ dim, birth, death })),
      start: barcode.start,
      loopBars: mostPersistentBars(barcode, 1, LISTED_LOOPS),
    },
  };
}

/** Edges once each, sorted by filtration value (ties: by source, then target). */
function edgesInOrder(graph: WeightedGraph, semantics: WeightSemantics) {
  const slotF = edgeFiltration(graph, semantics);
  const slots: number[] = [];
  const sourceOf = new Int32Array(graph.targets.length);
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      sourceOf[s] = u;
      if (graph.directed || graph.targets[s] > u) slots.push(s);
    }
  }
  slots.sort((a, b) => slotF[a] - slotF[b] || a - b);
  const m = slots.length;
  const sources = new Int32Array(m);
  const targets = new Int32Array(m);
  const weights = new Float64Array(m);
  const f = new Float64Array(m);
  slots.forEach((s, e) => {
    sources[e] = sourceOf[s];
    targets[e] = graph.targets[s];
    weights[e] = graph.weights[s];
    f[e] = slotF[s];
  });
  return { sources, targets, weights, f };
}

function distinctValues(sortedF: Float64Array, semantics: WeightSemantics): Float64Array {
  const values: number[] = [];
  for (let e = 0; e < sortedF.length; e++)
    if (e === 0 || sortedF[e] !== sortedF[e - 1]) values.push(fromFiltrationValue(sortedF[e], semantics));
  return Float64Array.from(values);
}
