import { decodeText } from "./decode-text.js";
import { looksLikeEdgeListHeader } from "./edge-list-columns.js";
import { InputFileError } from "./input-file-error.js";
import { type GraphsReadResult, npyToGraphs } from "./npy-graphs.js";
import { type DenseMatrixTextOptions, parseDenseMatrixText } from "./parse-dense-matrix.js";
import { type EdgeListTextOptions, parseEdgeListText } from "./parse-edge-list.js";
import { parseNpy } from "./parse-npy.js";
import { checkByteSize, DEFAULT_MAX_NPY_BYTES, DEFAULT_MAX_TEXT_BYTES } from "./read-options.js";
import { detectDelimiter, textRows } from "./text-rows.js";

/** The formats whose parsers need nothing but the bytes: they run in Node, workers and browsers alike. */
export type ByteGraphFormat = "dense-matrix" | "edge-list" | "npy";

/** Options of the byte parsers: those of the text and .npy readers, plus the format when the name does not settle it. */
export interface GraphBytesOptions
  extends DenseMatrixTextOptions,
    Omit<EdgeListTextOptions, "labels" | "maxCells"> {
  format?: ByteGraphFormat;
}

export interface GraphBytesResult extends GraphsReadResult {
  format: ByteGraphFormat;
}

/** Extensions of the text formats (a dense matrix or an edge list, told apart by the first line). */
export const TEXT_EXTENSIONS = new Set([".csv", ".tsv", ".txt"]);

/** ".csv" for "data/s01.CSV": the extension, lower-cased, without a path library (this file runs in browsers). */
export function fileExtension(name: string): string {
  const base = name.slice(Math.max(name.lastIndexOf("/"), name.lastIndexOf("\\")) + 1);
  const dot = base.lastIndexOf(".");
  return dot <= 0 ? "" : base.slice(dot).toLowerCase();
}

/**
 * Reads the graphs in a file's bytes — a dense matrix or an edge list in text, or a .npy array — choosing
 * the parser as `readGraphFile` does. `file` names the file in messages and gives the extension. No file
 * system: a page hands it the bytes of a dropped file, `readGraphFile` the bytes it read from disk.
 */
export function parseGraphBytes(
  bytes: Uint8Array,
  file: string,
  options: GraphBytesOptions = {},
): GraphBytesResult {
  const extension = fileExtension(file);
  const format =
    options.format ?? (extension === ".npy" ? "npy" : TEXT_EXTENSIONS.has(extension) ? "text" : undefined);
  if (format === undefined) {
    throw new InputFileError(
      file,
      "unknown-format",
      `cannot read ${JSON.stringify(extension || file)} files here; use .csv, .tsv, .txt (a matrix or an edge list) or .npy`,
    );
  }
  const limit = options.maxBytes ?? (format === "npy" ? DEFAULT_MAX_NPY_BYTES : DEFAULT_MAX_TEXT_BYTES);
  checkByteSize(file, bytes.byteLength, limit);
  if (format === "npy") return { format, ...npyToGraphs(parseNpy(bytes, file), file, options) };
  const text = decodeText(bytes, file);
  const delimiter = options.delimiter ?? (extension === ".tsv" ? "\t" : detectDelimiter(text));
  const textFormat = format === "text" ? guessTextFormat(text, file, delimiter, options) : format;
  const withDelimiter = { ...options, delimiter };
  // For an edge list, `labels` is the node list: the one way to say which names exist and in what order.
  const { graph, warnings } =
    textFormat === "edge-list"
      ? parseEdgeListText(text, file, { ...withDelimiter, nodes: options.nodes ?? options.labels })
      : parseDenseMatrixText(text, file, withDelimiter);
  return { format: textFormat, graphs: [graph], warnings };
}

function guessTextFormat(
  text: string,
  file: string,
  delimiter: DenseMatrixTextOptions["delimiter"] & {},
  options: GraphBytesOptions,
): ByteGraphFormat {
  // Saying where the labels are only makes sense for a matrix.
  if (options.labelRow !== undefined || options.labelColumn !== undefined) return "dense-matrix";
  const first = textRows(text, delimiter, file).next();
  return !first.done && looksLikeEdgeListHeader(first.value.cells, options) ? "edge-list" : "dense-matrix";
}
