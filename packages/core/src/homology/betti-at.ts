import { edgeFiltration } from "../filtration/edge-filtration.js";
import { toFiltrationValue, type WeightSemantics } from "../filtration/weight-semantics.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { DEFAULT_HOMOLOGY_BYTES, type HomologyBudget } from "./homology-budget.js";
import { primeField } from "./prime-field.js";
import { rankModP } from "./rank-mod-p.js";
import { simplicesAtThreshold } from "./simplices-at-threshold.js";
import { TupleIndex } from "./tuple-index.js";

export interface BettiAtOptions {
  /** Threshold in the user's units: distances keep w ≤ threshold, similarities keep w ≥ threshold. */
  readonly threshold: number;
  readonly semantics: WeightSemantics;
  /** Betti numbers β_0 … β_maxDim are computed (simplices up to maxDim + 1 are listed). */
  readonly maxDim: number;
  readonly prime?: number;
  readonly budget?: HomologyBudget;
}

/**
 * Betti numbers over Z/p of the complex at one threshold, straight from ranks of boundary matrices:
 * β_k = #k-simplices − rank ∂_k − rank ∂_{k+1} (common practice; e.g. A. Hatcher, Algebraic Topology, 2002,
 * §2.1). Independent of the persistence code; slower, meant for single thresholds and for checking.
 */
export function bettiAt(graph: WeightedGraph, options: BettiAtOptions): number[] {
  const { maxDim } = options;
  if (!Number.isInteger(maxDim) || maxDim < 0)
    throw new RangeError(`maxDim must be a non-negative integer, got ${maxDim}`);
  const field = primeField(options.prime ?? 2);
  const limitF = toFiltrationValue(options.threshold, options.semantics);
  const edgeF = edgeFiltration(graph, options.semantics);
  const maxBytes = options.budget?.maxBytes ?? DEFAULT_HOMOLOGY_BYTES;
  const simplices = simplicesAtThreshold(graph, edgeF, limitF, maxDim + 1, maxBytes);
  const counts = simplices.map((s, d) => s.length / (d + 1));
  const ranks = new Array<number>(maxDim + 3).fill(0); // ranks[k] = rank ∂_k
  for (let k = 1; k <= maxDim + 1; k++)
    ranks[k] = boundaryRank(simplices[k - 1], simplices[k], k, counts, field);
  const betti: number[] = [];
  for (let k = 0; k <= maxDim; k++) betti.push(counts[k] - ranks[k] - ranks[k + 1]);
  return betti;
}

/** Rank of ∂_k: k-simplices (k + 1 vertices each) to (k − 1)-simplices, signs (−1)^i for dropping vertex i. */
function boundaryRank(
  faces: Int32Array,
  cells: Int32Array,
  k: number,
  counts: number[],
  field: ReturnType<typeof primeField>,
): number {
  const cellCount = counts[k];
  const index = new TupleIndex(faces, k, counts[k - 1]);
  const start = new Int32Array(cellCount + 1);
  const rows = new Int32Array(cellCount * (k + 1));
  const coefs = new Int32Array(cellCount * (k + 1));
  const probe = new Int32Array(k);
  let q = 0;
  for (let c = 0; c < cellCount; c++) {
    for (let i = 0; i <= k; i++) {
      let m = 0;
      for (let j = 0; j <= k; j++) if (j !== i) probe[m++] = cells[c * (k + 1) + j];
      const row = index.find(probe);
      if (row < 0) throw new Error("internal: a facet is missing from the complex");
      rows[q] = row;
      coefs[q] = (i & 1) === 0 ? 1 : -1;
      q++;
    }
    start[c + 1] = q;
  }
  return rankModP(start, rows, coefs, counts[k - 1], field);
}
