import {
  type FeatureAxis,
  type FeatureConfig,
  type TopologicalFeatureOptions,
  type TopologicalFeatures,
  topologicalFeatureNames,
  topologicalFeatures,
  type WeightedGraph,
} from "@cliquescape/core";
import { networkStatisticNames, networkStatistics } from "./network-statistics.js";

/**
 * Every column of a graph's feature row: the topological families from core, then the network family
 * (`net_…`) when it is on. Depends on the configuration and the axis only.
 */
export function graphFeatureNames(config: FeatureConfig, axis: FeatureAxis): string[] {
  const names = topologicalFeatureNames(config, axis);
  return config.families.network ? names.concat(networkStatisticNames()) : names;
}

/** The full feature row of one graph, aligned with graphFeatureNames; other fields as in core. */
export function graphFeatures(graph: WeightedGraph, options: TopologicalFeatureOptions): TopologicalFeatures {
  const topological = topologicalFeatures(graph, options);
  if (!options.config.families.network) return topological;
  const network = networkStatistics(graph);
  const values = new Float64Array(topological.values.length + network.length);
  values.set(topological.values);
  values.set(network, topological.values.length);
  return { ...topological, values };
}
