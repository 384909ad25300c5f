import {
  densityGrid,
  type NodeEdgeFeatures,
  nodeEdgeFeatures,
  nodeFeatureNames,
  type WeightedGraph,
  type WorkControl,
} from "@cliquescape/core";
import { encodeNpz, type NodeCoordinates, type NpzArray } from "@cliquescape/io";
import type { ResolvedRunSpec } from "./run-spec.js";

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
export function gnnBundle(
  graph: WeightedGraph,
  labelCode: number,
  spec: ResolvedRunSpec,
  coordinates: NodeCoordinates | undefined,
  work: WorkControl,
): Uint8Array {
  const semantics = spec.preparation.weights;
  const threshold = nodeFeatureThreshold(graph, spec);
  const f = nodeEdgeFeatures(graph, {
    threshold,
    semantics,
    topDim: spec.complex.topDim,
    budget: spec.complex.simplexBudget ?? undefined,
    work,
  });
  const nodeNames = bundleNodeColumns(spec.nodeLayout === "directed", spec.complex.topDim);
  const x = bundleNodeTable(f, graph.n, nodeNames);
  const F = nodeNames.length;
  const G = f.edgeFeatureNames.length;
  const E = f.edgeIndex.length / 2;
  const labels = Array.from({ length: graph.n }, (_, v) => (graph.labels ? graph.labels[v] : String(v)));
  const arrays: NpzArray[] = [
    { name: "x", dtype: "float32", shape: [graph.n, F], values: x },
    { name: "edge_index", dtype: "int64", shape: [2, E], values: f.edgeIndex },
    { name: "edge_attr", dtype: "float32", shape: [E, G], values: f.edgeAttr },
    { name: "y", dtype: "int64", shape: [1], values: [labelCode] },
    { name: "directed", dtype: "int64", shape: [1], values: [graph.directed ? 1 : 0] },
    { name: "node_feature_names", dtype: "unicode", shape: [F], values: nodeNames },
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
 * The node columns of every bundle of a dataset: degrees and strengths, then participation in k-simplices
 * from k = 2. Participation in 1-simplices is the degree itself (and, directed, as source the out-degree,
 * as sink the in-degree), so a column of it would repeat one already there.
 */
export function bundleNodeColumns(directed: boolean, topDim: number): string[] {
  return nodeFeatureNames(directed, topDim).filter((name) => !/^simplices_d1(_|$)/.test(name));
}

/**
 * The node table with the bundle's columns, taken by name from the core's table. An undirected graph in
 * the directed layout (a dataset with directed graphs): in- and out-degree are its degree, in- and
 * out-strength its strength, and participation as source or sink is 0 (its simplices have no orientation;
 * the bundle's `directed` flag says so).
 */
function bundleNodeTable(f: NodeEdgeFeatures, n: number, names: readonly string[]): Float32Array {
  const from = f.nodeFeatureNames;
  const undirectedName: Record<string, string> = {
    in_degree: "degree",
    out_degree: "degree",
    in_strength: "strength",
    out_strength: "strength",
  };
  const sources = names.map((name) => {
    const column = from.indexOf(from.includes(name) ? name : (undirectedName[name] ?? ""));
    if (column < 0 && !name.includes("_as_")) {
      throw new RangeError(
        `the graph is directed but the spec's nodeLayout is undirected (made for a dataset without directed graphs): no column ${name}`,
      );
    }
    return column; // −1: source/sink participation of an undirected graph, 0
  });
  const width = from.length;
  const x = new Float32Array(n * names.length);
  for (let v = 0; v < n; v++) {
    for (let c = 0; c < names.length; c++) {
      if (sources[c] >= 0) x[v * names.length + c] = f.x[v * width + sources[c]];
    }
  }
  return x;
}
