import type { TimeSeries } from "@cliquescape/core";
import type { ArrayPlace, StackAxis } from "../formats/matrix-stack.js";
import { InputFileError, type InputFileProblem } from "../input-file-error.js";
import { readElement } from "../npy-dtype.js";
import { type NpyArray, npyStrides } from "../parse-npy.js";
import { DEFAULT_MAX_CELLS } from "../read-options.js";
import { checkChannelCount, givenLabels } from "./time-series-layout.js";
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
  // Straight into the channel-major layout: channel c's time points become contiguous.
  const [timeStride, channelStride] = channelsFirst ? [colStride, rowStride] : [rowStride, colStride];
  const values = new Float64Array(channels * timePoints);
  const floats = float64View(array, base);
  if (floats) {
    const dt = timeStride >>> 3;
    const dc = channelStride >>> 3;
    for (let c = 0; c < channels; c++) {
      for (let t = 0; t < timePoints; t++) values[c * timePoints + t] = floats[t * dt + c * dc];
    }
  } else {
    const view = new DataView(array.bytes.buffer, array.bytes.byteOffset, array.bytes.byteLength);
    for (let c = 0; c < channels; c++) {
      for (let t = 0; t < timePoints; t++) {
        values[c * timePoints + t] = readElement(view, base + t * timeStride + c * channelStride, dtype);
      }
    }
  }
  const labels = givenLabels(options.labels, channels, file);
  const series: TimeSeries = labels
    ? { channels, timePoints, values, labels }
    : { channels, timePoints, values };
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

// NumPy's own files (little-endian float64, data aligned to 64 bytes) are read through a typed-array view,
// several times faster than a DataView call per element; anything else goes through readElement.
const NATIVE_LITTLE = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

function float64View(array: NpyArray, base: number): Float64Array | null {
  const { dtype, bytes } = array;
  if (dtype.kind !== "f" || dtype.size !== 8 || dtype.littleEndian !== NATIVE_LITTLE) return null;
  const start = bytes.byteOffset + base;
  if (start % 8 !== 0) return null;
  return new Float64Array(bytes.buffer, start, (bytes.byteLength - base) >>> 3);
}
