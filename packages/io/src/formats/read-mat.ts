import { InputFileError } from "../input-file-error.js";
import type { GraphsReadResult } from "../npy-graphs.js";
import type { NpyArray } from "../parse-npy.js";
import { readFileBytes } from "../read-file-bytes.js";
import { DEFAULT_MAX_NPY_BYTES, type GraphReadOptions } from "../read-options.js";
import { stackAxisOf } from "./mat-types.js";
import { arrayGraphs, type StackAxis } from "./matrix-stack.js";
import { type MatVariable, parseMat } from "./parse-mat.js";

export interface MatReadOptions extends GraphReadOptions {
  /** Which variable holds the graphs. Default: the only real numeric 2-D or 3-D variable whose dimensions are all at least 2. */
  variable?: string;
}

/** A chosen matrix or stack variable, with the axis along which a 3-D one holds its graphs. */
export interface MatMatrix {
  name: string;
  array: NpyArray;
  axis: StackAxis;
  warnings: string[];
}

/**
 * Reads a MAT-file's variables (see parseMat); `maxBytes` bounds the file and the unpacked data, `maxCells`
 * each matrix of a compressed variable, checked before it is unpacked.
 */
export function readMatVariables(
  path: string,
  maxBytes = DEFAULT_MAX_NPY_BYTES,
  maxCells?: number,
): MatVariable[] {
  return parseMat(readFileBytes(path, maxBytes), path, maxBytes, maxCells);
}

/**
 * The variable the user named, or the only real numeric 2-D/3-D one. Complex, sparse, cell, struct and
 * character variables are refused with their class named.
 */
export function pickMatMatrix(variables: readonly MatVariable[], path: string, wanted?: string): MatMatrix {
  const names = variables
    .map((v) => `${v.name} (${v.dims.join("×")} ${v.complex ? "complex " : ""}${v.className})`)
    .join(", ");
  // MATLAB stores scalars and vectors as 2-D (1×1, 1×n): a matrix candidate has every dimension ≥ 2.
  const candidates = variables.filter(
    (v) =>
      (v.array || v.refused) && (v.dims.length === 2 || v.dims.length === 3) && v.dims.every((d) => d >= 2),
  );
  let chosen: MatVariable | undefined;
  if (wanted !== undefined) {
    chosen = variables.find((v) => v.name === wanted);
    if (!chosen) {
      throw new InputFileError(
        path,
        "bad-header",
        `the MAT-file has no variable "${wanted}"; its variables are: ${names || "none"}`,
      );
    }
    if (chosen.refused) throw chosen.refused;
    if (!chosen.array) {
      const what = chosen.complex ? `complex ${chosen.className}` : chosen.className;
      throw new InputFileError(
        path,
        "unsupported-dtype",
        `variable "${wanted}" is ${what}; only real numeric and logical matrices are read (use full() for sparse, real() or abs() for complex)`,
        { byteOffset: chosen.byteOffset },
      );
    }
  } else if (candidates.length === 1) {
    chosen = candidates[0];
  } else {
    const which =
      candidates.length === 0
        ? "no real numeric 2-D or 3-D variable"
        : `${candidates.length} numeric 2-D/3-D variables`;
    throw new InputFileError(
      path,
      "bad-header",
      `the MAT-file has ${which}; name the one to read (variable option); its variables are: ${names || "none"}`,
    );
  }
  if (chosen.refused) throw chosen.refused;
  const array = chosen.array as NpyArray;
  const warnings: string[] = [];
  const dims = chosen.dims;
  let axis: StackAxis = 2;
  if (dims.length === 3) {
    // MATLAB's own convention is n × n × k; numpy stacks saved by scipy arrive as k × n × n.
    axis = stackAxisOf(dims);
    if (dims[0] === dims[1] && dims[1] === dims[2]) {
      warnings.push(
        `variable "${chosen.name}" is ${dims.join("×")}: read as ${dims[2]} graphs ${chosen.name}(:,:,k)`,
      );
    }
  }
  return { name: chosen.name, array, axis, warnings };
}

/**
 * Reads the graphs of one MAT-file variable: a matrix, or a stack of matrices. Element positions in
 * messages are 0-based in MATLAB's dimension order: element (i, j, k) is MATLAB's A(i+1, j+1, k+1).
 */
export function readMatFile(
  path: string,
  options: MatReadOptions = {},
): GraphsReadResult & { variable: string } {
  const matrix = pickMatMatrix(
    readMatVariables(path, options.maxBytes, options.maxCells),
    path,
    options.variable,
  );
  const result = arrayGraphs(matrix.array, matrix.axis, path, options, {
    prefix: `variable "${matrix.name}": `,
    byteOffsetsInFile: false,
  });
  return { graphs: result.graphs, warnings: [...matrix.warnings, ...result.warnings], variable: matrix.name };
}
