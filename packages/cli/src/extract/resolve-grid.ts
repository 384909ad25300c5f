import { evenGrid, explicitGrid, type WeightSemantics } from "@cliquescape/core";
import { UsageError } from "../options/graph-options.js";
import type { GridRequest, ResolvedGrid } from "./run-spec.js";
import { quantileOfSorted } from "./weight-quantiles.js";

/** Whether the grid needs a first pass over the dataset's weights before it can be fixed. */
export function needsFirstPass(request: GridRequest): boolean {
  return request.kind === "quantiles";
}

/**
 * The exact axis every graph's columns are read on. Weights are put in filtration order (descending for
 * similarities, ascending for distances) without repeats; densities ascending without repeats. A quantile
 * grid takes `steps` evenly spaced weights between the two quantiles of all edge values in `sample`.
 */
export function resolveGrid(
  request: GridRequest,
  semantics: WeightSemantics,
  sample?: Float64Array,
): ResolvedGrid {
  if (request.kind === "weights") {
    return { kind: "weight", values: Array.from(explicitGrid(request.values, semantics).thresholds) };
  }
  if (request.kind === "densities") {
    return { kind: "density", values: [...new Set(request.values)].sort((a, b) => a - b) };
  }
  if (request.from > request.to) {
    throw new UsageError(`grid quantiles: from (${request.from}) is above to (${request.to})`);
  }
  if (!sample || sample.length === 0) {
    throw new UsageError(
      "no graph of the dataset gave an edge (all unreadable or without edges): a quantile grid cannot be chosen; give --threshold or --density",
    );
  }
  const sorted = Float64Array.from(sample).sort();
  const low = quantileOfSorted(sorted, request.from);
  const high = quantileOfSorted(sorted, request.to);
  // The filtration starts at the strong end: high weights for similarities, low ones for distances.
  const [first, last] = semantics === "similarity" ? [high, low] : [low, high];
  const grid = evenGrid(first, last, request.steps, semantics);
  return {
    kind: "weight",
    values: Array.from(grid.thresholds),
    quantileWeights: [low, high],
    edgesSampled: sorted.length,
  };
}
