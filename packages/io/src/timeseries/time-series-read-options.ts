import type { TimeSeries } from "@cliquescape/core";
import type { InputFilePosition } from "../input-file-error.js";
import type { Delimiter } from "../text-rows.js";

/** How to read a recording: its layout, and what the file is expected to hold. */
export interface TimeSeriesReadOptions {
  /**
   * Rows (or the first array axis) are channels and columns are time points. Default false: time points ×
   * channels, as numpy.savetxt, pandas and MATLAB write a (T, N) array of observations.
   */
  channelsFirst?: boolean;
  /** The number of channels the recording must have; checked, and used to tell an index column apart. */
  channels?: number;
  /** Channel names when the file has none. */
  labels?: readonly string[];
  /** Text: the delimiter (default detected). */
  delimiter?: Delimiter;
  /**
   * Text: whether the first data line names the channels (time × channels) or the time points (channels
   * first). Default: detected (every cell but a leading empty one is non-numeric).
   */
  header?: boolean;
  /**
   * Text, time × channels: whether the first column holds time stamps or row numbers, not a channel.
   * Default: detected (the header's first cell is empty, or `channels` says there is one column too many).
   */
  indexColumn?: boolean;
  /** .npz or .mat: the array or variable to read. Default: the only 2-D or 3-D numeric one. */
  variable?: string;
  /** Refuse larger files before reading them. Defaults: text 256 MiB, binary 2 GiB. */
  maxBytes?: number;
  /** Refuse recordings of more values (time points × channels) than this. Default 2^26. */
  maxCells?: number;
}

/** A recording read from a file, with the notes about it and a way to point at any of its values. */
export interface TimeSeriesReadResult {
  series: TimeSeries;
  /** Notes for the user, without the file name. */
  warnings: string[];
  /** Where the value of `channel` at `time` (0-based) sits in the file: line and column, or array element. */
  place: (time: number, channel: number) => InputFilePosition;
}
