/**
 * A multichannel recording of one subject: `channels` signals (regions, electrodes, neurons) sampled at
 * the same `timePoints`. Stored channel-major, each channel's samples contiguous, because every measure
 * works on whole channels: `values[c * timePoints + t]` is channel c at time point t.
 */
export interface TimeSeries {
  channels: number;
  timePoints: number;
  values: Float64Array;
  /** Channel names, when the source has them; they become the network's node labels. */
  labels?: readonly string[];
}

/** Builds a time series from a time × channels table in row-major order (as numpy stores a (T, N) array). */
export function fromTimeByChannel(
  timePoints: number,
  channels: number,
  rows: ArrayLike<number>,
  labels?: readonly string[],
): TimeSeries {
  if (rows.length !== timePoints * channels) {
    throw new RangeError(
      `${rows.length} values do not fill ${timePoints} time points × ${channels} channels`,
    );
  }
  const values = new Float64Array(timePoints * channels);
  for (let t = 0; t < timePoints; t++) {
    for (let c = 0; c < channels; c++) values[c * timePoints + t] = rows[t * channels + c];
  }
  return labels ? { channels, timePoints, values, labels } : { channels, timePoints, values };
}

/** How messages name a channel: its 0-based index, and its label when it has one. */
export function channelName(series: Pick<TimeSeries, "labels">, channel: number): string {
  const label = series.labels?.[channel];
  return label === undefined ? `channel ${channel}` : `channel ${channel} (${label})`;
}
