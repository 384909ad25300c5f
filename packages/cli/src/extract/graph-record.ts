import { readFileSync } from "node:fs";
import type { GraphFailure } from "./graph-failure.js";

/**
 * What the run keeps of one graph: enough to rebuild its table row without recomputing, and to tell
 * whether it is still valid (same input bytes, same settings). Written last, after the graph's barcode and
 * bundle, so its presence means the graph is complete.
 */
export interface GraphRecord {
  id: string;
  file: string;
  sha256: string;
  /** Fingerprint of the settings it was computed under (see settingsFingerprint). */
  settings: string;
  label: string | null;
  split: string | null;
  ok: boolean;
  /** Feature values in column order; NaN is stored as null (JSON has no NaN). */
  values?: (number | null)[];
  thresholds?: number[];
  nodes?: number;
  edges?: number;
  directed?: boolean;
  truncated?: boolean | null;
  /** Sizes of the barcode and bundle files written with this record. */
  bytes?: { barcode?: number; bundle?: number };
  /** SHA-256 (hex) of the barcode and bundle files written with this record: resuming reuses only these. */
  digests?: { barcode?: string; bundle?: string };
  failure?: GraphFailure;
  warnings: string[];
}

export function encodeRecord(record: GraphRecord): string {
  return `${JSON.stringify(record)}\n`;
}

/** The record at `path`, or null when there is none or it cannot be read (it is then simply redone). */
export function readRecord(path: string): GraphRecord | null {
  // One read, no existence check first: a resumed run of a million graphs asks a million times.
  try {
    return JSON.parse(readFileSync(path, "utf8")) as GraphRecord;
  } catch {
    return null;
  }
}

export function recordValues(record: GraphRecord): number[] {
  return (record.values ?? []).map((v) => (v === null ? Number.NaN : v));
}
