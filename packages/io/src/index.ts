export type {
  Dataset,
  DatasetEntry,
  DatasetProblem,
  OpenDatasetOptions,
} from "./dataset/dataset-types.js";
export { formatDatasetProblem } from "./dataset/dataset-types.js";
export { findManifests } from "./dataset/find-manifests.js";
export { GRAPH_FILE_EXTENSIONS, isGraphFileName } from "./dataset/graph-file-extensions.js";
export { hashFile } from "./dataset/hash-file.js";
export { openDataset } from "./dataset/open-dataset.js";
export type { NodeCoordinates } from "./dataset/read-coordinates.js";
export { readCoordinates } from "./dataset/read-coordinates.js";
export type { DatasetGraph } from "./dataset/read-dataset-graph.js";
export { readDatasetGraph } from "./dataset/read-dataset-graph.js";
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
export type { StackAxis } from "./formats/matrix-stack.js";
export type { MatVariable } from "./formats/parse-mat.js";
export { parseMat } from "./formats/parse-mat.js";
export type { MatMatrix, MatReadOptions } from "./formats/read-mat.js";
export { pickMatMatrix, readMatFile, readMatVariables } from "./formats/read-mat.js";
export type { NpzMember, NpzReadOptions } from "./formats/read-npz.js";
export { pickNpzArray, readNpzFile, readNpzMembers } from "./formats/read-npz.js";
export type { XmlGraphFormat, XmlGraphReadOptions } from "./formats/read-xml-graph.js";
export { readXmlGraphFile } from "./formats/read-xml-graph.js";
export type { ZipMemberInfo } from "./formats/zip-members.js";
export {
  checkZipMemberSize,
  listZipMembers,
  readZipMember,
  readZipMemberPrefix,
} from "./formats/zip-members.js";
export { graphFeatureNames, graphFeatures } from "./graph-features.js";
export type { GraphJson } from "./graph-json.js";
export { graphFromJson, graphToJson } from "./graph-json.js";
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
export type { ByteGraphFormat, GraphBytesOptions, GraphBytesResult } from "./parse-graph-bytes.js";
export { fileExtension, parseGraphBytes } from "./parse-graph-bytes.js";
export type { NpyArray, NpyHeader } from "./parse-npy.js";
export {
  npyElementOffset,
  npyHeaderEnd,
  npyStrides,
  npyValues,
  parseNpy,
  parseNpyHeader,
} from "./parse-npy.js";
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
  nanIsNoEdge,
  negativePolicy,
  zeroIsEdge,
} from "./read-options.js";
export type { Delimiter, TextRow } from "./text-rows.js";
export { detectDelimiter, textRows } from "./text-rows.js";
export { arrayTimeSeries } from "./timeseries/array-time-series.js";
export { connectivityGraph } from "./timeseries/connectivity-graph.js";
export { openTimeSeriesDataset } from "./timeseries/open-time-series-dataset.js";
export { parseTimeSeriesText } from "./timeseries/parse-time-series-text.js";
export { type DatasetConnectivity, readDatasetConnectivity } from "./timeseries/read-dataset-connectivity.js";
export { readDatasetTimeSeries } from "./timeseries/read-dataset-time-series.js";
export { readTimeSeriesFile } from "./timeseries/read-time-series-file.js";
export { subjectAxis } from "./timeseries/subject-axis.js";
export type { TimeSeriesReadOptions, TimeSeriesReadResult } from "./timeseries/time-series-read-options.js";
export { type ToGraphologyOptions, toGraphology } from "./to-graphology.js";
export type { CsvCell } from "./write/encode-csv.js";
export { encodeCell, encodeCsv, encodeCsvChunks } from "./write/encode-csv.js";
export { encodeNpyBigInt64, encodeNpyStrings } from "./write/encode-npy-extra.js";
export type { NpzArray, NpzEncodeOptions } from "./write/encode-npz.js";
export { encodeNpz } from "./write/encode-npz.js";
export { npyHeader } from "./write/npy-header.js";
export { createNpyStack, type NpyStack } from "./write/npy-stack.js";
export { type StagedFile, stageFile, writeFileAtomic } from "./write/write-file-atomic.js";
export { writeNpyFile } from "./write-npy-file.js";
