import type { WeightedGraph } from "@cliquescape/core";
import type { DirectedGraph, UndirectedGraph } from "graphology";
import { density } from "graphology-metrics/graph/density.js";
import { weightedDegree } from "graphology-metrics/node/weighted-degree.js";
import { toGraphology } from "./to-graphology.js";

const NAMES = [
  "net_nodes",
  "net_edges",
  "net_density",
  "net_degree_mean",
  "net_degree_sd",
  "net_degree_max",
  "net_strength_mean",
  "net_strength_sd",
  "net_strength_max",
  "net_weight_mean",
  "net_weight_sd",
  "net_weight_min",
  "net_weight_max",
] as const;

/** Column names of the network family, in the order networkStatistics fills them. */
export function networkStatisticNames(): string[] {
  return [...NAMES];
}

/**
 * Plain statistics of the whole weighted graph (every edge, no threshold), through graphology and
 * graphology-metrics: node and edge counts, edge density (edges over possible edges without self-loops),
 * degree and strength (sum of edge weights at a node; directed graphs: in + out) mean, standard deviation
 * and maximum over nodes, and edge-weight mean, standard deviation, minimum and maximum. Standard
 * deviations are population ones (divide by the count). Empty sets give 0.
 */
export function networkStatistics(graph: WeightedGraph): Float64Array {
  const g = toGraphology(graph, { keys: "index" });
  const degrees: number[] = [];
  const strengths: number[] = [];
  g.forEachNode((node) => {
    degrees.push(g.degree(node));
    strengths.push(weightedDegree(g, node));
  });
  const edgeWeights: number[] = [];
  g.forEachEdge((_edge, attributes) => {
    edgeWeights.push(attributes.weight as number);
  });
  const degree = describe(degrees);
  const strength = describe(strengths);
  const weight = describe(edgeWeights);
  return Float64Array.of(
    g.order,
    g.size,
    graphDensity(g),
    degree.mean,
    degree.sd,
    degree.max,
    strength.mean,
    strength.sd,
    strength.max,
    weight.mean,
    weight.sd,
    weight.min,
    weight.max,
  );
}

/** graphology-metrics' density, defined as 0 for graphs with fewer than two nodes (it divides by zero). */
function graphDensity(g: DirectedGraph | UndirectedGraph): number {
  return g.order < 2 ? 0 : density(g);
}

function describe(values: number[]): { mean: number; sd: number; min: number; max: number } {
  if (values.length === 0) return { mean: 0, sd: 0, min: 0, max: 0 };
  let sum = 0;
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (const x of values) {
    sum += x;
    if (x < min) min = x;
    if (x > max) max = x;
  }
  const mean = sum / values.length;
  let squares = 0;
  for (const x of values) squares += (x - mean) ** 2;
  return { mean, sd: Math.sqrt(squares / values.length), min, max };
}
