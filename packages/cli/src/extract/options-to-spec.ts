import { NULL_SCORE_FEATURES } from "@cliquescape/core";
import { connectivityFromOptions } from "../options/connectivity-options.js";
import { UsageError } from "../options/graph-options.js";
import { readSpecFile } from "./load-spec.js";

type Raw = Record<string, unknown>;

/**
 * The spec a command line asks for: the --spec file (if any) with every option the user typed laid over it.
 * Options not typed leave the file's settings alone. When an option changes the grid or the preparation,
 * a resolved grid carried by the file no longer applies and is dropped (it will be resolved again).
 */
export function optionsToSpec(raw: Raw, given: (name: string) => boolean): { spec: Raw; source: string } {
  const file = raw.spec as string | undefined;
  const base: Raw = file ? readSpecFile(file) : {};
  const spec: Raw = { ...base };
  const section = (key: string, values: Raw) => {
    const set = Object.fromEntries(Object.entries(values).filter(([, v]) => v !== undefined));
    if (Object.keys(set).length > 0) spec[key] = { ...(base[key] as Raw | undefined), ...set };
    return Object.keys(set).length > 0;
  };

  if (raw.directed && raw.undirected) throw new UsageError("--directed and --undirected exclude each other");
  const prepared = section("preparation", {
    directed: raw.directed ? "directed" : raw.undirected ? "undirected" : undefined,
    weights: raw.weights,
    symmetrize: raw.symmetrize,
    negatives: raw.negatives,
    zeroEdges: raw.zeroEdges,
    nanCells: raw.nanCells,
    maxNodes: raw.maxNodes,
    maxFileMiB: raw.maxFile,
    transform: raw.transform,
  });
  const connectivity = connectivityFromOptions(raw);
  const measured = connectivity !== undefined && section("connectivity", connectivity);
  section("complex", {
    topDim: raw.topDim,
    prime: raw.prime,
    simplexBudget: raw.budget,
    homologyMemoryMiB: raw.memory,
    barcodeRange: raw.barcodeRange,
    timeLimitSeconds: raw.timeLimit === 0 ? null : raw.timeLimit,
  });
  const gridChanged = gridFromOptions(raw, spec, base);
  nodeThresholdFromOptions(raw, spec);
  if (raw.families !== undefined) spec.families = familiesFromList(raw.families as string[]);
  if (raw.nullFeatures !== undefined) nullFeaturesFromList(raw.nullFeatures as string[]);
  section("nullScores", {
    model: raw.nullModel === "none" ? null : raw.nullModel,
    samples: raw.nullSamples,
    seed: raw.nullSeed,
    features: raw.nullFeatures,
  });
  const nullModel = (spec.nullScores as Raw | undefined)?.model;
  const nullSettings = [raw.nullSamples, raw.nullSeed, raw.nullFeatures].some((x) => x !== undefined);
  if (nullSettings && (nullModel === undefined || nullModel === null))
    throw new UsageError(
      "--null-samples, --null-seed and --null-features set the z-scored columns: add --null-model er|rewire|shuffle",
    );
  section("outputs", {
    bundles: given("bundles") ? raw.bundles : undefined,
    barcodes: given("barcodes") ? raw.barcodes : undefined,
  });
  if ((prepared || measured || gridChanged) && spec.resolvedGrid !== undefined) {
    delete spec.resolvedGrid;
    process.stderr.write(
      "cliquescape: the options change the grid, the preparation or the measure: the grid is chosen anew\n",
    );
  }
  return { spec, source: file ?? "the command line" };
}

function gridFromOptions(raw: Raw, spec: Raw, base: Raw): boolean {
  const chosen = [raw.threshold, raw.density, raw.steps ?? raw.quantiles].filter((x) => x !== undefined);
  if (chosen.length > 1) throw new UsageError("use only one of --threshold, --density, --steps/--quantiles");
  if (raw.threshold !== undefined) spec.grid = { kind: "weights", values: raw.threshold };
  else if (raw.density !== undefined) spec.grid = { kind: "densities", values: raw.density };
  else if (raw.steps !== undefined || raw.quantiles !== undefined) {
    const previous = (base.grid as Raw | undefined)?.kind === "quantiles" ? (base.grid as Raw) : {};
    const [from, to] = (raw.quantiles as [number, number] | undefined) ?? [previous.from, previous.to];
    spec.grid = { ...previous, kind: "quantiles", steps: raw.steps ?? previous.steps, from, to };
  } else return false;
  return true;
}

function nodeThresholdFromOptions(raw: Raw, spec: Raw): void {
  const chosen = [raw.nodeThreshold, raw.nodeDensity, raw.nodeAllEdges].filter((x) => x !== undefined);
  if (chosen.length > 1)
    throw new UsageError("use only one of --node-threshold, --node-density, --node-all-edges");
  const threshold =
    raw.nodeThreshold !== undefined
      ? { kind: "weight", value: raw.nodeThreshold }
      : raw.nodeDensity !== undefined
        ? { kind: "density", value: raw.nodeDensity }
        : raw.nodeAllEdges
          ? { kind: "all" }
          : undefined;
  if (threshold) spec.nodeFeatures = { threshold };
}

const FAMILIES = [
  "simplexCounts",
  "euler",
  "betti",
  "curveSummaries",
  "barcodeSummaries",
  "network",
  "landscapes",
  "images",
  "entropy",
  "persistenceCurves",
] as const;

function familiesFromList(list: string[]): Raw {
  for (const name of list) {
    if (!(FAMILIES as readonly string[]).includes(name)) {
      throw new UsageError(`--families: unknown family "${name}"; choose from ${FAMILIES.join(", ")}`);
    }
  }
  return Object.fromEntries(FAMILIES.map((name) => [name, list.includes(name)]));
}

function nullFeaturesFromList(list: string[]): void {
  for (const name of list) {
    if (!(NULL_SCORE_FEATURES as readonly string[]).includes(name)) {
      throw new UsageError(
        `--null-features: unknown feature "${name}"; choose from ${NULL_SCORE_FEATURES.join(", ")}`,
      );
    }
  }
}
