import type { WeightedGraph } from "@cliquescape/core";
import {
  type DatasetEntry,
  type GraphReadOptions,
  type NodeCoordinates,
  negativePolicy,
  readDatasetGraph,
} from "@cliquescape/io";
import { transformEdges } from "./edge-transform.js";
import type { Preparation } from "./run-spec.js";

/** How the spec's preparation reads one dataset entry (the manifest's `directed` column applies under "auto"). */
export function readOptionsFor(entry: DatasetEntry, preparation: Preparation): GraphReadOptions {
  const directed =
    preparation.directed === "auto" ? (entry.directed ?? false) : preparation.directed === "directed";
  return {
    directed,
    // Which zeros (and, under "auto", which negatives) are edges is decided on the values as read, before
    // any transform: those are similarities unless there is no transform.
    semantics: preparation.transform === "none" ? preparation.weights : "similarity",
    zeroIsEdge: preparation.zeroEdges === "auto" ? undefined : preparation.zeroEdges === "edge",
    nanIsNoEdge: preparation.nanCells === "no-edge",
    symmetrize: preparation.symmetrize,
    negative: preparation.negatives === "auto" ? undefined : preparation.negatives,
    maxCells: preparation.maxNodes ** 2,
    ...(preparation.maxFileMiB === null ? {} : { maxBytes: preparation.maxFileMiB * 2 ** 20 }),
  };
}

/** Reads one entry and prepares it exactly as the spec says: read (a file or a stack's slice), transform. */
export function readPreparedGraph(
  entry: DatasetEntry,
  preparation: Preparation,
): { graph: WeightedGraph; warnings: string[]; coordinates?: NodeCoordinates } {
  // The reader lets a manifest's directed column win; a forced direction must win over it instead.
  const read = preparation.directed === "auto" ? entry : { ...entry, directed: undefined };
  const { graph, warnings, coordinates } = readDatasetGraph(read, readOptionsFor(entry, preparation));
  const negative = negativePolicy({
    negative: preparation.negatives === "auto" ? undefined : preparation.negatives,
    semantics: preparation.weights,
  });
  const prepared = transformEdges(graph, preparation.transform, negative);
  return { graph: prepared, warnings, ...(coordinates ? { coordinates } : {}) };
}
