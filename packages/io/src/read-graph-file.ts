import { type MatReadOptions, readMatFile } from "./formats/read-mat.js";
import { type NpzReadOptions, readNpzFile } from "./formats/read-npz.js";
import { readXmlGraphFile, type XmlGraphReadOptions } from "./formats/read-xml-graph.js";
import { InputFileError } from "./input-file-error.js";
import type { GraphsReadResult } from "./npy-graphs.js";
import {
  fileExtension,
  type GraphBytesOptions,
  parseGraphBytes,
  TEXT_EXTENSIONS,
} from "./parse-graph-bytes.js";
import { type NpyArray, parseNpy } from "./parse-npy.js";
import { readFileBytes } from "./read-file-bytes.js";
import { DEFAULT_MAX_NPY_BYTES, DEFAULT_MAX_TEXT_BYTES } from "./read-options.js";

/** The kinds of file `readGraphFile` reads. */
export type GraphFileFormat = "dense-matrix" | "edge-list" | "npy" | "npz" | "mat" | "graphml" | "gexf";

/** Options for `readGraphFile`: those of every reader, plus the format when the extension does not settle it. */
export interface GraphFileOptions
  extends Omit<GraphBytesOptions, "format">,
    Pick<NpzReadOptions, "array">,
    Pick<MatReadOptions, "variable">,
    Pick<XmlGraphReadOptions, "weightAttribute"> {
  /**
   * Default: .npy is NumPy; .csv, .tsv and .txt are an edge list when the first data line is a header naming
   * a source and a target column (and neither labelRow nor labelColumn is set), else a dense matrix.
   */
  format?: GraphFileFormat;
}

export interface GraphFileResult extends GraphsReadResult {
  format: GraphFileFormat;
}

// Container and graph formats told by their extension alone.
const BINARY_FORMATS: Partial<Record<string, GraphFileFormat>> = {
  ".npy": "npy",
  ".npz": "npz",
  ".mat": "mat",
  ".graphml": "graphml",
  ".gexf": "gexf",
};

/** Reads a file of one graph (matrix or edge list) or several (a 3-D .npy stack), choosing the reader. */
export function readGraphFile(path: string, options: GraphFileOptions = {}): GraphFileResult {
  const extension = fileExtension(path);
  const format =
    options.format ?? BINARY_FORMATS[extension] ?? (TEXT_EXTENSIONS.has(extension) ? "text" : undefined);
  if (format === undefined) {
    throw new InputFileError(
      path,
      "unknown-format",
      `cannot tell the format from the extension ${JSON.stringify(extension)}; use .csv, .tsv, .txt, .npy, .npz, .mat, .graphml or .gexf, or set the format option`,
    );
  }
  if (format === "npz") {
    const { graphs, warnings } = readNpzFile(path, options);
    return { format, graphs, warnings };
  }
  if (format === "mat") {
    const { graphs, warnings } = readMatFile(path, options);
    return { format, graphs, warnings };
  }
  if (format === "graphml" || format === "gexf")
    return { format, ...readXmlGraphFile(path, format, options) };
  // Text and .npy: read the bytes here, parse them with the same code a browser runs.
  const maxBytes = options.maxBytes ?? (format === "npy" ? DEFAULT_MAX_NPY_BYTES : DEFAULT_MAX_TEXT_BYTES);
  return parseGraphBytes(readFileBytes(path, maxBytes), path, {
    ...options,
    format: format === "text" ? undefined : format,
    maxBytes,
  });
}

/** Reads and checks a .npy file's header without copying its data. */
export function readNpyFile(path: string, maxBytes = DEFAULT_MAX_NPY_BYTES): NpyArray {
  return parseNpy(readFileBytes(path, maxBytes), path);
}
