import type { WeightSemantics } from "../../packages/core/src/filtration/weight-semantics.js";
import type { Bar, Barcode } from "../../packages/core/src/homology/barcode.js";

/** A bar written by hand; its simplices are placeholders of the right sizes (dim + 1 and dim + 2 vertices). */
export function handBar(dim: number, birth: number, death: number | null): Bar {
  const simplex = (size: number) => Array.from({ length: size }, (_, i) => i);
  return {
    dim,
    birth,
    death,
    birthSimplex: simplex(dim + 1),
    deathSimplex: death === null ? null : simplex(dim + 2),
  };
}

/**
 * A barcode written by hand, for functions that read its bars: the filtration starts at `start` with `n`
 * vertices (stats.simplices[0]); every other work counter is 0.
 */
export function handBarcode(
  bars: Bar[],
  semantics: WeightSemantics,
  { start = 0, n = 0, maxDim = 1 }: { start?: number; n?: number; maxDim?: number } = {},
): Barcode {
  const zeros = new Array(maxDim + 1).fill(0);
  return {
    bars,
    prime: 2,
    maxDim,
    semantics,
    directed: false,
    start,
    keepZeroLength: false,
    stats: {
      simplices: [n, ...zeros.slice(1)],
      clearedColumns: zeros,
      apparentPairs: zeros,
      emergentPairs: zeros,
      columnsReduced: zeros,
      columnAdditions: zeros,
      storedColumns: zeros,
      peakBytes: 0,
      representation: "clique-sparse",
    },
  };
}
