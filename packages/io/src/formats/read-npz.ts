import { InputFileError } from "../input-file-error.js";
import type { GraphsReadResult } from "../npy-graphs.js";
import { type NpyArray, parseNpy } from "../parse-npy.js";
import { readFileBytes } from "../read-file-bytes.js";
import { DEFAULT_MAX_NPY_BYTES, type GraphReadOptions } from "../read-options.js";
import { arrayGraphs } from "./matrix-stack.js";
import { extractZipMembers, listZipMembers } from "./zip-members.js";

export interface NpzReadOptions extends GraphReadOptions {
  /** Which array of the .npz holds the graphs. Default: the only 2-D or 3-D numeric array whose dimensions are all at least 2. */
  array?: string;
}

/** One array of an .npz: its name (the member without ".npy") and the parsed array, or why it is unreadable. */
export interface NpzMember {
  name: string;
  array?: NpyArray;
  error?: InputFileError;
}

/**
 * Reads an .npz file (numpy.savez / savez_compressed: a zip of .npy members, stored or deflated) and
 * parses every member's header (only the `only` member, when the archive has it). `maxBytes` bounds the
 * file and the unpacked members alike.
 */
export function readNpzMembers(path: string, maxBytes = DEFAULT_MAX_NPY_BYTES, only?: string): NpzMember[] {
  const bytes = readFileBytes(path, maxBytes);
  const members = listZipMembers(bytes, path).filter((m) => m.name.endsWith(".npy"));
  if (members.length === 0) {
    throw new InputFileError(path, "bad-npy", "the .npz archive holds no .npy arrays");
  }
  // A named array is the only one unpacked, if it is there; else all are, to list them in the error.
  const target = `${only}.npy`;
  const named = only !== undefined && members.some((m) => m.name === target);
  const files = extractZipMembers(
    bytes,
    path,
    (name) => (named ? name === target : name.endsWith(".npy")),
    maxBytes,
  );
  return [...files].map(([member, data]) => {
    const name = member.slice(0, -".npy".length);
    try {
      return { name, array: parseNpy(data, `${path}[${member}]`) };
    } catch (error) {
      if (!(error instanceof InputFileError)) throw error;
      // Offsets inside a member are not offsets in the file; keep the element index only.
      const position = error.position.element ? { element: error.position.element } : {};
      return {
        name,
        error: new InputFileError(path, error.problem, `array "${name}": ${error.reason}`, position),
      };
    }
  });
}

/** The array the user named, or the only 2-D/3-D numeric one; otherwise an error listing the names. */
export function pickNpzArray(
  members: readonly NpzMember[],
  path: string,
  wanted?: string,
): NpyArray & { name: string } {
  const names = members.map((m) => m.name).join(", ");
  if (wanted !== undefined) {
    const member = members.find((m) => m.name === wanted);
    if (!member) {
      throw new InputFileError(
        path,
        "bad-header",
        `the .npz has no array "${wanted}"; its arrays are: ${names}`,
      );
    }
    if (member.error) throw member.error;
    return { ...(member.array as NpyArray), name: member.name };
  }
  // Like MATLAB's 1×n, a (1, n) array is a row, not a matrix: candidates have every dimension ≥ 2.
  const matrices = members.filter(
    (m) =>
      m.array &&
      (m.array.shape.length === 2 || m.array.shape.length === 3) &&
      m.array.shape.every((d) => d >= 2),
  );
  // With a single array, its own error says more than "no matrix here".
  if (members.length === 1 && members[0].error) throw members[0].error;
  if (matrices.length !== 1) {
    const which = matrices.length === 0 ? "no 2-D or 3-D numeric array" : `${matrices.length} 2-D/3-D arrays`;
    throw new InputFileError(
      path,
      "bad-header",
      `the .npz has ${which}; name the one to read (array option); its arrays are: ${describeMembers(members)}`,
    );
  }
  return { ...(matrices[0].array as NpyArray), name: matrices[0].name };
}

/** Reads the graphs of one array of an .npz: a matrix, or a (k, n, n) stack. */
export function readNpzFile(
  path: string,
  options: NpzReadOptions = {},
): GraphsReadResult & { array: string } {
  const array = pickNpzArray(readNpzMembers(path, options.maxBytes, options.array), path, options.array);
  const result = arrayGraphs(array, 0, path, options, {
    prefix: `array "${array.name}": `,
    byteOffsetsInFile: false,
  });
  return { ...result, array: array.name };
}

function describeMembers(members: readonly NpzMember[]): string {
  return members
    .map((m) =>
      m.array
        ? `${m.name} (${m.array.shape.join("×") || "scalar"} ${m.array.dtype.descr})`
        : `${m.name} (unreadable)`,
    )
    .join(", ");
}
