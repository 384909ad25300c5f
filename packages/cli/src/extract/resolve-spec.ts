import { checkFeatureAxis } from "@cliquescape/core";
import type { Dataset } from "@cliquescape/io";
import { UsageError } from "../options/graph-options.js";
import { VERSION } from "../version.js";
import { firstPass, type PassOptions } from "./first-pass.js";
import { readOptionsFor } from "./read-prepared-graph.js";
import { needsFirstPass, resolveGrid } from "./resolve-grid.js";
import type { ResolvedRunSpec, RunSpec } from "./run-spec.js";
import { specDifferences } from "./spec-differences.js";

/**
 * Completes the spec: the tool version, the grid (reused from the spec or the run folder, or resolved now,
 * with a first pass over the dataset for quantiles), the label codes and the node-table layout.
 */
export async function resolveSpec(
  requested: RunSpec,
  previous: RunSpec | null,
  dataset: Dataset,
  request: PassOptions,
): Promise<ResolvedRunSpec> {
  const spec: RunSpec = { ...requested, toolVersion: VERSION };
  const sameRequest =
    previous !== null &&
    specDifferences(
      { ...previous, resolvedGrid: undefined, labelNames: undefined, nodeLayout: undefined },
      {
        ...spec,
        resolvedGrid: undefined,
        labelNames: undefined,
        nodeLayout: undefined,
      },
    ).length === 0;
  // Re-running the same command on a run folder reuses its grid: the first pass is not redone.
  let resolvedGrid = spec.resolvedGrid ?? (sameRequest ? previous?.resolvedGrid : undefined);
  if (!resolvedGrid) {
    const sample = needsFirstPass(spec.grid) ? await firstPass(spec, dataset, request) : undefined;
    resolvedGrid = resolveGrid(spec.grid, spec.preparation.weights, sample);
  }
  try {
    checkFeatureAxis(resolvedGrid, spec.preparation.weights);
  } catch (error) {
    throw new UsageError(`resolvedGrid: ${(error as Error).message}`);
  }
  const known = spec.labelNames ?? (sameRequest ? previous?.labelNames : undefined) ?? [];
  const knownSet = new Set(known);
  const seen = new Set<string>();
  for (const { label } of dataset.entries) if (label !== null && !knownSet.has(label)) seen.add(label);
  const labelNames = [...known, ...[...seen].sort()];
  const directedEntry = dataset.entries.find(
    (entry) => readOptionsFor(entry, spec.preparation, spec.connectivity).directed,
  );
  const nodeLayout =
    spec.nodeLayout ??
    (sameRequest ? previous?.nodeLayout : undefined) ??
    (directedEntry ? "directed" : "undirected");
  // A directed graph has no place in undirected node tables: refuse now, not graph by graph.
  if (nodeLayout === "undirected" && directedEntry) {
    const where =
      directedEntry.declaredAt.line === undefined
        ? ""
        : ` (${directedEntry.declaredAt.file}:${directedEntry.declaredAt.line})`;
    throw new UsageError(
      `nodeLayout: the spec says "undirected", but graph ${directedEntry.id}${where} is read as directed; ` +
        `every bundle of a run has the same node columns: set nodeLayout to "directed" or leave it out`,
    );
  }
  return { ...spec, resolvedGrid, labelNames, nodeLayout, toolVersion: VERSION };
}
