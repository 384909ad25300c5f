import type { TimeSeries } from "./time-series.js";

/** A channel no correlation can be computed with: a non-finite value (the first one), or no variation. */
export type ChannelIssue =
  | { kind: "not-finite"; channel: number; time: number; value: number }
  | { kind: "constant"; channel: number; value: number };

/**
 * Every channel that would make a correlation undefined (NaN): one holding NaN or ±infinity, named with
 * its first such time point, and one whose values are all equal (zero variance). One pass over the data.
 */
export function channelIssues(series: TimeSeries): ChannelIssue[] {
  const { channels, timePoints: T, values } = series;
  const issues: ChannelIssue[] = [];
  for (let c = 0; c < channels; c++) {
    const from = c * T;
    let constant = true;
    let bad = -1;
    const first = values[from];
    for (let t = 0; t < T; t++) {
      const x = values[from + t];
      if (!Number.isFinite(x)) {
        bad = t;
        break;
      }
      if (x !== first) constant = false;
    }
    if (bad >= 0) issues.push({ kind: "not-finite", channel: c, time: bad, value: values[from + bad] });
    else if (constant) issues.push({ kind: "constant", channel: c, value: first });
  }
  return issues;
}
