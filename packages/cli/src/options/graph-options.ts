import { type Command, Option } from "commander";
import { EDGE_TRANSFORMS, type Preparation, type RunSpec } from "../extract/run-spec.js";

/** Every format a single-graph command reads, for help texts. */
export const GRAPH_FILE_HELP =
  "graph file: dense matrix or edge list (.csv .tsv .txt), NumPy (.npy .npz), MATLAB (.mat), GraphML (.graphml) or GEXF (.gexf)";

/** What every command that reads one graph accepts: how to read and prepare the file, as an extract run does. */
export interface GraphOptions {
  /** The same settings as a run spec's `preparation`, so a single graph is read exactly as extract reads it. */
  preparation: Preparation;
  /** Which graph of a stack file (.npy .npz .mat), 0-based. */
  slice: number;
}

/** Whether the user typed an option (as opposed to its default): typed options win over --spec. */
export type Given = (name: string) => boolean;

export function addGraphOptions(command: Command): Command {
  return command
    .addOption(new Option("--directed", "treat the graph as directed (directed flag complex)"))
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
        "merge a_ij and a_ji of a matrix read as undirected when they differ by more than a relative 1e-9 (closer values are one weight, their mean); error: refuse the matrix",
      )
        .choices(["error", "max", "min", "mean"])
        .default("error"),
    )
    .addOption(
      new Option(
        "--negatives <how>",
        "negative weights: auto drops negative similarities (as 0 is no edge) and refuses negative distances; or refuse, take the absolute value, drop the edge, keep",
      )
        .choices(["auto", "error", "abs", "drop", "keep"])
        .default("auto"),
    )
    .addOption(
      new Option(
        "--zero-edges [rule]",
        "is a 0 in the file an edge? auto: not for similarity weights, yes for distances; the option alone: edge",
      )
        .choices(["auto", "edge", "no-edge"])
        .preset("edge")
        .default("auto"),
    )
    .addOption(
      new Option(
        "--nan-cells <rule>",
        "NaN weights (corrcoef of a constant signal): no edge, or refuse the file",
      )
        .choices(["no-edge", "error"])
        .default("no-edge"),
    )
    .addOption(
      new Option("--transform <f>", "edge value before the weight semantics: 1−w, −log w, 1/w")
        .choices([...EDGE_TRANSFORMS])
        .default("none"),
    )
    .addOption(
      new Option("--max-nodes <n>", "largest matrix read, in nodes").argParser(positiveInteger).default(8192),
    )
    .addOption(
      new Option(
        "--max-file <MiB>",
        "largest file read (default: 256 for text, 2048 for .npy .npz .mat)",
      ).argParser(positiveInteger),
    )
    .addOption(
      new Option("--slice <k>", "which matrix of a stack (.npy .npz .mat) to use, 0-based")
        .argParser(nonNegativeInteger)
        .default(0),
    );
}

/**
 * The reading options as typed, or, for each one not typed, the `preparation` of `spec` (a run's spec.json)
 * when one is given.
 */
export function graphOptionsOf(
  raw: Record<string, unknown>,
  spec: RunSpec | null = null,
  given: Given = () => true,
): GraphOptions {
  if (raw.directed && raw.undirected) throw new UsageError("--directed and --undirected exclude each other");
  const typed: Preparation = {
    directed: raw.directed ? "directed" : "undirected",
    weights: raw.weights as Preparation["weights"],
    symmetrize: raw.symmetrize as Preparation["symmetrize"],
    negatives: raw.negatives as Preparation["negatives"],
    zeroEdges: raw.zeroEdges as Preparation["zeroEdges"],
    nanCells: raw.nanCells as Preparation["nanCells"],
    transform: raw.transform as Preparation["transform"],
    maxNodes: raw.maxNodes as number,
    maxFileMiB: (raw.maxFile as number | undefined) ?? null,
  };
  if (!spec) return { preparation: typed, slice: raw.slice as number };
  const optionOf: Record<keyof Preparation, string[]> = {
    directed: ["directed", "undirected"],
    weights: ["weights"],
    symmetrize: ["symmetrize"],
    negatives: ["negatives"],
    zeroEdges: ["zeroEdges"],
    nanCells: ["nanCells"],
    transform: ["transform"],
    maxNodes: ["maxNodes"],
    maxFileMiB: ["maxFile"],
  };
  const preparation = { ...spec.preparation };
  for (const key of Object.keys(optionOf) as (keyof Preparation)[]) {
    if (optionOf[key].some(given)) Object.assign(preparation, { [key]: typed[key] });
  }
  return { preparation, slice: raw.slice as number };
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

export function positiveInteger(text: string): number {
  const value = nonNegativeInteger(text);
  if (value < 1) throw new UsageError(`expected a whole number ≥ 1, got "${text}"`);
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
