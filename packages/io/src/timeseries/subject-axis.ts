import { extname } from "node:path";
import type { StackAxis } from "../formats/matrix-stack.js";
import { InputFileError } from "../input-file-error.js";
import type { NpyArray } from "../parse-npy.js";
import type { TimeSeriesReadOptions } from "./time-series-read-options.js";

/**
 * Which axis of a 3-D array counts the recordings. NumPy files (.npy, .npz) put them first, (S, T, N) or
 * (S, N, T) channels first. A MATLAB variable is T × N × S by MATLAB's own convention (X(:,:,s) is
 * recording s), but a numpy stack saved by scipy.io.savemat arrives as S × T × N: when the channel count is
 * stated, the axis whose layout fits it decides (MATLAB's convention when both fit), otherwise MATLAB's
 * convention holds and a warning says so. A 2-D array is one recording: axis 0, one slice.
 */
export function subjectAxis(
  array: NpyArray,
  file: string,
  options: TimeSeriesReadOptions,
): { axis: StackAxis; warnings: string[] } {
  const { shape } = array;
  if (shape.length !== 3 || extname(file).toLowerCase() !== ".mat") return { axis: 0, warnings: [] };
  const channelAt = options.channelsFirst ? 0 : 1;
  const stated = options.channels;
  const dims = shape.join("×");
  if (stated === undefined) {
    return {
      axis: 2,
      warnings: [
        `variable of size ${dims} read as ${shape[2]} recordings X(:,:,s), each ${options.channelsFirst ? "channels × time" : "time × channels"} (MATLAB's convention); state the channel count to have a ${shape[0]}-recording numpy-style stack recognised`,
      ],
    };
  }
  const matlab = shape[channelAt] === stated;
  const numpy = shape[channelAt + 1] === stated;
  if (matlab) return { axis: 2, warnings: [] };
  if (numpy) return { axis: 0, warnings: [] };
  throw new InputFileError(
    file,
    "channel-count",
    `${stated} channels were stated but the variable's size is ${dims}: neither ${options.channelsFirst ? "N × T × S nor S × N × T" : "T × N × S nor S × T × N"} fits`,
  );
}
