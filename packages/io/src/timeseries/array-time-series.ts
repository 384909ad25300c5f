import type { ArrayPlace, StackAxis } from "../formats/matrix-stack.js";
import { InputFileError, type InputFileProblem } from "../input-file-error.js";
import { readElement } from "../npy-dtype.js";
import { type NpyArray, npyStrides } from "../parse-npy.js";
import { DEFAULT_MAX_CELLS } from "../read-options.js";
import { checkChannelCount, givenLabels, timeSeriesOf } from "./time-series-layout.js";
import type { TimeSeriesReadOptions, TimeSeriesReadResult } from "./time-series-read-options.js";

/**
 * One recording from a numeric array (.npy, a .npz member, a .mat variable): a 2-D array, or recording
 * `subject` of a 3-D stack along `axis` (0: numpy's (S, T, N); 2: MATLAB's T × N × S). The two other axes are time × channels, or channels × time with
 * `channelsFirst`. Boolean arrays read as 0/1 (spike trains). NaN and infinity are kept for the quality
 * check, which names them by element.
 */
export function arrayTimeSeries(
  array: NpyArray,
  file: string,
  options: TimeSeriesReadOptions,
  place: ArrayPlace,
  subject?: { axis: StackAxis; index: number },
): TimeSeriesReadResult {
  const { shape, dtype } = array;
  const fail = (problem: InputFileProblem, reason: string): never => {
    throw new InputFileError(file, problem, `${place.prefix}${reason}`);
  };
  const shapeText = `(${shape.join(", ")}${shape.length === 1 ? "," : ""})`;
  const stacked = shape.length === 3;
  if (!(shape.length === 2 || (stacked && subject))) {
    fail(
      "bad-shape",
      stacked
        ? `array of shape ${shapeText} holds ${shape[0]} recordings; open it as a dataset (a stack)`
        : `array of shape ${shapeText} is not a recording (time × channels) or a stack of recordings`,
    );
  }
  const axes = stacked ? (subject!.axis === 0 ? [1, 2] : [0, 1]) : [0, 1];
  const [rows, columns] = axes.map((a) => shape[a]);
  const maxCells = options.maxCells ?? DEFAULT_MAX_CELLS;
  if (rows * columns > maxCells) {
    fail("too-large", `a recording of ${rows} × ${columns} values is more than the limit of ${maxCells}`);
  }
  const channelsFirst = options.channelsFirst ?? false;
  const channels = channelsFirst ? rows : columns;
  const timePoints = channelsFirst ? columns : rows;
  const axisNames = channelsFirst ? "channels × time" : "time × channels";
  checkChannelCount(channels, options, file, `the array's ${axisNames} axes are ${rows} × ${columns}`, {});

  const strides = npyStrides(array).map((s) => s * dtype.size);
  const base = array.dataOffset + (stacked ? subject!.index * strides[subject!.axis] : 0);
  const [rowStride, colStride] = axes.map((a) => strides[a]);
  const view = new DataView(array.bytes.buffer, array.bytes.byteOffset, array.bytes.byteLength);
  const table = new Float64Array(rows * columns);
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < columns; j++)
      table[i * columns + j] = readElement(view, base + i * rowStride + j * colStride, dtype);
  }
  const labels = givenLabels(options.labels, channels, file);
  const series = timeSeriesOf(table, rows, columns, channelsFirst, labels);
  const warnings: string[] = [];
  if (!channelsFirst && options.channels === undefined && timePoints < channels) {
    warnings.push(
      `${channels} columns (channels) but ${timePoints} rows (time points): if the rows are channels, read the array channels-first`,
    );
  }
  const elementOf = (time: number, channel: number) => {
    const [i, j] = channelsFirst ? [channel, time] : [time, channel];
    if (!stacked) return [i, j];
    return subject!.axis === 0 ? [subject!.index, i, j] : [i, j, subject!.index];
  };
  return {
    series,
    warnings,
    place: (time, channel) => {
      const [i, j] = channelsFirst ? [channel, time] : [time, channel];
      const byteOffset = base + i * rowStride + j * colStride;
      return { element: elementOf(time, channel), ...(place.byteOffsetsInFile ? { byteOffset } : {}) };
    },
  };
}
