// The part of @cliquescape/io that needs no Node API: parsers from strings and bytes, the graph JSON form,
// and the error type. Pages and web workers import "@cliquescape/io/browser"; browser.test.ts keeps it clean.
export type { NodeCoordinates } from "./dataset/read-coordinates.js";
export { decodeText } from "./decode-text.js";
export type { GraphJson } from "./graph-json.js";
export { graphFromJson, graphToJson } from "./graph-json.js";
export type { InputFilePosition, InputFileProblem } from "./input-file-error.js";
export { describePosition, formatPosition, InputFileError } from "./input-file-error.js";
export type { GraphsReadResult } from "./npy-graphs.js";
export { npyToGraphs } from "./npy-graphs.js";
export type { DenseMatrixTextOptions, GraphReadResult } from "./parse-dense-matrix.js";
export { parseDenseMatrixText } from "./parse-dense-matrix.js";
export type { EdgeListTextOptions } from "./parse-edge-list.js";
export { parseEdgeListText } from "./parse-edge-list.js";
export type { ByteGraphFormat, GraphBytesOptions, GraphBytesResult } from "./parse-graph-bytes.js";
export { fileExtension, parseGraphBytes } from "./parse-graph-bytes.js";
export type { NpyArray } from "./parse-npy.js";
export { parseNpy } from "./parse-npy.js";
export type { GraphReadOptions } from "./read-options.js";
export type { Delimiter, TextRow } from "./text-rows.js";
export { detectDelimiter, textRows } from "./text-rows.js";
export type { CsvCell } from "./write/encode-csv.js";
export { encodeCsv } from "./write/encode-csv.js";
