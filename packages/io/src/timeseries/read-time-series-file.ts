import { extname } from "node:path";
import { loadStack, STACK_EXTENSIONS } from "../dataset/stack-source.js";
import { InputFileError } from "../input-file-error.js";
import { decodeText, readFileBytes } from "../read-file-bytes.js";
import { DEFAULT_MAX_TEXT_BYTES } from "../read-options.js";
import { arrayTimeSeries } from "./array-time-series.js";
import { parseTimeSeriesText } from "./parse-time-series-text.js";
import type { TimeSeriesReadOptions, TimeSeriesReadResult } from "./time-series-read-options.js";

const TEXT_EXTENSIONS = new Set([".csv", ".tsv", ".txt"]);

/**
 * Reads one recording: text (.csv, .tsv, .txt) or a 2-D array (.npy, .npz, .mat). A 3-D array holds
 * several recordings and is refused here: open it as a dataset (a stack).
 */
export function readTimeSeriesFile(path: string, options: TimeSeriesReadOptions = {}): TimeSeriesReadResult {
  const extension = extname(path).toLowerCase();
  if (TEXT_EXTENSIONS.has(extension)) {
    const text = decodeText(readFileBytes(path, options.maxBytes ?? DEFAULT_MAX_TEXT_BYTES), path);
    const delimiter = options.delimiter ?? (extension === ".tsv" ? "\t" : undefined);
    return parseTimeSeriesText(text, path, delimiter ? { ...options, delimiter } : options);
  }
  if (STACK_EXTENSIONS.has(extension)) {
    const source = loadStack(path, options.variable, options.maxBytes);
    return arrayTimeSeries(source.array, path, options, source.place);
  }
  throw new InputFileError(
    path,
    "unknown-format",
    `cannot tell the format of a recording from the extension ${JSON.stringify(extension)}; use .csv, .tsv, .txt, .npy, .npz or .mat`,
  );
}
