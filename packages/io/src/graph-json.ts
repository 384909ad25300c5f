import { fromEdgeList, type WeightedGraph } from "@cliquescape/core";
import type { NodeCoordinates } from "./dataset/read-coordinates.js";
import { InputFileError } from "./input-file-error.js";

/**
 * A prepared graph as plain JSON, for handing a graph from Node to a page or worker: edges as parallel
 * arrays (an undirected edge once, source < target), weights exactly as the graph holds them (after
 * symmetrising, negative-weight policy and transforms), node labels, and node coordinates when known.
 */
export interface GraphJson {
  format: "cliquescape-graph/1";
  n: number;
  directed: boolean;
  labels: string[] | null;
  sources: number[];
  targets: number[];
  weights: number[];
  coordinates: { dims: number; values: number[] } | null;
}

/** The JSON form of a graph, each edge once. */
export function graphToJson(graph: WeightedGraph, coordinates?: NodeCoordinates): GraphJson {
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  for (let u = 0; u < graph.n; u++) {
    for (let slot = graph.offsets[u]; slot < graph.offsets[u + 1]; slot++) {
      const v = graph.targets[slot];
      if (!graph.directed && v < u) continue;
      sources.push(u);
      targets.push(v);
      weights.push(graph.weights[slot]);
    }
  }
  return {
    format: "cliquescape-graph/1",
    n: graph.n,
    directed: graph.directed,
    labels: graph.labels ? [...graph.labels] : null,
    sources,
    targets,
    weights,
    coordinates: coordinates ? { dims: coordinates.dims, values: Array.from(coordinates.values) } : null,
  };
}

/** Rebuilds the graph (and its coordinates) from its JSON form; `file` names the source in errors. */
export function graphFromJson(
  json: unknown,
  file: string,
): { graph: WeightedGraph; coordinates?: NodeCoordinates } {
  const doc = json as Partial<GraphJson> | null;
  const fail = (reason: string): never => {
    throw new InputFileError(file, "unreadable", `not a cliquescape graph document: ${reason}`);
  };
  if (!doc || typeof doc !== "object" || doc.format !== "cliquescape-graph/1")
    fail('no "format": "cliquescape-graph/1"');
  const { n, directed, labels, sources, targets, weights, coordinates } = doc as GraphJson;
  if (!Number.isInteger(n) || n < 0) fail('"n" is not a node count');
  if (!Array.isArray(sources) || !Array.isArray(targets) || !Array.isArray(weights))
    fail('"sources", "targets" and "weights" must be arrays');
  const graph = fromEdgeList({
    n,
    sources,
    targets,
    weights,
    directed: Boolean(directed),
    labels: labels ?? undefined,
    negative: "keep",
  });
  if (!coordinates) return { graph };
  if (coordinates.values.length !== n * coordinates.dims) fail("coordinates do not match the node count");
  return { graph, coordinates: { dims: coordinates.dims, values: Float64Array.from(coordinates.values) } };
}
