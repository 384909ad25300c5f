/** What went wrong with an input file, as a stable code for programs (the message is for people). */
export type InputFileProblem =
  | "unreadable"
  | "too-large"
  | "empty-file"
  | "unknown-format"
  | "not-a-number"
  | "not-finite"
  | "ragged-row"
  | "not-square"
  | "bad-labels"
  | "bad-header"
  | "bad-quoting"
  | "unknown-node"
  | "duplicate-edge"
  | "asymmetric"
  | "negative-weight"
  | "bad-npy"
  | "unsupported-dtype"
  | "truncated"
  | "bad-checksum"
  // Time series (recordings read to compute connectivity):
  | "bad-shape"
  | "channel-count"
  | "constant-channel"
  | "too-few-points"
  | "too-few-channels"
  | "not-spike-count"
  | "perfect-correlation"
  | "singular-covariance";

/**
 * Where in the file. Text tables use 1-based `line` and `column` (column = cell number on that line);
 * binary files use `byteOffset` (0-based) and, for array elements, the element's index tuple.
 */
export interface InputFilePosition {
  line?: number;
  column?: number;
  byteOffset?: number;
  element?: readonly number[];
}

/** A problem in one input file, stated with its file name and position so the user can go and fix it. */
export class InputFileError extends Error {
  readonly file: string;
  readonly problem: InputFileProblem;
  readonly reason: string;
  readonly position: InputFilePosition;

  /** `cause` keeps the underlying error (a core GraphInputError, a file-system error) for debugging. */
  constructor(
    file: string,
    problem: InputFileProblem,
    reason: string,
    position: InputFilePosition = {},
    options?: { cause?: unknown },
  ) {
    super(`${file}${formatPosition(position)}: ${reason}`, options);
    this.name = "InputFileError";
    this.file = file;
    this.problem = problem;
    this.reason = reason;
    this.position = position;
  }

  get line(): number | undefined {
    return this.position.line;
  }

  get column(): number | undefined {
    return this.position.column;
  }
}

/** ":4:7" for text, ": element (0, 2, 1) at byte 200" for binary; the compiler-style form editors jump to. */
export function formatPosition(p: InputFilePosition): string {
  if (p.line !== undefined) return p.column === undefined ? `:${p.line}` : `:${p.line}:${p.column}`;
  const parts: string[] = [];
  if (p.element !== undefined) parts.push(`element (${p.element.join(", ")})`);
  if (p.byteOffset !== undefined) parts.push(`${parts.length > 0 ? "at " : ""}byte ${p.byteOffset}`);
  return parts.length > 0 ? `: ${parts.join(" ")}` : "";
}

/** "line 4, column 7": the same position written out, for naming a second cell inside a reason. */
export function describePosition(p: InputFilePosition): string {
  if (p.line !== undefined)
    return p.column === undefined ? `line ${p.line}` : `line ${p.line}, column ${p.column}`;
  return formatPosition(p).slice(2);
}
