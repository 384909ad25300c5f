/**
 * Default simplex budget: 10^10 simplices. Counting stores nothing, so the budget only bounds time: the
 * bitset counter runs at roughly 10^8 simplices per second on dense graphs (docs/benchmarks.md), so the
 * default stops runaway inputs after about a minute or two rather than hours.
 */
export const DEFAULT_SIMPLEX_BUDGET = 1e10;
