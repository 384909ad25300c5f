import {
  type Barcode,
  computeBarcode,
  HomologyBudgetError,
  type WeightedGraph,
  type WeightSemantics,
  type WorkControl,
} from "@cliquescape/core";
import { type ComplexOptions, homologyDimOf } from "./options/complex-options.js";

/**
 * The barcode a counting command reports Betti numbers from, or null when no homology was asked for
 * (--top-dim 0) or its memory budget ran out — then the counts are still printed, with a note on stderr.
 */
export function barcodeWithinBudget(
  graph: WeightedGraph,
  semantics: WeightSemantics,
  limits: ComplexOptions,
  work: WorkControl,
): Barcode | null {
  const maxDim = homologyDimOf(limits);
  if (maxDim < 0) return null;
  try {
    return computeBarcode(graph, {
      ...work,
      semantics,
      maxDim,
      prime: limits.prime,
      budget: { maxBytes: limits.memoryBytes },
    });
  } catch (error) {
    if (!(error instanceof HomologyBudgetError)) throw error;
    process.stderr.write(
      `cliquescape: Betti numbers skipped: ${error.message.split(";")[0]}; lower --top-dim or raise --memory\n`,
    );
    return null;
  }
}
