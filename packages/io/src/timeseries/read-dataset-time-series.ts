import type { DatasetEntry } from "../dataset/dataset-types.js";
import { loadStack } from "../dataset/stack-source.js";
import { arrayTimeSeries } from "./array-time-series.js";
import { readTimeSeriesFile } from "./read-time-series-file.js";
import { subjectAxis } from "./subject-axis.js";
import type { TimeSeriesReadOptions, TimeSeriesReadResult } from "./time-series-read-options.js";

/** Reads the recording of one dataset entry: a file of one recording, or one recording of a stack. */
export function readDatasetTimeSeries(
  entry: DatasetEntry,
  options: TimeSeriesReadOptions,
): TimeSeriesReadResult {
  const read = entry.variable === undefined ? options : { ...options, variable: entry.variable };
  if (entry.slice === undefined) return readTimeSeriesFile(entry.file, read);
  const source = loadStack(entry.file, read.variable, read.maxBytes);
  const { axis, warnings } = subjectAxis(source.array, entry.file, read);
  const result = arrayTimeSeries(source.array, entry.file, read, source.place, { axis, index: entry.slice });
  return { ...result, warnings: [...warnings, ...result.warnings] };
}
