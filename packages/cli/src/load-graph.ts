import type { WeightedGraph } from "@cliquescape/core";
import { readGraphFile } from "@cliquescape/io";
import { type GraphOptions, UsageError } from "./options/graph-options.js";

/** Reads the one graph a single-graph command works on, printing reader warnings to stderr. */
export function loadGraph(file: string, options: GraphOptions): { graph: WeightedGraph; warnings: string[] } {
  const { graphs, warnings } = readGraphFile(file, {
    directed: options.directed,
    semantics: options.weights,
    symmetrize: options.symmetrize,
    negative: options.negatives,
    zeroIsEdge: options.zeroEdges || undefined,
  });
  for (const warning of warnings) process.stderr.write(`cliquescape: ${file}: ${warning}\n`);
  if (options.slice >= graphs.length) {
    throw new UsageError(`${file} holds ${graphs.length} graph(s); --slice ${options.slice} is out of range`);
  }
  return { graph: graphs[options.slice], warnings };
}
