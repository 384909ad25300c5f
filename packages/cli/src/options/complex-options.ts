import { type Command, Option } from "commander";
import { nonNegativeInteger } from "./graph-options.js";

/** Limits on the complex: how high to count and how much work to allow. */
export interface ComplexOptions {
  topDim?: number;
  budget?: number;
}

export function addComplexOptions(command: Command): Command {
  return command
    .addOption(
      new Option("--top-dim <k>", "highest simplex dimension to count (default: no cap)").argParser(
        nonNegativeInteger,
      ),
    )
    .addOption(
      new Option("--budget <n>", "stop after counting this many simplices (default: the core's)").argParser(
        nonNegativeInteger,
      ),
    );
}

export function complexOptionsOf(raw: Record<string, unknown>): ComplexOptions {
  return { topDim: raw.topDim as number | undefined, budget: raw.budget as number | undefined };
}
