import { seededRandom, standardNormal } from "../../../../test/support/random.js";
import type { TimeSeries } from "./time-series.js";

/** A seeded stream of standard normal numbers. */
export function normals(seed: number): () => number {
  const random = seededRandom(seed);
  return () => standardNormal(random);
}

/** A recording from channel rows (each the same length). */
export function series(rows: readonly (readonly number[])[], labels?: string[]): TimeSeries {
  const T = rows[0].length;
  const values = new Float64Array(rows.length * T);
  rows.forEach((row, c) => {
    values.set(row, c * T);
  });
  return labels
    ? { channels: rows.length, timePoints: T, values, labels }
    : { channels: rows.length, timePoints: T, values };
}

/** `channels` independent noise channels of length T. */
export function noise(channels: number, T: number, seed: number): number[][] {
  const next = normals(seed);
  return Array.from({ length: channels }, () => Array.from({ length: T }, next));
}
