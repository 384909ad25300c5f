export type { EdgeColumnNames, EdgeColumns } from "./edge-list-columns.js";
export {
  findEdgeColumns,
  looksLikeEdgeListHeader,
  SOURCE_NAMES,
  TARGET_NAMES,
  WEIGHT_NAMES,
} from "./edge-list-columns.js";
export type { NpyWriteDtype } from "./encode-npy.js";
export { encodeNpy } from "./encode-npy.js";
export { graphFeatureNames, graphFeatures } from "./graph-features.js";
export type { InputFilePosition, InputFileProblem } from "./input-file-error.js";
export { describePosition, formatPosition, InputFileError } from "./input-file-error.js";
export { networkStatisticNames, networkStatistics } from "./network-statistics.js";
export type { NpyDtype } from "./npy-dtype.js";
export { parseDescr, SUPPORTED_DTYPES } from "./npy-dtype.js";
export type { GraphsReadResult } from "./npy-graphs.js";
export { npyToGraphs } from "./npy-graphs.js";
export type { DenseMatrixTextOptions, GraphReadResult } from "./parse-dense-matrix.js";
export { parseDenseMatrixText } from "./parse-dense-matrix.js";
export type { EdgeListTextOptions } from "./parse-edge-list.js";
export { parseEdgeListText } from "./parse-edge-list.js";
export type { NpyArray } from "./parse-npy.js";
export { npyElementOffset, npyStrides, npyValues, parseNpy } from "./parse-npy.js";
export type { CellValue } from "./parse-number.js";
export { classifyCell, looksNumeric } from "./parse-number.js";
export { decodeText, readFileBytes } from "./read-file-bytes.js";
export type { GraphFileFormat, GraphFileOptions, GraphFileResult } from "./read-graph-file.js";
export { readGraphFile, readNpyFile } from "./read-graph-file.js";
export type { GraphReadOptions } from "./read-options.js";
export {
  DEFAULT_MAX_CELLS,
  DEFAULT_MAX_NPY_BYTES,
  DEFAULT_MAX_TEXT_BYTES,
  zeroIsEdge,
} from "./read-options.js";
export type { Delimiter, TextRow } from "./text-rows.js";
export { detectDelimiter, textRows } from "./text-rows.js";
export { type ToGraphologyOptions, toGraphology } from "./to-graphology.js";
export { writeNpyFile } from "./write-npy-file.js";
