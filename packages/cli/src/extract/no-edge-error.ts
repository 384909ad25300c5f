import type { DatasetEntry } from "@cliquescape/io";
import type { GraphFailure } from "./graph-failure.js";

/** Every graph of a dataset failed or had no edge, so a quantile grid has nothing to be chosen from. */
export class NoEdgeError extends Error {
  override name = "NoEdgeError";
}

const GROUPS_SHOWN = 5;

/**
 * The real reason a first pass found no edge: the graphs' own errors, grouped by what they say (numbers and
 * positions aside), each group with its count and one example, or, when every graph was read, that none
 * has an edge after preparation.
 */
export function noEdgeError(
  entries: readonly DatasetEntry[],
  failures: readonly (GraphFailure | null)[],
): NoEdgeError {
  const groups = new Map<string, { count: number; id: string; failure: GraphFailure }>();
  failures.forEach((failure, i) => {
    if (!failure) return;
    const key = `${failure.kind}:${failure.reason.replace(/-?\d+(\.\d+)?(e[-+]?\d+)?/gi, "#")}`;
    const group = groups.get(key);
    if (group) group.count++;
    else groups.set(key, { count: 1, id: entries[i].id, failure });
  });
  const failed = [...groups.values()].reduce((sum, g) => sum + g.count, 0);
  const head = "no graph of the dataset gave an edge, so the quantile grid cannot be chosen";
  if (failed === 0) {
    return new NoEdgeError(
      `${head}: all ${entries.length} graphs were read, but none has an edge once prepared (0, NaN and, for similarity weights, negative values are no edge; see --zero-edges, --nan-cells, --negatives)`,
    );
  }
  const lines = [...groups.values()]
    .sort((a, b) => b.count - a.count)
    .slice(0, GROUPS_SHOWN)
    .map(({ count, id, failure }) => {
      const where =
        failure.line === null ? "" : `:${failure.line}${failure.column === null ? "" : `:${failure.column}`}`;
      return `  ${count} graph${count === 1 ? "" : "s"}, e.g. ${id}: ${failure.file}${where}: ${failure.reason}`;
    });
  const more = groups.size > GROUPS_SHOWN ? [`  … and ${groups.size - GROUPS_SHOWN} other reasons`] : [];
  const rest = entries.length - failed;
  const read = rest > 0 ? `; the other ${rest} were read but have no edge once prepared` : "";
  return new NoEdgeError(
    `${head}: ${failed} of ${entries.length} graphs could not be read${read}:\n${[...lines, ...more].join("\n")}`,
  );
}
