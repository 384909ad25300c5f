import { statSync } from "node:fs";
import { extname } from "node:path";
import type { ArrayPlace, StackAxis } from "../formats/matrix-stack.js";
import { pickMatMatrix, readMatVariables } from "../formats/read-mat.js";
import { pickNpzArray, readNpzMembers } from "../formats/read-npz.js";
import { InputFileError } from "../input-file-error.js";
import type { NpyArray } from "../parse-npy.js";
import { readNpyFile } from "../read-graph-file.js";

/** A matrix or stack of matrices loaded from a .npy, .npz or .mat file, ready to be sliced. */
export interface StackSource {
  array: NpyArray;
  axis: StackAxis;
  /** The array or variable name inside a .npz or .mat file. */
  variable?: string;
  place: ArrayPlace;
  warnings: string[];
}

export const STACK_EXTENSIONS: ReadonlySet<string> = new Set([".npy", ".npz", ".mat"]);

// The last stack read stays in memory: a dataset reads its slices one after another, and inflating a
// compressed stack once per slice would be quadratic.
let cached: { key: string; source: StackSource } | undefined;

/** Loads a stack file (cached while it is unchanged on disk). */
export function loadStack(file: string, variable?: string, maxBytes?: number): StackSource {
  let stat: ReturnType<typeof statSync>;
  try {
    stat = statSync(file);
  } catch (error) {
    throw new InputFileError(file, "unreadable", `cannot read file: ${(error as Error).message}`);
  }
  const key = JSON.stringify([file, variable ?? null, maxBytes ?? null, stat.size, stat.mtimeMs]);
  if (cached?.key === key) return cached.source;
  const source = readStack(file, variable, maxBytes);
  cached = { key, source };
  return source;
}

function readStack(file: string, variable: string | undefined, maxBytes: number | undefined): StackSource {
  const extension = extname(file).toLowerCase();
  if (extension === ".npy") {
    return {
      array: readNpyFile(file, maxBytes),
      axis: 0,
      place: { prefix: "", byteOffsetsInFile: true },
      warnings: [],
    };
  }
  if (extension === ".npz") {
    const array = pickNpzArray(readNpzMembers(file, maxBytes), file, variable);
    const place = { prefix: `array "${array.name}": `, byteOffsetsInFile: false };
    return { array, axis: 0, variable: array.name, place, warnings: [] };
  }
  if (extension === ".mat") {
    const matrix = pickMatMatrix(readMatVariables(file, maxBytes), file, variable);
    const place = { prefix: `variable "${matrix.name}": `, byteOffsetsInFile: false };
    return {
      array: matrix.array,
      axis: matrix.axis,
      variable: matrix.name,
      place,
      warnings: matrix.warnings,
    };
  }
  throw new InputFileError(
    file,
    "unknown-format",
    `a stack is a .npy, .npz or .mat file, not ${JSON.stringify(extension)}`,
  );
}
