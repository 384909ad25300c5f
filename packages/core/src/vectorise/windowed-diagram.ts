import type { Barcode } from "../homology/barcode.js";

/**
 * The bars of one dimension as vectorisations read them: in positions along the feature axis (0 at the
 * axis's first value, `span` at its last, increasing as edges enter), clipped to that window. A bar
 * [b, d) becomes [max(b, 0), min(d, span)] and is left out when that is empty; `open` marks bars that go on
 * past the window's end, essential bars included (they are cut at the axis's last value).
 */
export interface WindowedDiagram {
  readonly births: Float64Array;
  readonly deaths: Float64Array;
  readonly open: Uint8Array;
  readonly span: number;
}

/**
 * How bars that never die enter a vectorisation: "cut" ends them at the axis's last value (what the axis
 * shows of them), "drop" leaves them out.
 */
export type EssentialHandling = "cut" | "drop";

/**
 * The windowed diagram of dimension `dim`. `position` maps a weight (user units) to its axis position;
 * it must be non-decreasing along the filtration. Bars of dimension 0 are born with the vertices, before
 * any edge, so their birth is the position of the filtration start.
 */
export function windowedDiagram(
  barcode: Barcode,
  dim: number,
  position: (weight: number) => number,
  span: number,
  essential: EssentialHandling,
): WindowedDiagram {
  const births: number[] = [];
  const deaths: number[] = [];
  const open: number[] = [];
  for (const bar of barcode.bars) {
    if (bar.dim !== dim) continue;
    if (bar.death === null && essential === "drop") continue;
    const b = Math.max(0, position(bar.birth));
    const d = bar.death === null ? Infinity : position(bar.death);
    const end = Math.min(d, span);
    if (!(end > b)) continue;
    births.push(b);
    deaths.push(end);
    open.push(d > span ? 1 : 0);
  }
  return {
    births: Float64Array.from(births),
    deaths: Float64Array.from(deaths),
    open: Uint8Array.from(open),
    span,
  };
}
