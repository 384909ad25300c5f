import { existsSync } from "node:fs";
import { type DatasetEntry, writeFileAtomic } from "@cliquescape/io";
import type { GraphOutcome } from "./graph-job.js";
import { encodeRecord, type GraphRecord } from "./graph-record.js";
import { graphPaths, type RunFolder } from "./run-folder.js";
import type { ResolvedRunSpec } from "./run-spec.js";

/** Writes one graph's barcode and bundle, then its record (last: the record says the graph is complete). */
export function saveGraph(
  folder: RunFolder,
  entry: DatasetEntry,
  outcome: GraphOutcome,
  sha256: string,
  settings: string,
  relativeFile: (file: string) => string,
): GraphRecord {
  const paths = graphPaths(folder, entry.id);
  const base = {
    id: entry.id,
    file: relativeFile(entry.file),
    sha256,
    settings,
    label: entry.label,
    split: entry.split,
  };
  if (!outcome.ok) {
    const failure = { ...outcome.failure, file: relativeFile(outcome.failure.file) };
    const record: GraphRecord = { ...base, ok: false, failure, warnings: outcome.warnings };
    writeFileAtomic(paths.record, encodeRecord(record));
    return record;
  }
  if (outcome.barcodeJson !== null) writeFileAtomic(paths.barcode, outcome.barcodeJson);
  if (outcome.bundle !== null) writeFileAtomic(paths.bundle, outcome.bundle);
  const record: GraphRecord = {
    ...base,
    ok: true,
    values: Array.from(outcome.values, (v) => (Number.isNaN(v) ? null : v)),
    thresholds: outcome.thresholds,
    nodes: outcome.nodes,
    edges: outcome.edges,
    directed: outcome.directed,
    truncated: outcome.truncated,
    warnings: outcome.warnings,
  };
  writeFileAtomic(paths.record, encodeRecord(record));
  return record;
}

/** Whether the per-graph files a finished graph should have are all there. */
export function outputsExist(folder: RunFolder, id: string, spec: ResolvedRunSpec): boolean {
  const paths = graphPaths(folder, id);
  return (
    (!spec.outputs.bundles || existsSync(paths.bundle)) &&
    (!spec.outputs.barcodes || existsSync(paths.barcode))
  );
}
