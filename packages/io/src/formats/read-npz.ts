import { checkMatrixSize } from "../check-matrix-size.js";
import { InputFileError } from "../input-file-error.js";
import type { GraphsReadResult } from "../npy-graphs.js";
import { type NpyArray, type NpyHeader, npyHeaderEnd, parseNpy, parseNpyHeader } from "../parse-npy.js";
import { readFileBytes } from "../read-file-bytes.js";
import { DEFAULT_MAX_NPY_BYTES, type GraphReadOptions } from "../read-options.js";
import { arrayGraphs } from "./matrix-stack.js";
import {
  checkZipMemberSize,
  listZipMembers,
  readZipMember,
  readZipMemberPrefix,
  type ZipMemberInfo,
} from "./zip-members.js";

export interface NpzReadOptions extends GraphReadOptions {
  /** Which array of the .npz holds the graphs. Default: the only 2-D or 3-D numeric array whose dimensions are all at least 2. */
  array?: string;
}

/**
 * One array of an .npz: its name (the member without ".npy"), its header, read without inflating the
 * data, or why the header is unreadable; `load` inflates and checks the data.
 */
export interface NpzMember {
  name: string;
  header?: NpyHeader;
  error?: InputFileError;
  /** The whole array: the member inflated (at most maxBytes), its CRC-32 checked, its .npy data checked. */
  load(): NpyArray;
}

/**
 * Lists the arrays of an .npz file (numpy.savez / savez_compressed: a zip of .npy members, stored or
 * deflated) by reading only each member's .npy header, so that nothing is unpacked before the array is
 * chosen and its declared size checked. `maxBytes` bounds the file and the member to be unpacked alike.
 */
export function readNpzMembers(path: string, maxBytes = DEFAULT_MAX_NPY_BYTES): NpzMember[] {
  const bytes = readFileBytes(path, maxBytes);
  const members = listZipMembers(bytes, path).filter((m) => m.name.endsWith(".npy"));
  if (members.length === 0) {
    throw new InputFileError(path, "bad-npy", "the .npz archive holds no .npy arrays");
  }
  return members.map((member) => {
    const name = member.name.slice(0, -".npy".length);
    const inside = `${path}[${member.name}]`;
    const restated = (error: InputFileError) =>
      // Offsets inside a member are not offsets in the file; keep the element index only.
      new InputFileError(
        path,
        error.problem,
        `array "${name}": ${error.reason}`,
        error.position.element ? { element: error.position.element } : {},
      );
    const load = () => {
      try {
        checkZipMemberSize(path, member, maxBytes);
        return parseNpy(readZipMember(bytes, path, member), inside);
      } catch (error) {
        throw error instanceof InputFileError ? restated(error) : error;
      }
    };
    try {
      return { name, header: readHeader(bytes, path, member, inside), load };
    } catch (error) {
      if (!(error instanceof InputFileError)) throw error;
      return { name, error: restated(error), load };
    }
  });
}

// The member's .npy header: its first bytes, inflated no further than the header's end.
function readHeader(bytes: Uint8Array, path: string, member: ZipMemberInfo, inside: string): NpyHeader {
  const start = readZipMemberPrefix(bytes, path, member, 12);
  const end = npyHeaderEnd(start) ?? start.length;
  return parseNpyHeader(end > start.length ? readZipMemberPrefix(bytes, path, member, end) : start, inside);
}

/**
 * The array the user named, or the only 2-D/3-D numeric one; otherwise an error listing the names. Its
 * matrix size is checked against `maxCells` from the header, before the member is unpacked.
 */
export function pickNpzArray(
  members: readonly NpzMember[],
  path: string,
  wanted?: string,
  options: Pick<GraphReadOptions, "maxCells"> = {},
): NpyArray & { name: string } {
  let chosen: NpzMember | undefined;
  if (wanted !== undefined) {
    chosen = members.find((m) => m.name === wanted);
    if (!chosen) {
      const names = members.map((m) => m.name).join(", ");
      throw new InputFileError(
        path,
        "bad-header",
        `the .npz has no array "${wanted}"; its arrays are: ${names}`,
      );
    }
  } else {
    // Like MATLAB's 1×n, a (1, n) array is a row, not a matrix: candidates have every dimension ≥ 2.
    const matrices = members.filter(
      (m) =>
        m.header &&
        (m.header.shape.length === 2 || m.header.shape.length === 3) &&
        m.header.shape.every((d) => d >= 2),
    );
    // With a single array, its own error says more than "no matrix here".
    if (members.length === 1 && members[0].error) throw members[0].error;
    if (matrices.length !== 1) {
      const which =
        matrices.length === 0 ? "no 2-D or 3-D numeric array" : `${matrices.length} 2-D/3-D arrays`;
      throw new InputFileError(
        path,
        "bad-header",
        `the .npz has ${which}; name the one to read (array option); its arrays are: ${describeMembers(members)}`,
      );
    }
    chosen = matrices[0];
  }
  if (chosen.error) throw chosen.error;
  const shape = (chosen.header as NpyHeader).shape;
  if (shape.length === 2 || shape.length === 3) {
    try {
      checkMatrixSize(shape[shape.length - 1], options, path);
    } catch (error) {
      if (!(error instanceof InputFileError)) throw error;
      throw new InputFileError(path, error.problem, `array "${chosen.name}": ${error.reason}`);
    }
  }
  return { ...chosen.load(), name: chosen.name };
}

/** Reads the graphs of one array of an .npz: a matrix, or a (k, n, n) stack. */
export function readNpzFile(
  path: string,
  options: NpzReadOptions = {},
): GraphsReadResult & { array: string } {
  const array = pickNpzArray(readNpzMembers(path, options.maxBytes), path, options.array, options);
  const result = arrayGraphs(array, 0, path, options, {
    prefix: `array "${array.name}": `,
    byteOffsetsInFile: false,
  });
  return { ...result, array: array.name };
}

function describeMembers(members: readonly NpzMember[]): string {
  return members
    .map((m) =>
      m.header
        ? `${m.name} (${m.header.shape.join("×") || "scalar"} ${m.header.dtype.descr})`
        : `${m.name} (unreadable)`,
    )
    .join(", ");
}
