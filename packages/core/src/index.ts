export * from "./connectivity/index.js";
export type { CountSimplicesOptions } from "./count/count-simplices.js";
export { countSimplices } from "./count/count-simplices.js";
export { DEFAULT_SIMPLEX_BUDGET } from "./count/defaults.js";
export { SimplexBudgetError } from "./count/simplex-budget-error.js";
export { sweepSimplexCounts } from "./count/sweep-simplex-counts.js";
export type { CountOptions, NodeParticipation, SimplexCounts, SweepCounts } from "./count/types.js";
export * from "./distance/index.js";
export * from "./features/index.js";
export { edgeBins } from "./filtration/edge-bins.js";
export { edgeFiltration, filtrationStart } from "./filtration/edge-filtration.js";
export type { ThresholdGrid } from "./filtration/threshold-grid.js";
export {
  allEdgesGrid,
  densityGrid,
  evenGrid,
  explicitGrid,
  gridFiltrationValues,
} from "./filtration/threshold-grid.js";
export type { WeightSemantics } from "./filtration/weight-semantics.js";

export { fromFiltrationValue, toFiltrationValue } from "./filtration/weight-semantics.js";
export { type EdgeArrays, edgeArrays } from "./graph/edge-arrays.js";
export type { DenseMatrixOptions } from "./graph/from-dense-matrix.js";
export { asymmetryNote, DEFAULT_SYMMETRY_TOLERANCE, fromDenseMatrix } from "./graph/from-dense-matrix.js";
export type { EdgeListInput } from "./graph/from-edge-list.js";
export { fromEdgeList } from "./graph/from-edge-list.js";
export type { GraphologyOptions } from "./graph/from-graphology.js";
export { fromGraphology } from "./graph/from-graphology.js";
export type { GraphInputLocation, GraphInputProblem } from "./graph/graph-input-error.js";
export { GraphInputError } from "./graph/graph-input-error.js";
export type { NegativePolicy, SymmetrizePolicy, WarningSink } from "./graph/policies.js";
export { thresholdSubgraph } from "./graph/threshold-subgraph.js";
export type { WeightedGraph } from "./graph/weighted-graph.js";
export { density, edgeCount, nodeLabel, possibleEdgeCount } from "./graph/weighted-graph.js";
export * from "./homology/index.js";
export * from "./null-model/index.js";
export * from "./vectorise/index.js";
export { describeProgress, describeStage, TimeLimitError } from "./work/time-limit-error.js";
export type { WorkControl, WorkProgress, WorkStage } from "./work/work-control.js";
