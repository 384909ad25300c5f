import { extname } from "node:path";
import { looksLikeEdgeListHeader } from "./edge-list-columns.js";
import { type MatReadOptions, readMatFile } from "./formats/read-mat.js";
import { type NpzReadOptions, readNpzFile } from "./formats/read-npz.js";
import { readXmlGraphFile, type XmlGraphReadOptions } from "./formats/read-xml-graph.js";
import { InputFileError } from "./input-file-error.js";
import { type GraphsReadResult, npyToGraphs } from "./npy-graphs.js";
import { type DenseMatrixTextOptions, parseDenseMatrixText } from "./parse-dense-matrix.js";
import { type EdgeListTextOptions, parseEdgeListText } from "./parse-edge-list.js";
import { type NpyArray, parseNpy } from "./parse-npy.js";
import { decodeText, readFileBytes } from "./read-file-bytes.js";
import { DEFAULT_MAX_NPY_BYTES, DEFAULT_MAX_TEXT_BYTES } from "./read-options.js";
import { detectDelimiter, textRows } from "./text-rows.js";

/** The kinds of file `readGraphFile` reads. */
export type GraphFileFormat = "dense-matrix" | "edge-list" | "npy" | "npz" | "mat" | "graphml" | "gexf";

/** Options for `readGraphFile`: those of every reader, plus the format when the extension does not settle it. */
export interface GraphFileOptions
  extends DenseMatrixTextOptions,
    Omit<EdgeListTextOptions, "labels" | "maxCells">,
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

const TEXT_EXTENSIONS = new Set([".csv", ".tsv", ".txt"]);
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
  const extension = extname(path).toLowerCase();
  const format =
    options.format ?? BINARY_FORMATS[extension] ?? (TEXT_EXTENSIONS.has(extension) ? "text" : undefined);
  if (format === undefined) {
    throw new InputFileError(
      path,
      "unknown-format",
      `cannot tell the format from the extension ${JSON.stringify(extension)}; use .csv, .tsv, .txt, .npy, .npz, .mat, .graphml or .gexf, or set the format option`,
    );
  }
  if (format === "npy") {
    return { format, ...npyToGraphs(readNpyFile(path, options.maxBytes), path, options) };
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
  const text = decodeText(readFileBytes(path, options.maxBytes ?? DEFAULT_MAX_TEXT_BYTES), path);
  const delimiter = options.delimiter ?? (extension === ".tsv" ? "\t" : detectDelimiter(text));
  const textFormat = format === "text" ? guessTextFormat(text, path, delimiter, options) : format;
  const withDelimiter = { ...options, delimiter };
  // For an edge list, `labels` is the node list: the one way to say which names exist and in what order.
  const { graph, warnings } =
    textFormat === "edge-list"
      ? parseEdgeListText(text, path, { ...withDelimiter, nodes: options.nodes ?? options.labels })
      : parseDenseMatrixText(text, path, withDelimiter);
  return { format: textFormat, graphs: [graph], warnings };
}

/** Reads and checks a .npy file's header without copying its data. */
export function readNpyFile(path: string, maxBytes = DEFAULT_MAX_NPY_BYTES): NpyArray {
  return parseNpy(readFileBytes(path, maxBytes), path);
}

function guessTextFormat(
  text: string,
  file: string,
  delimiter: DenseMatrixTextOptions["delimiter"] & {},
  options: GraphFileOptions,
): GraphFileFormat {
  // Saying where the labels are only makes sense for a matrix.
  if (options.labelRow !== undefined || options.labelColumn !== undefined) return "dense-matrix";
  const first = textRows(text, delimiter, file).next();
  return !first.done && looksLikeEdgeListHeader(first.value.cells, options) ? "edge-list" : "dense-matrix";
}
