import {
  allEdgesGrid,
  type Barcode,
  densityGrid,
  edgeCount,
  type FeatureConfig,
  type NodeEdgeFeatures,
  nodeEdgeFeatures,
  nodeFeatureNames,
  type WeightedGraph,
  type WorkControl,
} from "@cliquescape/core";
import {
  type DatasetEntry,
  encodeNpz,
  graphFeatures,
  type NodeCoordinates,
  type NpzArray,
} from "@cliquescape/io";
import { type BarcodeReport, renderBarcode } from "../commands/barcode.js";
import { type GraphFailure, graphFailureOf } from "./graph-failure.js";
import { readPreparedGraph } from "./read-prepared-graph.js";
import type { ResolvedRunSpec } from "./run-spec.js";

/** What one graph gives: its feature row and, as asked, its barcode and GNN bundle, ready to be written. */
export interface GraphProduct {
  ok: true;
  values: Float64Array;
  /** The weight thresholds this graph was read at (differ per graph on a density axis). */
  thresholds: number[];
  barcodeJson: string | null;
  bundle: Uint8Array | null;
  nodes: number;
  edges: number;
  directed: boolean;
  truncated: boolean | null;
  warnings: string[];
}

export type GraphOutcome = GraphProduct | { ok: false; failure: GraphFailure; warnings: string[] };

/** The feature configuration of the core's feature functions, from the spec. */
export function featureConfigOf(spec: ResolvedRunSpec): FeatureConfig {
  return {
    families: spec.families,
    topDim: spec.complex.topDim,
    prime: spec.complex.prime,
    barcodeRange: spec.complex.barcodeRange,
    vectorisation: spec.vectorisation,
  };
}

/**
 * Reads, prepares and computes one graph. Never throws for a problem of the graph itself: the problem comes
 * back as a failure with file and position, so the rest of the dataset goes on.
 */
export function computeGraph(
  entry: DatasetEntry,
  relativeFile: string,
  labelCode: number,
  spec: ResolvedRunSpec,
  work: WorkControl = {},
): GraphOutcome {
  let warnings: string[] = [];
  try {
    const read = readPreparedGraph(entry, spec.preparation, spec.connectivity);
    warnings = read.warnings;
    const { graph, coordinates } = read;
    const semantics = spec.preparation.weights;
    const features = graphFeatures(graph, {
      config: featureConfigOf(spec),
      axis: spec.resolvedGrid,
      semantics,
      countBudget: spec.complex.simplexBudget ?? undefined,
      homologyBudget: { maxBytes: spec.complex.homologyMemoryMiB * 2 ** 20 },
      work,
    });
    const barcodeJson =
      spec.outputs.barcodes && features.barcode
        ? barcodeDocument(entry.id, relativeFile, graph, features.barcode, features.grid.thresholds, spec)
        : null;
    const bundle = spec.outputs.bundles ? gnnBundle(graph, labelCode, spec, coordinates, work) : null;
    return {
      ok: true,
      values: features.values,
      thresholds: Array.from(features.grid.thresholds),
      barcodeJson,
      bundle,
      nodes: graph.n,
      edges: edgeCount(graph),
      directed: graph.directed,
      truncated: features.truncated,
      warnings,
    };
  } catch (error) {
    return { ok: false, failure: graphFailureOf(error, relativeFile), warnings };
  }
}

/**
 * The barcode in the same JSON layout as `cliquescape barcode --format json`, plus the graph's id. `end` is
 * where the filtration stops: the grid's last threshold for barcodeRange "axis", the last edge for "full".
 */
function barcodeDocument(
  id: string,
  file: string,
  graph: WeightedGraph,
  barcode: Barcode,
  thresholds: Float64Array,
  spec: ResolvedRunSpec,
): string {
  const semantics = spec.preparation.weights;
  const end =
    spec.complex.barcodeRange === "axis"
      ? thresholds[thresholds.length - 1]
      : allEdgesGrid(graph, semantics).thresholds[0];
  const report: BarcodeReport & { id: string } = {
    id,
    file,
    directed: graph.directed,
    weights: spec.preparation.weights,
    prime: barcode.prime,
    start: barcode.start,
    end,
    bars: barcode.bars.map((bar) => ({ dim: bar.dim, birth: bar.birth, death: bar.death })),
  };
  return renderBarcode(report, "json");
}

