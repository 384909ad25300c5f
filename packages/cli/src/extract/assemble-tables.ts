import {
  type CsvCell,
  type DatasetEntry,
  type DatasetProblem,
  encodeCsvChunks,
  encodeNpz,
} from "@cliquescape/io";
import type { GraphFailure } from "./graph-failure.js";
import { type GraphRecord, recordValues } from "./graph-record.js";

/** A row of errors.csv: a graph left out, or a manifest row that named no usable graph. */
export interface ErrorRow {
  id: string;
  file: string;
  line: number | null;
  column: number | null;
  reason: string;
}

export interface RunTables {
  /** The text of features.csv in pieces (it may exceed the longest string V8 can hold); read it once. */
  featuresCsv: Iterable<string>;
  featuresNpz: Uint8Array;
  errorsCsv: Iterable<string>;
  /** Graphs in the tables. */
  rows: number;
  errors: ErrorRow[];
}

/**
 * The run's tables, built only from per-graph records and in dataset order, so their bytes depend on the
 * data and the spec alone (not on worker count or scheduling). Entries without a record yet (an
 * interrupted run) are simply absent; failed ones go to errors.csv after the dataset's own problems.
 * Linear in the number of graphs, and with no call whose argument count grows with it.
 */
export function assembleTables(
  entries: readonly Pick<DatasetEntry, "id">[],
  records: ReadonlyMap<string, GraphRecord>,
  featureNames: readonly string[],
  labelNames: readonly string[],
  problems: readonly ErrorRow[],
): RunTables {
  const done: GraphRecord[] = [];
  const errors: ErrorRow[] = [...problems];
  for (const entry of entries) {
    const record = records.get(entry.id);
    if (!record) continue;
    if (record.ok) done.push(record);
    else errors.push(errorRow(record.id, record.failure!));
  }
  const F = featureNames.length;
  const X = new Float64Array(done.length * F);
  done.forEach((record, i) => {
    const values = recordValues(record);
    if (values.length !== F)
      throw new Error(`record of ${record.id} has ${values.length} values, expected ${F}`);
    X.set(values, i * F);
  });
  const codeOf = labelCoder(labelNames);
  const codes = done.map((record) => codeOf(record.label));
  // Whether the graph has simplices above topDim: its Euler columns are then partial sums (see docs).
  const truncated = done.map((record) => record.truncated ?? null);
  const featuresCsv = encodeCsvChunks(
    ["id", "label", "split", "truncated", ...featureNames],
    featureRows(done, truncated, X, F),
  );
  const featuresNpz = encodeNpz([
    { name: "X", dtype: "float64", shape: [done.length, F], values: X },
    { name: "y", dtype: "int64", shape: [done.length], values: codes },
    { name: "ids", dtype: "unicode", shape: [done.length], values: done.map((r) => r.id) },
    { name: "feature_names", dtype: "unicode", shape: [F], values: featureNames },
    { name: "label_names", dtype: "unicode", shape: [labelNames.length], values: labelNames },
    { name: "splits", dtype: "unicode", shape: [done.length], values: done.map((r) => r.split ?? "") },
    // 1: Euler columns are partial sums; 0: exact; −1: no count sweep was made (its families were off).
    {
      name: "truncated",
      dtype: "int64",
      shape: [done.length],
      values: truncated.map((t) => (t === null ? -1 : t ? 1 : 0)),
    },
  ]);
  const errorsCsv = encodeCsvChunks(
    ["id", "file", "line", "column", "reason"],
    errors.map((e) => [e.id, e.file, e.line, e.column, e.reason]),
  );
  return { featuresCsv, featuresNpz, errorsCsv, rows: done.length, errors };
}

/**
 * The label code of a graph: the label's position in the spec's label list, −1 for a graph without a label.
 * One lookup table for all graphs, so coding a million graphs stays linear.
 */
export function labelCoder(labelNames: readonly string[]): (label: string | null) => number {
  const codes = new Map<string, number>();
  labelNames.forEach((name, k) => {
    if (!codes.has(name)) codes.set(name, k);
  });
  return (label) => (label === null ? -1 : (codes.get(label) ?? -1));
}

// One row of features.csv at a time, as the writer asks for it.
function* featureRows(
  done: readonly GraphRecord[],
  truncated: readonly (boolean | null)[],
  X: Float64Array,
  F: number,
): Generator<CsvCell[]> {
  for (let i = 0; i < done.length; i++) {
    const record = done[i];
    const row: CsvCell[] = [
      record.id,
      record.label ?? "",
      record.split ?? "",
      truncated[i] === null ? "" : String(truncated[i]),
    ];
    for (let j = 0; j < F; j++) row.push(X[i * F + j]);
    yield row;
  }
}

export function errorRow(id: string, failure: GraphFailure): ErrorRow {
  return { id, file: failure.file, line: failure.line, column: failure.column, reason: failure.reason };
}

export function problemRow(problem: DatasetProblem, file: string): ErrorRow {
  return {
    id: problem.id ?? "",
    file,
    line: problem.line ?? null,
    column: problem.column ?? null,
    reason: problem.reason,
  };
}
