/** Numbers read off one curve sampled on the feature axis. */
export interface CurveSummary {
  /** Largest value of the curve. */
  readonly max: number;
  /** Axis value where the curve first reaches its maximum, walking the axis in its order. */
  readonly peakAt: number;
  /** Area under the curve by the trapezoid rule over |Δ axis| (0 for a single point). */
  readonly area: number;
}

/**
 * Maximum, where it is first reached, and trapezoid area of `curve[i]` sampled at `axis[i]`. The area
 * uses |axis[i+1] − axis[i]| so that a similarity axis, whose thresholds go down, still gives a positive
 * width (common practice for summarising a sampled curve). `curve` is read with a stride so the caller can
 * pass one column of a row-major table without copying.
 */
export function summarizeCurve(
  curve: ArrayLike<number>,
  axis: ArrayLike<number>,
  stride = 1,
  offset = 0,
): CurveSummary {
  const T = axis.length;
  if (T === 0) throw new RangeError("a curve needs at least one point");
  let max = curve[offset];
  let peakAt = axis[0];
  let area = 0;
  let previous = max;
  for (let i = 1; i < T; i++) {
    const y = curve[offset + i * stride];
    if (y > max) {
      max = y;
      peakAt = axis[i];
    }
    area += (Math.abs(axis[i] - axis[i - 1]) * (previous + y)) / 2;
    previous = y;
  }
  return { max, peakAt, area };
}
