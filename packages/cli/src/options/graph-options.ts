import type { NegativePolicy, SymmetrizePolicy, WeightSemantics } from "@cliquescape/core";
import { type Command, Option } from "commander";

/** What every command that reads one graph accepts: how to read the file and what weights mean. */
export interface GraphOptions {
  directed: boolean;
  weights: WeightSemantics;
  symmetrize?: SymmetrizePolicy;
  negatives?: NegativePolicy;
  zeroEdges: boolean;
  slice: number;
}

export function addGraphOptions(command: Command): Command {
  return command
    .addOption(new Option("--directed", "treat the graph as directed (directed flag complex)").default(false))
    .addOption(new Option("--undirected", "treat the graph as undirected (clique complex; the default)"))
    .addOption(
      new Option(
        "--weights <meaning>",
        "distance: small weights are close; similarity: large weights are strong",
      )
        .choices(["distance", "similarity"])
        .default("similarity"),
    )
    .addOption(
      new Option(
        "--symmetrize <how>",
        "merge a_ij and a_ji of an asymmetric matrix read as undirected",
      ).choices(["max", "min", "mean"]),
    )
    .addOption(
      new Option(
        "--negatives <how>",
        "accept negative weights: absolute value, drop the edge, or keep",
      ).choices(["abs", "drop", "keep"]),
    )
    .addOption(
      new Option("--zero-edges", "with similarity weights, a 0 in a matrix is an edge (default: no edge)"),
    )
    .addOption(
      new Option("--slice <k>", "which matrix of a 3-D .npy stack to use (0-based)")
        .argParser(nonNegativeInteger)
        .default(0),
    );
}

export function graphOptionsOf(raw: Record<string, unknown>): GraphOptions {
  if (raw.directed && raw.undirected) throw new UsageError("--directed and --undirected exclude each other");
  return {
    directed: Boolean(raw.directed),
    weights: raw.weights as WeightSemantics,
    symmetrize: raw.symmetrize as SymmetrizePolicy | undefined,
    negatives: raw.negatives as NegativePolicy | undefined,
    zeroEdges: Boolean(raw.zeroEdges),
    slice: raw.slice as number,
  };
}

/** A mistake in how the command was called (as opposed to a problem with the data). */
export class UsageError extends Error {
  override name = "UsageError";
}

export function nonNegativeInteger(text: string): number {
  const value = Number(text);
  if (!Number.isInteger(value) || value < 0)
    throw new UsageError(`expected a whole number ≥ 0, got "${text}"`);
  return value;
}

export function finiteNumber(text: string): number {
  const value = Number(text);
  if (text.trim() === "" || !Number.isFinite(value)) throw new UsageError(`expected a number, got "${text}"`);
  return value;
}

export function numberList(text: string): number[] {
  return text.split(",").map((part) => finiteNumber(part));
}
