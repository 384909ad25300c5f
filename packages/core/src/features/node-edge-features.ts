import { countSimplices } from "../count/count-simplices.js";
import { toFiltrationValue, type WeightSemantics } from "../filtration/weight-semantics.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { WorkControl } from "../work/work-control.js";

export interface NodeEdgeFeatureOptions {
  /** Keep only edges present at this threshold (user units); omitted = every edge. */
  readonly threshold?: number;
  /** How to read `threshold`; required with it. */
  readonly semantics?: WeightSemantics;
  /** Participation is counted for simplices of dimension 1..topDim (≥ 1). */
  readonly topDim: number;
  /** Simplex budget of the enumeration (see CountOptions.budget). */
  readonly budget?: number;
  /** Time limit and progress of the enumeration. */
  readonly work?: WorkControl;
}

/** Node and edge feature tables of one graph at one threshold, shaped for graph neural network libraries. */
export interface NodeEdgeFeatures {
  readonly nodeFeatureNames: string[];
  /** n × nodeFeatureNames.length, row-major. */
  readonly x: Float32Array;
  readonly edgeFeatureNames: string[];
  /**
   * 2 × E, row-major: the E sources, then the E targets. An undirected edge appears in both directions (the
   * usual convention of graph neural network libraries); a directed edge once. Edges in CSR order.
   */
  readonly edgeIndex: Int32Array;
  /** E × edgeFeatureNames.length, row-major, aligned with edgeIndex. */
  readonly edgeAttr: Float32Array;
  /** True when simplices above topDim exist (participation up to topDim is still exact). */
  readonly truncated: boolean;
}

/** Names of the node columns: degrees and strengths, then participation per dimension. */
export function nodeFeatureNames(directed: boolean, topDim: number): string[] {
  const names = directed
    ? ["in_degree", "out_degree", "in_strength", "out_strength"]
    : ["degree", "strength"];
  for (let k = 1; k <= topDim; k++) names.push(`simplices_d${k}`);
  if (directed) {
    for (let k = 1; k <= topDim; k++) names.push(`simplices_d${k}_as_source`);
    for (let k = 1; k <= topDim; k++) names.push(`simplices_d${k}_as_sink`);
  }
  return names;
}

/** Names of the edge columns: the weight, then how many k-simplices contain the edge, k = 2..topDim. */
export function edgeFeatureNames(topDim: number): string[] {
  const names = ["weight"];
  for (let k = 2; k <= topDim; k++) names.push(`simplices_d${k}`);
  return names;
}

/**
 * Node and edge features of the graph kept at one threshold. Per node: degree and strength (sum of the
 * weights of its edges; directed graphs split both into in and out), and the number of k-simplices it lies
 * in for k = 1..topDim (directed: also as the simplex's source v0 and sink vk). Per edge: its weight and the
 * number of k-simplices containing it for k = 2..topDim. Counts come from one participation enumeration
 * (countSimplices). Values are float32 as GNN libraries expect: counts above 2^24 lose their last digits.
 */
export function nodeEdgeFeatures(graph: WeightedGraph, options: NodeEdgeFeatureOptions): NodeEdgeFeatures {
  const { topDim, threshold, semantics } = options;
  if (!Number.isInteger(topDim) || topDim < 1)
    throw new RangeError(`topDim must be an integer ≥ 1, got ${topDim}`);
  if (threshold !== undefined && semantics === undefined) {
    throw new TypeError("a threshold needs semantics: 'distance' or 'similarity'");
  }
  const { n, directed, offsets, targets, weights } = graph;
  const counted = countSimplices(graph, {
    ...options.work,
    threshold,
    semantics,
    maxDim: topDim,
    budget: options.budget,
    participation: true,
    edgeParticipation: true,
  });
  const participation = counted.participation!;
  const perEdge = counted.edgeParticipation!;

  // Which stored slots survive the threshold.
  const cut = threshold === undefined ? Number.POSITIVE_INFINITY : toFiltrationValue(threshold, semantics!);
  const kept = new Uint8Array(targets.length);
  let E = 0;
  for (let s = 0; s < targets.length; s++) {
    if (toFiltrationValue(weights[s], semantics ?? "distance") <= cut) {
      kept[s] = 1;
      E++;
    }
  }

  const nodeNames = nodeFeatureNames(directed, topDim);
  const F = nodeNames.length;
  const x = new Float32Array(n * F);
  // Degrees and strengths from the kept slots: row u holds u's out-edges (all edges when undirected).
  for (let u = 0; u < n; u++) {
    for (let s = offsets[u]; s < offsets[u + 1]; s++) {
      if (!kept[s]) continue;
      const w = weights[s];
      if (directed) {
        const v = targets[s];
        x[u * F + 1]++; // out-degree of u
        x[u * F + 3] += w; // out-strength of u
        x[v * F]++; // in-degree of v
        x[v * F + 2] += w; // in-strength of v
      } else {
        x[u * F]++;
        x[u * F + 1] += w;
      }
    }
  }
  const base = directed ? 4 : 2;
  const dimColumn = (table: Float64Array[] | undefined, k: number, column: number) => {
    const row = table !== undefined && k < table.length ? table[k] : null;
    for (let v = 0; v < n; v++) x[v * F + column] = row ? row[v] : 0;
  };
  for (let k = 1; k <= topDim; k++) {
    dimColumn(participation.member, k, base + k - 1);
    if (directed) {
      dimColumn(participation.source, k, base + topDim + k - 1);
      dimColumn(participation.sink, k, base + 2 * topDim + k - 1);
    }
  }

  const edgeNames = edgeFeatureNames(topDim);
  const G = edgeNames.length;
  const edgeIndex = new Int32Array(2 * E);
  const edgeAttr = new Float32Array(E * G);
  let e = 0;
  for (let u = 0; u < n; u++) {
    for (let s = offsets[u]; s < offsets[u + 1]; s++) {
      if (!kept[s]) continue;
      edgeIndex[e] = u;
      edgeIndex[E + e] = targets[s];
      edgeAttr[e * G] = weights[s];
      for (let k = 2; k <= topDim; k++) edgeAttr[e * G + k - 1] = k < perEdge.length ? perEdge[k][s] : 0;
      e++;
    }
  }
  return {
    nodeFeatureNames: nodeNames,
    x,
    edgeFeatureNames: edgeNames,
    edgeIndex,
    edgeAttr,
    truncated: counted.truncated,
  };
}
