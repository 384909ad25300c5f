import {
  CONNECTIVITY_MEASURES,
  type ConnectivityOptions,
  checkConnectivityOptions,
  type TimeSeries,
} from "@cliquescape/core";
import type { TimeSeriesReadOptions } from "@cliquescape/io";
import { z } from "zod";

/**
 * How recordings become connectivity matrices: the measure and its parameters, and how the recordings are
 * laid out. `connect` takes it from its options; `extract` records it in spec.json (section
 * `connectivity`), so that --spec reproduces the whole path from recordings to features.
 */
export const ConnectivitySchema = z
  .strictObject({
    /** pearson, spearman, partial (Ledoit–Wolf shrinkage), lagged (directed), coactivity (spike trains). */
    measure: z.enum(CONNECTIVITY_MEASURES),
    /** Fisher's z = atanh(r) of every correlation (not for coactivity). */
    fisherZ: z.boolean().default(false),
    /** lagged: the longest lag, in time points (required for lagged, refused otherwise). */
    maxLag: z.number().int().min(1).optional(),
    /** coactivity: the coincidence window, ± this many time bins (required for coactivity, refused otherwise). */
    window: z.number().int().min(0).optional(),
    /** Recordings are channels × time (rows are channels) instead of time × channels. */
    channelsFirst: z.boolean().default(false),
    /** Every recording must have this many channels; null: any. */
    channels: z.number().int().min(1).nullable().default(null),
    /** Channels with NaN/infinite values or without variation: refuse the recording, or keep them without edges. */
    badChannels: z.enum(["error", "isolate"]).default("error"),
  })
  .superRefine((section, context) => {
    try {
      checkConnectivityOptions(measureOptions(section));
    } catch (error) {
      context.addIssue({ code: "custom", message: (error as Error).message });
    }
  });

export type ConnectivitySpec = z.output<typeof ConnectivitySchema>;

/** The core's options for the measure. */
export function measureOptions(spec: ConnectivitySpec): ConnectivityOptions {
  return {
    measure: spec.measure,
    fisherZ: spec.fisherZ,
    badChannels: spec.badChannels,
    ...(spec.maxLag === undefined ? {} : { maxLag: spec.maxLag }),
    ...(spec.window === undefined ? {} : { window: spec.window }),
  };
}

/** The io readers' options for the layout. */
export function recordingOptions(spec: ConnectivitySpec): TimeSeriesReadOptions {
  return {
    channelsFirst: spec.channelsFirst,
    ...(spec.channels === null ? {} : { channels: spec.channels }),
  };
}

/** The measure with its parameters, for messages and tables: "lagged (max lag 3, Fisher z)". */
export function describeMeasure(spec: ConnectivitySpec): string {
  const parts = [
    spec.maxLag === undefined ? "" : `max lag ${spec.maxLag}`,
    spec.window === undefined ? "" : `window ±${spec.window}`,
    spec.fisherZ ? "Fisher z" : "",
  ].filter(Boolean);
  return parts.length > 0 ? `${spec.measure} (${parts.join(", ")})` : spec.measure;
}

export type { TimeSeries };
