/**
 * Default simplex budget: 10^10 simplices. Counting stores nothing, so the budget only bounds time. Graphs
 * with that many simplices are dense, where the bitset counter manages some 25–65 million simplices per
 * second (docs/benchmarks.md): the default stops a runaway input after a few minutes rather than hours.
 */
export const DEFAULT_SIMPLEX_BUDGET = 1e10;
