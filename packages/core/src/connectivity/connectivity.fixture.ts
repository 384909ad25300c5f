import type { TimeSeries } from "./time-series.js";

/** A seeded stream of uniform numbers in [0, 1) (mulberry32; common practice for test data). */
export function uniforms(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
}

/** A seeded stream of standard normal numbers (Box–Muller on uniforms). */
export function normals(seed: number): () => number {
  const uniform = uniforms(seed);
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
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
