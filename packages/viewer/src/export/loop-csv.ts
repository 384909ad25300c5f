import { encodeCsv } from "@cliquescape/io/browser";
import type { GraphAnalysis } from "../compute/graph-analysis.js";

/**
 * A loop as CSV, one edge per row in walking order: step, source and target (node numbers, 0-based, and
 * labels) and the edge's weight. For directed graphs source → target is the arc as stored.
 */
export function loopCsv(
  analysis: GraphAnalysis,
  pairs: Int32Array,
  edgeNumber: (u: number, v: number) => number | undefined,
): string {
  const rows = [];
  for (let step = 0; step < pairs.length / 2; step++) {
    const u = pairs[2 * step];
    const v = pairs[2 * step + 1];
    const e = edgeNumber(u, v);
    rows.push([
      step,
      u,
      v,
      analysis.labels[u],
      analysis.labels[v],
      e === undefined ? "" : analysis.weights[e],
    ]);
  }
  return encodeCsv(["step", "source", "target", "source_label", "target_label", "weight"], rows);
}
