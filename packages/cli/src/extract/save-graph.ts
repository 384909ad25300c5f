import { renameSync, statSync, writeFileSync } from "node:fs";
import { basename, dirname, join } from "node:path";
import type { DatasetEntry } from "@cliquescape/io";
import type { GraphOutcome } from "./graph-job.js";
import { encodeRecord, type GraphRecord } from "./graph-record.js";
import { graphPaths, type RunFolder } from "./run-folder.js";
import type { ResolvedRunSpec } from "./run-spec.js";

/**
 * Writes one graph's barcode and bundle, then its record (last: the record says the graph is complete and
 * holds the byte sizes of the other two, so a damaged file is noticed and the graph redone).
 */
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
    writeRenamed(paths.record, encodeRecord(record));
    return record;
  }
  const bytes: GraphRecord["bytes"] = {};
  if (outcome.barcodeJson !== null) bytes.barcode = writeRenamed(paths.barcode, outcome.barcodeJson);
  if (outcome.bundle !== null) bytes.bundle = writeRenamed(paths.bundle, outcome.bundle);
  const record: GraphRecord = {
    ...base,
    ok: true,
    values: Array.from(outcome.values, (v) => (Number.isNaN(v) ? null : v)),
    thresholds: outcome.thresholds,
    nodes: outcome.nodes,
    edges: outcome.edges,
    directed: outcome.directed,
    truncated: outcome.truncated,
    bytes,
    warnings: outcome.warnings,
  };
  writeRenamed(paths.record, encodeRecord(record));
  return record;
}

/** Whether the barcode and bundle a finished graph should have are there, whole (their recorded sizes). */
export function outputsIntact(folder: RunFolder, record: GraphRecord, spec: ResolvedRunSpec): boolean {
  const paths = graphPaths(folder, record.id);
  const size = (path: string) => {
    try {
      return statSync(path).size;
    } catch {
      return -1;
    }
  };
  return (
    (!spec.outputs.bundles || size(paths.bundle) === record.bytes?.bundle) &&
    (!spec.outputs.barcodes || size(paths.barcode) === record.bytes?.barcode)
  );
}

let counter = 0;

/**
 * Atomic against interruption: the bytes go to a temporary file (named as io's writeFileAtomic names them,
 * so leftovers are cleaned the same way) that is renamed into place. Per-graph files skip io's fsync,
 * which costs more than many graphs take to compute; after a power cut a damaged file shows as a size
 * that disagrees with the record, and that graph is simply redone. Returns the bytes written.
 */
function writeRenamed(path: string, data: string | Uint8Array): number {
  const bytes = typeof data === "string" ? Buffer.from(data, "utf8") : data;
  const temporary = join(dirname(path), `.${basename(path)}.${process.pid}.x${counter++}.tmp`);
  writeFileSync(temporary, bytes);
  renameSync(temporary, path);
  return bytes.length;
}
