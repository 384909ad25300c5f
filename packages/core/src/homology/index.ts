export type { BandSweepPolicy } from "./band-sweep.js";
export type { Bar, Barcode, BarcodeStats } from "./barcode.js";
export { type BettiAtOptions, bettiAt } from "./betti-at.js";
export { bettiCurves, bettiFromBarcode } from "./betti-curves.js";
export type { CliqueLayout } from "./clique-coboundaries.js";
export { type BarcodeOptions, computeBarcode } from "./compute-barcode.js";
export { DEFAULT_HOMOLOGY_BYTES, type HomologyBudget, HomologyBudgetError } from "./homology-budget.js";
export { mostPersistentBars, representativeCycle } from "./representative-cycle.js";
