/**
 * A problem with a recording that stops a measure: a channel with non-finite values or without variation,
 * too few time points, a value that is not a spike count, or a perfect correlation that the Fisher
 * transform would turn into infinity. Positions are 0-based; readers restate them with the file, line and
 * column (or array element) of the value.
 */
export type TimeSeriesProblem =
  | "not-finite"
  | "constant-channel"
  | "too-few-points"
  | "too-few-channels"
  | "not-spike-count"
  | "perfect-correlation"
  | "singular-covariance";

export interface TimeSeriesLocation {
  /** 0-based channel of the (first) offending value. */
  channel?: number;
  /** 0-based time point of the offending value. */
  time?: number;
}

export class TimeSeriesError extends Error {
  readonly problem: TimeSeriesProblem;
  readonly location: TimeSeriesLocation;

  constructor(problem: TimeSeriesProblem, message: string, location: TimeSeriesLocation = {}) {
    super(message);
    this.name = "TimeSeriesError";
    this.problem = problem;
    this.location = location;
  }
}
