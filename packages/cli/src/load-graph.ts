import { extname } from "node:path";
import type { WeightedGraph } from "@cliquescape/core";
import { type DatasetEntry, openDataset } from "@cliquescape/io";
import { cliMessage } from "./cli-message.js";
import { readPreparedGraph } from "./extract/read-prepared-graph.js";
import { type GraphOptions, UsageError } from "./options/graph-options.js";

const STACK_FILES = new Set([".npy", ".npz", ".mat"]);

/**
 * Reads and prepares the one graph a single-graph command works on, exactly as an extract run reads a
 * dataset entry, printing the reader's notes to stderr.
 */
export function loadGraph(file: string, options: GraphOptions): { graph: WeightedGraph; warnings: string[] } {
  const { graph, warnings } = readPreparedGraph(entryOf(file, options), options.preparation);
  for (const warning of warnings) process.stderr.write(`cliquescape: ${file}: ${cliMessage(warning)}\n`);
  return { graph, warnings };
}

/** The file as a dataset entry: a stack's slice (--slice), or the one graph of any other file. */
function entryOf(file: string, options: GraphOptions): DatasetEntry {
  const { slice, preparation } = options;
  if (STACK_FILES.has(extname(file).toLowerCase())) {
    const maxBytes = preparation.maxFileMiB === null ? undefined : preparation.maxFileMiB * 2 ** 20;
    const { entries } = openDataset(file, { maxBytes });
    if (slice >= entries.length) {
      throw new UsageError(
        `${file} holds ${entries.length} graph${entries.length === 1 ? "" : "s"}; --slice ${slice} is out of range (0 … ${entries.length - 1})`,
      );
    }
    // Messages name the file as the user typed it.
    return { ...entries[slice], file };
  }
  if (slice > 0)
    throw new UsageError(`${file} holds one graph; --slice picks a matrix of a stack (.npy .npz .mat)`);
  return { id: file, file, label: null, split: null, metadata: {}, declaredAt: { file } };
}
