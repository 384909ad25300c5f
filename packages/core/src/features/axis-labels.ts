/** Significant digits tried first: short column names for the grids people type or space evenly. */
const COMPACT_DIGITS = 6;
/** Enough digits to tell any two distinct doubles apart. */
const EXACT_DIGITS = 17;

/**
 * Compact text for each axis value, for column names: at most 6 significant digits with trailing zeros
 * dropped (0.45 → "0.45", 1/3 → "0.333333"). When two distinct values would read alike, every value is
 * written with more digits until all are distinct, so no two columns share a name.
 */
export function axisLabels(values: readonly number[]): string[] {
  for (let digits = COMPACT_DIGITS; digits <= EXACT_DIGITS; digits++) {
    const labels = values.map((x) => formatValue(x, digits));
    if (new Set(labels).size === labels.length) return labels;
  }
  // Only equal values are left reading alike; checkFeatureAxis refuses those before names are made.
  throw new RangeError("axis values repeat, so their columns cannot be told apart");
}

/** `x` rounded to `digits` significant digits, in JavaScript's shortest form ("0.45", "1e-7", "-2"). */
function formatValue(x: number, digits: number): string {
  const rounded = Number(x.toPrecision(digits));
  return String(rounded === 0 ? 0 : rounded); // no "-0" in a column name
}