/** The weight at which node and edge features are read, or undefined for every edge. */
export function nodeFeatureThreshold(graph: WeightedGraph, spec: ResolvedRunSpec): number | undefined {
  const choice = spec.nodeFeatures.threshold;
  if (choice.kind === "all") return undefined;
  if (choice.kind === "weight") return choice.value;
  return densityGrid(graph, [choice.value], spec.preparation.weights).thresholds[0];
}

/**
 * The GNN bundle of one graph: arrays named and shaped as graph-learning libraries take them (x, edge_index
 * 2×E, edge_attr, y), with the column names, node labels, the threshold they were read at and, when the
 * dataset gives node coordinates, their positions (pos).
 */
function gnnBundle(
  graph: WeightedGraph,
  labelCode: number,
  spec: ResolvedRunSpec,
  coordinates: NodeCoordinates | undefined,
  work: WorkControl,
): Uint8Array {
  const semantics = spec.preparation.weights;
  const threshold = nodeFeatureThreshold(graph, spec);
  const f = inNodeLayout(
    nodeEdgeFeatures(graph, {
      threshold,
      semantics,
      topDim: spec.complex.topDim,
      budget: spec.complex.simplexBudget ?? undefined,
      work,
    }),
    graph,
    spec,
  );
  const F = f.nodeFeatureNames.length;
  const G = f.edgeFeatureNames.length;
  const E = f.edgeIndex.length / 2;
  const labels = Array.from({ length: graph.n }, (_, v) => (graph.labels ? graph.labels[v] : String(v)));
  const arrays: NpzArray[] = [
    { name: "x", dtype: "float32", shape: [graph.n, F], values: f.x },
    { name: "edge_index", dtype: "int64", shape: [2, E], values: f.edgeIndex },
    { name: "edge_attr", dtype: "float32", shape: [E, G], values: f.edgeAttr },
    { name: "y", dtype: "int64", shape: [1], values: [labelCode] },
    { name: "directed", dtype: "int64", shape: [1], values: [graph.directed ? 1 : 0] },
    { name: "node_feature_names", dtype: "unicode", shape: [F], values: f.nodeFeatureNames },
    { name: "edge_feature_names", dtype: "unicode", shape: [G], values: f.edgeFeatureNames },
    { name: "node_labels", dtype: "unicode", shape: [graph.n], values: labels },
    // NaN when every edge is kept.
    { name: "threshold", dtype: "float64", shape: [1], values: [threshold ?? Number.NaN] },
  ];
  if (coordinates) {
    const pos = Float32Array.from(coordinates.values);
    arrays.push({ name: "pos", dtype: "float32", shape: [graph.n, coordinates.dims], values: pos });
  }
  return encodeNpz(arrays);
}

/**
 * The node table in the dataset's layout, so every bundle has the same columns. An undirected graph in the
 * directed layout: in- and out-degree are its degree, in- and out-strength its strength, and participation
 * as source or sink is 0 (its simplices have no orientation; the bundle's `directed` flag says so).
 */
function inNodeLayout(f: NodeEdgeFeatures, graph: WeightedGraph, spec: ResolvedRunSpec): NodeEdgeFeatures {
  if (spec.nodeLayout === (graph.directed ? "directed" : "undirected")) return f;
  if (graph.directed) {
    throw new RangeError(
      "the graph is directed but the spec's nodeLayout is undirected (made for a dataset without directed graphs)",
    );
  }
  const topDim = spec.complex.topDim;
  const names = nodeFeatureNames(true, topDim);
  const from = f.nodeFeatureNames.length;
  const to = names.length;
  const x = new Float32Array(graph.n * to);
  for (let v = 0; v < graph.n; v++) {
    const row = f.x.subarray(v * from, (v + 1) * from);
    x[v * to] = row[0]; // in_degree
    x[v * to + 1] = row[0]; // out_degree
    x[v * to + 2] = row[1]; // in_strength
    x[v * to + 3] = row[1]; // out_strength
    for (let k = 1; k <= topDim; k++) x[v * to + 3 + k] = row[1 + k]; // simplices_d{k}; source/sink stay 0
  }
  return { ...f, nodeFeatureNames: names, x };
}
