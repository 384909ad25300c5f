import type { DatasetEntry } from "@cliquescape/io";
import { assembleTables, type ErrorRow } from "./assemble-tables.js";
import { runFeatureNames } from "./graph-job.js";
import type { GraphRecord } from "./graph-record.js";
import type { RunFolder } from "./run-folder.js";
import type { ResolvedRunSpec } from "./run-spec.js";
import { renderSummary } from "./run-summary.js";
import { writeTableSet } from "./table-set.js";

export interface FinishRequest {
  folder: RunFolder;
  spec: ResolvedRunSpec;
  /** The dataset's graphs in order (only their ids matter here). */
  entries: readonly Pick<DatasetEntry, "id">[];
  records: ReadonlyMap<string, GraphRecord>;
  problems: readonly ErrorRow[];
  skipped: number;
  interrupted: boolean;
}

export interface ExtractResult {
  exitCode: number;
  folder: RunFolder;
  graphs: number;
  done: number;
  failed: number;
  skipped: number;
  interrupted: boolean;
}

/**
 * The last step of a run (a single run, or the merge of shards): the tables from the per-graph records in
 * dataset order, written atomically, and the summary on stdout. Exit code 1 when a graph was left out.
 */
export function finishRun(request: FinishRequest): ExtractResult {
  const { folder, spec, entries, records, interrupted } = request;
  const featureNames = runFeatureNames(spec);
  const tables = assembleTables(entries, records, featureNames, spec.labelNames, request.problems);
  writeTableSet(folder, tables);

  const doneRecords = entries.map((e) => records.get(e.id)).filter((r): r is GraphRecord => r !== undefined);
  process.stdout.write(
    renderSummary({
      folder,
      spec,
      featureNames,
      records: doneRecords,
      totalGraphs: entries.length,
      skipped: request.skipped,
      errors: tables.errors,
      interrupted,
    }),
  );
  const failedGraphs = tables.errors.length;
  return {
    exitCode: interrupted ? 130 : failedGraphs > 0 ? 1 : 0,
    folder,
    graphs: entries.length,
    done: tables.rows,
    failed: failedGraphs,
    skipped: request.skipped,
    interrupted,
  };
}
