import { UsageError } from "./options/graph-options.js";

/**
 * Exit codes: 0 success; 1 bad input data; 2 bad command line; 3 a budget or the time limit stopped the work;
 * 4 a merge found shards missing or unfinished (nothing written); 70 anything unexpected (a bug: please
 * report it); 74 the system refused a write (disk full, read-only, permission, --out is a file); 75 the run
 * folder is in use by another run (try again when it ends).
 * 70, 74 and 75 follow the BSD sysexits.h convention (EX_SOFTWARE, EX_IOERR, EX_TEMPFAIL).
 */
export function exitCodeFor(error: unknown): number {
  if (error instanceof UsageError) return 2;
  const name = error instanceof Error ? error.name : "";
  if (name === "InputFileError" || name === "GraphInputError" || name === "NoEdgeError") return 1;
  if (name.endsWith("BudgetError") || name === "TimeLimitError") return 3;
  if (name === "UnfinishedShardsError") return 4;
  if (name === "OutputIOError") return 74;
  if (name === "RunFolderBusyError") return 75;
  return 70;
}
