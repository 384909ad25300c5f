import {
  type Connectivity,
  type ConnectivityOptions,
  connectivityMatrix,
  TimeSeriesError,
} from "@cliquescape/core";
import type { DatasetEntry } from "../dataset/dataset-types.js";
import { InputFileError, type InputFilePosition } from "../input-file-error.js";
import { readDatasetTimeSeries } from "./read-dataset-time-series.js";
import type { TimeSeriesReadOptions } from "./time-series-read-options.js";

/** The connectivity matrix of one entry's recording, with every note about the recording and the measure. */
export interface DatasetConnectivity {
  connectivity: Connectivity;
  timePoints: number;
  warnings: string[];
}

/**
 * Reads one entry's recording and computes its connectivity matrix. Problems of the data (a constant or
 * NaN channel, too few time points, …) come back as InputFileErrors at the file position of the offending
 * value, or of the channel's first value.
 */
export function readDatasetConnectivity(
  entry: DatasetEntry,
  read: TimeSeriesReadOptions,
  measure: ConnectivityOptions,
): DatasetConnectivity {
  const { series, warnings, place } = readDatasetTimeSeries(entry, read);
  try {
    const connectivity = connectivityMatrix(series, measure);
    return { connectivity, timePoints: series.timePoints, warnings: [...warnings, ...connectivity.warnings] };
  } catch (error) {
    if (!(error instanceof TimeSeriesError)) throw error;
    const { channel, time } = error.location;
    const position: InputFilePosition = channel === undefined ? {} : place(time ?? 0, channel);
    throw new InputFileError(entry.file, error.problem, error.message, position, { cause: error });
  }
}
