import type { TimeSeries } from "@cliquescape/core";
import { InputFileError, type InputFilePosition } from "../input-file-error.js";
import type { TimeSeriesReadOptions } from "./time-series-read-options.js";

/**
 * A recording from a row-major table of `rows` × `columns` values: time × channels (each row a time
 * point), or channels × time with `channelsFirst` (each row a channel, already the stored layout).
 */
export function timeSeriesOf(
  table: Float64Array,
  rows: number,
  columns: number,
  channelsFirst: boolean,
  labels: readonly string[] | undefined,
): TimeSeries {
  let series: TimeSeries;
  if (channelsFirst) {
    series = { channels: rows, timePoints: columns, values: table.slice() };
  } else {
    const values = new Float64Array(rows * columns);
    for (let t = 0; t < rows; t++) {
      for (let c = 0; c < columns; c++) values[c * rows + t] = table[t * columns + c];
    }
    series = { channels: columns, timePoints: rows, values };
  }
  if (labels) {
    if (labels.length !== series.channels) {
      throw new RangeError(`${labels.length} channel names given for ${series.channels} channels`);
    }
    series.labels = labels;
  }
  return series;
}

/** Refuses a recording whose channel count differs from the stated one, saying what the file holds. */
export function checkChannelCount(
  found: number,
  options: TimeSeriesReadOptions,
  file: string,
  holds: string,
  position: InputFilePosition,
): void {
  const stated = options.channels;
  if (stated === undefined || stated === found) return;
  const layout = options.channelsFirst
    ? "channels first: rows are channels"
    : "time × channels: columns are channels; if rows are channels, read it channels-first";
  throw new InputFileError(
    file,
    "channel-count",
    `${stated} channels were stated but ${holds}, i.e. ${found} channels (${layout})`,
    position,
  );
}

/** Channel names given by the caller, checked against the channel count. */
export function givenLabels(
  given: readonly string[] | undefined,
  channels: number,
  file: string,
): readonly string[] | undefined {
  if (given && given.length !== channels) {
    throw new InputFileError(
      file,
      "bad-labels",
      `${given.length} channel names given for ${channels} channels`,
    );
  }
  return given;
}
