import { type Command, Option } from "commander";
import { readSpecFile, validateSpec } from "../extract/load-spec.js";
import type { RunSpec } from "../extract/run-spec.js";

/**
 * --spec on a single-graph command: read the graph with the settings of an extract run (its spec.json), so
 * that one row of the run's tables can be checked by hand. Options typed on the command line still win.
 */
export function addSpecOption(command: Command): Command {
  return command.addOption(
    new Option(
      "--spec <file>",
      "settings of an extract run (its spec.json): preparation, top dimension, prime, limits and, for sweep, the grid; options typed here win",
    ),
  );
}

/** The validated spec named by --spec, or null without one. */
export function specOf(raw: Record<string, unknown>): RunSpec | null {
  const file = raw.spec as string | undefined;
  return file === undefined ? null : validateSpec(readSpecFile(file), file);
}
