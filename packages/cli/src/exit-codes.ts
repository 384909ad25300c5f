import { UsageError } from "./options/graph-options.js";

/**
 * Exit codes: 0 success; 1 bad input data; 2 bad command line; 3 a budget or the time limit stopped the work;
 * 70 anything unexpected (a bug: please report it).
 */
export function exitCodeFor(error: unknown): number {
  if (error instanceof UsageError) return 2;
  const name = error instanceof Error ? error.name : "";
  if (name === "InputFileError" || name === "GraphInputError" || name === "NoEdgeError") return 1;
  if (name.endsWith("BudgetError") || name === "TimeLimitError") return 3;
  return 70;
}
