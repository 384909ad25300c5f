import type { WeightedGraph } from "@cliquescape/core";
import {
  type DatasetEntry,
  type GraphReadOptions,
  type NodeCoordinates,
  readDatasetGraph,
} from "@cliquescape/io";
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

/** Reads one entry and prepares it exactly as the spec says: read (a file or a stack's slice), transform. */
export function readPreparedGraph(
  entry: DatasetEntry,
  preparation: RunSpec["preparation"],
): { graph: WeightedGraph; warnings: string[]; coordinates?: NodeCoordinates } {
  // The reader lets a manifest's directed column win; a forced direction must win over it instead.
  const read = preparation.directed === "auto" ? entry : { ...entry, directed: undefined };
  const { graph, warnings, coordinates } = readDatasetGraph(read, readOptionsFor(entry, preparation));
  const prepared = transformEdges(graph, preparation.transform, preparation.negatives);
  return { graph: prepared, warnings, ...(coordinates ? { coordinates } : {}) };
}
