import { createHash } from "node:crypto";
import { readFileSync, renameSync, rmSync, statSync, writeFileSync } from "node:fs";
import { basename, dirname, join } from "node:path";
import type { DatasetEntry } from "@cliquescape/io";
import type { GraphOutcome } from "./graph-job.js";
import { encodeRecord, type GraphRecord } from "./graph-record.js";
import { graphPaths, type RunFolder } from "./run-folder.js";
import type { ResolvedRunSpec } from "./run-spec.js";

/**
 * Writes one graph's barcode and bundle, then its record (last: the record says the graph is complete and
 * holds the length and SHA-256 of the other two, so a damaged file is noticed and the graph redone).
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
  const digests: GraphRecord["digests"] = {};
  if (outcome.barcodeJson !== null)
    [bytes.barcode, digests.barcode] = writeRenamed(paths.barcode, outcome.barcodeJson);
  if (outcome.bundle !== null) [bytes.bundle, digests.bundle] = writeRenamed(paths.bundle, outcome.bundle);
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
    digests,
    warnings: outcome.warnings,
  };
  writeRenamed(paths.record, encodeRecord(record));
  return record;
}

/**
 * Whether the barcode and bundle a finished graph should have are there and are the very files written with
 * its record: the same length and SHA-256. A file of the right length but other content (zeros after a power
 * cut, a copy gone wrong) is not reused; neither is one from a record that holds no checksum.
 */
export function outputsIntact(folder: RunFolder, record: GraphRecord, spec: ResolvedRunSpec): boolean {
  const paths = graphPaths(folder, record.id);
  const intact = (path: string, bytes: number | undefined, sha256: string | undefined): boolean => {
    if (bytes === undefined || sha256 === undefined) return false;
    try {
      // The length first: most damage shows there, without reading the file.
      if (statSync(path).size !== bytes) return false;
      return sha256Of(readFileSync(path)) === sha256;
    } catch {
      return false;
    }
  };
  return (
    (!spec.outputs.bundles || intact(paths.bundle, record.bytes?.bundle, record.digests?.bundle)) &&
    (!spec.outputs.barcodes || intact(paths.barcode, record.bytes?.barcode, record.digests?.barcode))
  );
}

function sha256Of(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

let counter = 0;

/**
 * Atomic against interruption: the bytes go to a temporary file (named as io's writeFileAtomic names them,
 * so leftovers are cleaned the same way) that is renamed into place; a failed write removes it. Per-graph
 * files skip io's fsync, which costs more than many graphs take to compute; after a power cut a damaged
 * file shows as a length or checksum that disagrees with the record, and that graph is simply redone.
 * Returns the length and SHA-256 of the bytes written.
 */
function writeRenamed(path: string, data: string | Uint8Array): [number, string] {
  const bytes = typeof data === "string" ? Buffer.from(data, "utf8") : data;
  const temporary = join(dirname(path), `.${basename(path)}.${process.pid}.x${counter++}.tmp`);
  try {
    writeFileSync(temporary, bytes);
    renameSync(temporary, path);
  } catch (error) {
    rmSync(temporary, { force: true });
    // Name the file being written, not its temporary name.
    if (error && typeof error === "object") Object.assign(error, { path });
    throw error;
  }
  return [bytes.length, sha256Of(bytes)];
}
