import { countAtMost } from "../filtration/count-at-most.js";
import { gridFiltrationValues, type ThresholdGrid } from "../filtration/threshold-grid.js";
import { toFiltrationValue } from "../filtration/weight-semantics.js";
import type { Barcode } from "./barcode.js";

/**
 * Betti numbers read off a barcode at one threshold (user units): β_k counts the bars of dimension k with
 * birth ≤ threshold < death in filtration order (a class is alive from its birth up to, not including, its
 * death; essential bars never die). Exact for k ≤ barcode.maxDim.
 *
 * A threshold before the filtration start (stronger than the strongest similarity, say, or density 0)
 * keeps no edge: it reads as the n isolated vertices, as the simplex counts have them at every threshold,
 * so χ = Σ(−1)^k β_k holds there too.
 */
export function bettiFromBarcode(barcode: Barcode, threshold: number): number[] {
  const t = toFiltrationValue(threshold, barcode.semantics);
  const betti = new Array<number>(barcode.maxDim + 1).fill(0);
  if (t < toFiltrationValue(barcode.start, barcode.semantics)) {
    betti[0] = barcode.stats.simplices[0];
    return betti;
  }
  for (const bar of barcode.bars) {
    const birth = toFiltrationValue(bar.birth, barcode.semantics);
    const death = bar.death === null ? Infinity : toFiltrationValue(bar.death, barcode.semantics);
    if (birth <= t && t < death) betti[bar.dim]++;
  }
  return betti;
}

/**
 * Betti curves on a grid: result[t][k] = β_k at grid threshold t, derived exactly from the barcode: the
 * number of births ≤ t minus the number of deaths ≤ t, each found by binary search in sorted lists.
 * Thresholds before the filtration start read as n isolated vertices, as in bettiFromBarcode.
 */
export function bettiCurves(barcode: Barcode, grid: ThresholdGrid): Float64Array[] {
  if (grid.semantics !== barcode.semantics) {
    throw new RangeError(
      `grid semantics "${grid.semantics}" differ from the barcode's "${barcode.semantics}"`,
    );
  }
  const gridF = gridFiltrationValues(grid);
  const dims = barcode.maxDim + 1;
  const curves = Array.from(gridF, () => new Float64Array(dims));
  for (let k = 0; k < dims; k++) {
    const births: number[] = [];
    const deaths: number[] = [];
    for (const bar of barcode.bars) {
      if (bar.dim !== k) continue;
      births.push(toFiltrationValue(bar.birth, barcode.semantics));
      if (bar.death !== null) deaths.push(toFiltrationValue(bar.death, barcode.semantics));
    }
    births.sort((a, b) => a - b);
    deaths.sort((a, b) => a - b);
    for (let t = 0; t < gridF.length; t++)
      curves[t][k] = countAtMost(births, gridF[t]) - countAtMost(deaths, gridF[t]);
  }
  const start = toFiltrationValue(barcode.start, barcode.semantics);
  for (let t = 0; t < gridF.length && gridF[t] < start; t++) {
    curves[t].fill(0);
    curves[t][0] = barcode.stats.simplices[0];
  }
  return curves;
}
