import {
  allEdgesGrid,
  axisGrid,
  densityGrid,
  evenGrid,
  explicitGrid,
  type FeatureAxis,
  type ThresholdGrid,
  type WeightedGraph,
  type WeightSemantics,
} from "@cliquescape/core";
import { type Command, Option } from "commander";
import { resolveGrid } from "../extract/resolve-grid.js";
import type { RunSpec } from "../extract/run-spec.js";
import { finiteNumber, type Given, nonNegativeInteger, numberList, UsageError } from "./graph-options.js";

/** Where to read the filtration: given weights, given edge densities, evenly spaced weights, or a run's axis. */
export interface ThresholdChoice {
  threshold?: number[];
  density?: number[];
  steps?: number;
  range?: [number, number];
  /** The axis of an extract run (--spec): the graph is read exactly where the run read it. */
  axis?: FeatureAxis;
}

/** One threshold (inspect, barcode cycles). Neither option: every edge is in. */
export function addSingleThresholdOptions(command: Command): Command {
  return command
    .addOption(
      new Option("--threshold <w>", "keep edges at least this strong (similarity) or this close (distance)")
        .argParser((t) => [finiteNumber(t)])
        .conflicts("density"),
    )
    .addOption(
      new Option("--density <d>", "keep the strongest fraction d of all possible edges (0..1)").argParser(
        (t) => [finiteNumber(t)],
      ),
    );
}

/** A grid of thresholds (sweep). Default: 20 evenly spaced weights from the first edge to the last. */
export function addGridOptions(command: Command): Command {
  return command
    .addOption(new Option("--threshold <list>", "comma-separated weight thresholds").argParser(numberList))
    .addOption(new Option("--density <list>", "comma-separated edge densities (0..1)").argParser(numberList))
    .addOption(new Option("--steps <n>", "number of evenly spaced thresholds").argParser(nonNegativeInteger))
    .addOption(
      new Option(
        "--range <from:to>",
        "weights between which --steps thresholds are spaced (default: all edges)",
      ).argParser(parseRange),
    );
}

export function thresholdChoiceOf(raw: Record<string, unknown>): ThresholdChoice {
  const choice: ThresholdChoice = {
    threshold: raw.threshold as number[] | undefined,
    density: raw.density as number[] | undefined,
    steps: raw.steps as number | undefined,
    range: raw.range as [number, number] | undefined,
  };
  const given = [choice.threshold, choice.density, choice.steps ?? choice.range].filter(
    (x) => x !== undefined,
  );
  if (given.length > 1) throw new UsageError("use only one of --threshold, --density, --steps/--range");
  return choice;
}

/** A sweep's grid: the options typed, or, with none typed, the grid of `spec` (a run's spec.json). */
export function gridChoiceOf(
  raw: Record<string, unknown>,
  spec: RunSpec | null,
  typed: Given,
): ThresholdChoice {
  const choice = thresholdChoiceOf(raw);
  if (!spec || ["threshold", "density", "steps", "range"].some(typed)) return choice;
  return { axis: specAxis(spec) };
}

/** The axis an extract run reads every graph on: the spec's resolved grid, or its explicit grid. */
export function specAxis(spec: RunSpec): FeatureAxis {
  if (spec.resolvedGrid) return spec.resolvedGrid;
  if (spec.grid.kind === "quantiles") {
    throw new UsageError(
      "the spec's grid is a quantile grid, which only an extract run can resolve (from all the dataset's weights): pass the spec.json of a finished run, or give --threshold or --density",
    );
  }
  return resolveGrid(spec.grid, spec.preparation.weights);
}

/**
 * Resolves the user's choice to a grid on this graph. With no choice at all, a sweep uses `defaultSteps`
 * evenly spaced thresholds and a single-threshold command keeps every edge.
 */
export function gridOf(
  graph: WeightedGraph,
  semantics: WeightSemantics,
  choice: ThresholdChoice,
  defaultSteps?: number,
): ThresholdGrid {
  if (choice.axis) return axisGrid(graph, choice.axis, semantics);
  if (choice.threshold) return explicitGrid(choice.threshold, semantics);
  if (choice.density) {
    for (const d of choice.density)
      if (!(d >= 0 && d <= 1)) throw new UsageError(`density ${d} is not in 0..1`);
    return densityGrid(graph, choice.density, semantics);
  }
  if (choice.steps === undefined && choice.range === undefined && defaultSteps === undefined) {
    return allEdgesGrid(graph, semantics);
  }
  const steps = choice.steps ?? defaultSteps ?? 20;
  if (steps < 1) throw new UsageError("--steps must be at least 1");
  const [from, to] = choice.range ?? weightSpan(graph, semantics);
  return evenGrid(from, to, steps, semantics);
}

/** The weights of the first and the last edge to enter the filtration. */
export function weightSpan(graph: WeightedGraph, semantics: WeightSemantics): [number, number] {
  if (graph.weights.length === 0) return [0, 0];
  let min = Infinity;
  let max = -Infinity;
  for (const w of graph.weights) {
    if (w < min) min = w;
    if (w > max) max = w;
  }
  return semantics === "distance" ? [min, max] : [max, min];
}

function parseRange(text: string): [number, number] {
  const parts = text.split(":");
  if (parts.length !== 2) throw new UsageError(`expected FROM:TO, got "${text}"`);
  return [finiteNumber(parts[0]), finiteNumber(parts[1])];
}
