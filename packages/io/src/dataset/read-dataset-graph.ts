import type { WeightedGraph } from "@cliquescape/core";
import { arrayGraph } from "../formats/matrix-stack.js";
import { InputFileError } from "../input-file-error.js";
import { readGraphFile } from "../read-graph-file.js";
import type { GraphReadOptions } from "../read-options.js";
import type { DatasetEntry } from "./dataset-types.js";
import { type NodeCoordinates, readCoordinates } from "./read-coordinates.js";
import { loadStack } from "./stack-source.js";

export interface DatasetGraph {
  graph: WeightedGraph;
  /** Notes for the user, without the file name. */
  warnings: string[];
  coordinates?: NodeCoordinates;
}

/**
 * Reads the graph of one dataset entry: a file of one graph, or one slice of a stack. The entry's
 * `directed` overrides the options'. A file holding several graphs is an error here: open it as a stack.
 */
export function readDatasetGraph(entry: DatasetEntry, options: GraphReadOptions): DatasetGraph {
  const read = { ...options, ...(entry.directed === undefined ? {} : { directed: entry.directed }) };
  let graph: WeightedGraph;
  const warnings: string[] = [];
  if (entry.slice !== undefined) {
    const source = loadStack(entry.file, entry.variable, read.maxBytes);
    const one = arrayGraph(source.array, source.axis, entry.slice, entry.file, read, source.place);
    graph = one.graph;
    warnings.push(...source.warnings, ...one.warnings);
  } else {
    const result = readGraphFile(entry.file, {
      ...read,
      ...(entry.variable === undefined ? {} : { array: entry.variable, variable: entry.variable }),
    });
    if (result.graphs.length !== 1) {
      throw new InputFileError(
        entry.file,
        "bad-header",
        `the file holds ${result.graphs.length} graphs; open it as a stack dataset to read them one by one`,
      );
    }
    graph = result.graphs[0];
    warnings.push(...result.warnings);
  }
  if (entry.coordinatesFile === undefined) return { graph, warnings };
  return { graph, warnings, coordinates: readCoordinates(entry.coordinatesFile, graph) };
}
