import type { StackAxis } from "../formats/matrix-stack.js";

/** One graph of a dataset: where it is, what it is called and what is known about it. */
export interface DatasetEntry {
  id: string;
  /** Absolute path of the graph file (for a stack, the stack file). */
  file: string;
  label: string | null;
  split: string | null;
  /** Columns of the manifest that have no meaning here, kept by name. */
  metadata: Record<string, string>;
  /** Set when the manifest says; otherwise the read options decide. */
  directed?: boolean;
  /** For a stack: which graph of the file (0-based). */
  slice?: number;
  /** For .npz and .mat files: which array or variable holds the graphs. */
  variable?: string;
  /** Absolute path of a node-coordinates CSV. */
  coordinatesFile?: string;
  /** Where the entry comes from (the manifest and its line), for messages. */
  declaredAt: { file: string; line?: number };
}

/** A dataset entry that could not be used, and why; the other entries are not affected. */
export interface DatasetProblem {
  id: string | null;
  /** The file that declares the entry (the manifest, labels file or folder). */
  file: string;
  line?: number;
  column?: number;
  reason: string;
}

export interface Dataset {
  /** The folder, manifest or stack file the dataset was opened from, absolute. */
  root: string;
  /** "file": a single recording file read as a dataset of one (time series only). */
  kind: "folder" | "manifest" | "stack" | "file";
  entries: DatasetEntry[];
  problems: DatasetProblem[];
}

export interface OpenDatasetOptions {
  /**
   * For a stack: labels, one per line in slice order, or a table with a header naming an id column (`id`,
   * `participant_id`, `subject_id`, `subject`) and a label column: the stack's own ids, or the user's ids
   * naming the slices in order (then they become the graphs' ids).
   */
  labelsFile?: string;
  /** The labels table's column of labels. Default `label`. */
  labelsColumn?: string;
  /** A coordinates CSV (node,x,y[,z]) for every graph that has none of its own. */
  coordinatesFile?: string;
  /** For a .npz or .mat stack: the array or variable to use. Default: the only 2-D/3-D numeric one. */
  variable?: string;
  /** For a stack: refuse a file larger than this many bytes (default as for readGraphFile). */
  maxBytes?: number;
  /** For a 3-D stack: the axis that counts the entries, when the reader of matrices would guess wrong. */
  stackAxis?: StackAxis;
}

/** "file:12:3: reason" — a problem in the form editors and compilers use. */
export function formatDatasetProblem(problem: DatasetProblem): string {
  const where =
    problem.line === undefined
      ? ""
      : problem.column === undefined
        ? `:${problem.line}`
        : `:${problem.line}:${problem.column}`;
  return `${problem.file}${where}: ${problem.id === null ? "" : `${problem.id}: `}${problem.reason}`;
}
