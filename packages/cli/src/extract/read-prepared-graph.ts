import type { WeightedGraph } from "@cliquescape/core";
import { type GraphReadOptions, readGraphFile } from "@cliquescape/io";
import type { DatasetEntry } from "./dataset-source.js";
import { transformEdges } from "./edge-transform.js";
import type { RunSpec } from "./run-spec.js";

/** How the spec's preparation reads one dataset entry (the manifest's `directed` column applies under "auto"). */
export function readOptionsFor(entry: DatasetEntry, preparation: RunSpec["preparation"]): GraphReadOptions {
  const directed =
    preparation.directed === "auto" ? (entry.directed ?? false) : preparation.directed === "directed";
  return {
    directed,
    // Which zeros are edges is decided on the values as read, before any transform.
    semantics: preparation.transform === "none" ? preparation.weights : "similarity",
    zeroIsEdge: preparation.zeroEdges === "auto" ? undefined : preparation.zeroEdges === "edge",
    symmetrize: preparation.symmetrize,
    negative: preparation.negatives,
  };
}

/** Reads one entry and prepares it exactly as the spec says: read, pick the slice, transform the edges. */
export function readPreparedGraph(
  entry: DatasetEntry,
  preparation: RunSpec["preparation"],
): { graph: WeightedGraph; warnings: string[] } {
  const { graphs, warnings } = readGraphFile(entry.file, readOptionsFor(entry, preparation));
  const slice = entry.slice ?? 0;
  if (slice >= graphs.length) {
    throw new RangeError(`${entry.file} holds ${graphs.length} graph(s); slice ${slice} is out of range`);
  }
  const graph = transformEdges(graphs[slice], preparation.transform, preparation.negatives);
  return { graph, warnings };
}
