import type { WeightedGraph } from "@cliquescape/core";
import {
  connectivityGraph,
  type DatasetEntry,
  type GraphReadOptions,
  type NodeCoordinates,
  negativePolicy,
  readCoordinates,
  readDatasetConnectivity,
  readDatasetGraph,
} from "@cliquescape/io";
import {
  type ConnectivitySpec,
  describeMeasure,
  measureOptions,
  recordingOptions,
} from "../connect/connectivity-spec.js";
import { transformEdges } from "./edge-transform.js";
import type { Preparation } from "./run-spec.js";

/**
 * How the spec's preparation reads one dataset entry. Under "auto" the manifest's `directed` column decides,
 * else the measure (lagged correlation gives arcs) for recordings, else undirected.
 */
export function readOptionsFor(
  entry: DatasetEntry,
  preparation: Preparation,
  connectivity?: ConnectivitySpec,
): GraphReadOptions {
  const directed =
    preparation.directed === "auto"
      ? (entry.directed ?? connectivity?.measure === "lagged")
      : preparation.directed === "directed";
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

/**
 * Reads one entry and prepares it exactly as the spec says: read (a file or a stack's slice) — for a
 * recording, read it and compute its connectivity matrix — then transform.
 */
export function readPreparedGraph(
  entry: DatasetEntry,
  preparation: Preparation,
  connectivity?: ConnectivitySpec,
): { graph: WeightedGraph; warnings: string[]; coordinates?: NodeCoordinates } {
  const { graph, warnings, coordinates } = connectivity
    ? readRecordingGraph(entry, preparation, connectivity)
    : // The reader lets a manifest's directed column win; a forced direction must win over it instead.
      readDatasetGraph(
        preparation.directed === "auto" ? entry : { ...entry, directed: undefined },
        readOptionsFor(entry, preparation),
      );
  const negative = negativePolicy({
    negative: preparation.negatives === "auto" ? undefined : preparation.negatives,
    semantics: preparation.weights,
  });
  const prepared = transformEdges(graph, preparation.transform, negative);
  return { graph: prepared, warnings, ...(coordinates ? { coordinates } : {}) };
}

/** A recording's network: its connectivity matrix under the spec's measure, read as the preparation says. */
function readRecordingGraph(
  entry: DatasetEntry,
  preparation: Preparation,
  connectivity: ConnectivitySpec,
): { graph: WeightedGraph; warnings: string[]; coordinates?: NodeCoordinates } {
  const measured = readDatasetConnectivity(
    entry,
    recordingOptions(connectivity),
    measureOptions(connectivity),
  );
  const { graph, warnings } = connectivityGraph(
    measured.connectivity,
    entry.file,
    describeMeasure(connectivity),
    readOptionsFor(entry, preparation, connectivity),
  );
  const all = [...measured.warnings, ...warnings];
  if (entry.coordinatesFile === undefined) return { graph, warnings: all };
  return { graph, warnings: all, coordinates: readCoordinates(entry.coordinatesFile, graph) };
}
