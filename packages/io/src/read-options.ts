import type { NegativePolicy, SymmetrizePolicy, WeightSemantics } from "@cliquescape/core";
import { InputFileError } from "./input-file-error.js";

/** Options every reader understands. */
export interface GraphReadOptions {
  /** Read edges as arcs. Default false: undirected. */
  directed?: boolean;
  /**
   * What the weights mean. Default "similarity" (correlations, streamline counts…). It decides what a
   * zero is: for similarity-like weights 0 means "no edge"; for distance-like weights 0 is an edge of
   * weight 0 (two nodes at distance 0 are as close as can be).
   */
  semantics?: WeightSemantics;
  /** Override the zero rule: true keeps 0 as an edge, false drops it, whatever the semantics. */
  zeroIsEdge?: boolean;
  /**
   * Read NaN weights as "no edge" (default true: numpy's corrcoef gives NaN rows for constant signals, and
   * the count is reported as a warning); false refuses them. Infinity is always refused.
   */
  nanIsNoEdge?: boolean;
  /** Undirected only: how to merge a_ij and a_ji when they differ. Default "error". */
  symmetrize?: SymmetrizePolicy;
  /**
   * Undirected matrices: a_ij and a_ji within this relative difference are one weight (their mean).
   * Default 1e-9 (see DEFAULT_SYMMETRY_TOLERANCE in core).
   */
  symmetryTolerance?: number;
  /**
   * Negative weights. Default by semantics: "drop" for similarity-like weights (a negative similarity is
   * no edge, as 0 is; the count is reported as a warning), "error" for distance-like ones.
   */
  negative?: NegativePolicy;
  /** Node names when the file carries none (a label row/column or node names in an edge list win). */
  labels?: readonly string[];
  /** Refuse files larger than this many bytes before reading them. Defaults: text 256 MiB, .npy 2 GiB. */
  maxBytes?: number;
  /**
   * Refuse matrices with more than this many cells (n·n) before allocating them. Default 2^26
   * (an 8192 × 8192 matrix, 512 MiB as float64).
   */
  maxCells?: number;
}

export const DEFAULT_MAX_TEXT_BYTES = 256 * 2 ** 20;
export const DEFAULT_MAX_NPY_BYTES = 2 * 2 ** 30;
export const DEFAULT_MAX_CELLS = 2 ** 26;

/** Whether a weight of exactly 0 is an edge under these options. */
export function zeroIsEdge(options: GraphReadOptions): boolean {
  return options.zeroIsEdge ?? (options.semantics ?? "similarity") === "distance";
}

/** The negative-weight policy under these options (see `negative`). */
export function negativePolicy(options: GraphReadOptions): NegativePolicy {
  return options.negative ?? ((options.semantics ?? "similarity") === "similarity" ? "drop" : "error");
}

/** Whether NaN weights are read as "no edge" under these options. */
export function nanIsNoEdge(options: GraphReadOptions): boolean {
  return options.nanIsNoEdge ?? true;
}

/** "1.5 MiB": sizes in messages people read. */
export function formatBytes(bytes: number): string {
  const units = ["bytes", "KiB", "MiB", "GiB", "TiB"];
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  return unit === 0 ? `${bytes} bytes` : `${Number(value.toFixed(1))} ${units[unit]}`;
}

/** Refuses a file larger than the limit, before it is read or parsed, with a message that says how to proceed. */
export function checkByteSize(file: string, size: number, maxBytes: number): void {
  if (size > maxBytes) {
    throw new InputFileError(
      file,
      "too-large",
      `file is ${formatBytes(size)}, more than the limit of ${formatBytes(maxBytes)}; raise maxBytes if you have the memory`,
    );
  }
}
