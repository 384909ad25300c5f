import {
  allEdgesGrid,
  type Barcode,
  edgeCount,
  type FeatureConfig,
  type NullScoreConfig,
  nullScoreNames,
  nullScoreValues,
  type WeightedGraph,
  type WorkControl,
} from "@cliquescape/core";
import { type DatasetEntry, graphFeatureNames, graphFeatures } from "@cliquescape/io";
import { cliMessage } from "../cli-message.js";
import { type BarcodeReport, renderBarcode } from "../commands/barcode.js";
import { gnnBundle } from "./gnn-bundle.js";
import { type GraphFailure, graphFailureOf } from "./graph-failure.js";
import { readPreparedGraph } from "./read-prepared-graph.js";
import type { ResolvedRunSpec } from "./run-spec.js";

/** What one graph gives: its feature row and, as asked, its barcode and GNN bundle, ready to be written. */
export interface GraphProduct {
  ok: true;
  values: Float64Array;
  /** The weight thresholds this graph was read at (differ per graph on a density axis). */
  thresholds: number[];
  barcodeJson: string | null;
  bundle: Uint8Array | null;
  nodes: number;
  edges: number;
  directed: boolean;
  truncated: boolean | null;
  warnings: string[];
}

export type GraphOutcome = GraphProduct | { ok: false; failure: GraphFailure; warnings: string[] };

/** The feature configuration of the core's feature functions, from the spec. */
export function featureConfigOf(spec: ResolvedRunSpec): FeatureConfig {
  return {
    families: spec.families,
    topDim: spec.complex.topDim,
    prime: spec.complex.prime,
    barcodeRange: spec.complex.barcodeRange,
    vectorisation: spec.vectorisation,
  };
}

/** The z-scored columns' settings, or null when the spec asks for none. */
export function nullScoreConfigOf(spec: ResolvedRunSpec): NullScoreConfig | null {
  const { model, ...rest } = spec.nullScores;
  return model === null ? null : { model, ...rest };
}

/** Every column of the feature tables: the core's families, the network family, then the z-scores. */
export function runFeatureNames(spec: ResolvedRunSpec): string[] {
  const names = graphFeatureNames(featureConfigOf(spec), spec.resolvedGrid);
  const nulls = nullScoreConfigOf(spec);
  return nulls ? names.concat(nullScoreNames(nulls, spec.complex.topDim)) : names;
}

/**
 * Reads, prepares and computes one graph. Never throws for a problem of the graph itself: the problem comes
 * back as a failure with file and position, so the rest of the dataset goes on.
 */
export function computeGraph(
  entry: DatasetEntry,
  relativeFile: string,
  labelCode: number,
  spec: ResolvedRunSpec,
  work: WorkControl = {},
): GraphOutcome {
  let warnings: string[] = [];
  try {
    const read = readPreparedGraph(entry, spec.preparation, spec.connectivity);
    warnings = read.warnings.map(cliMessage);
    const { graph, coordinates } = read;
    const semantics = spec.preparation.weights;
    const countBudget = spec.complex.simplexBudget ?? undefined;
    const homologyBudget = { maxBytes: spec.complex.homologyMemoryMiB * 2 ** 20 };
    const features = graphFeatures(graph, {
      config: featureConfigOf(spec),
      axis: spec.resolvedGrid,
      semantics,
      countBudget,
      homologyBudget,
      work,
    });
    const nulls = nullScoreConfigOf(spec);
    // Seeded per sample and computed in this one thread: the same values with any number of workers.
    const values = nulls
      ? concat(
          features.values,
          nullScoreValues(graph, {
            config: nulls,
            topDim: spec.complex.topDim,
            prime: spec.complex.prime,
            axis: spec.resolvedGrid,
            semantics,
            countBudget,
            homologyBudget,
            work,
          }),
        )
      : features.values;
    const barcodeJson =
      spec.outputs.barcodes && features.barcode
        ? barcodeDocument(entry.id, relativeFile, graph, features.barcode, features.grid.thresholds, spec)
        : null;
    const bundle = spec.outputs.bundles ? gnnBundle(graph, labelCode, spec, coordinates, work) : null;
    return {
      ok: true,
      values,
      thresholds: Array.from(features.grid.thresholds),
      barcodeJson,
      bundle,
      nodes: graph.n,
      edges: edgeCount(graph),
      directed: graph.directed,
      truncated: features.truncated,
      warnings,
    };
  } catch (error) {
    // The absolute file, like a reader error's: saveGraph makes every failure's file relative once.
    return { ok: false, failure: graphFailureOf(error, entry.file), warnings };
  }
}

function concat(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(a.length + b.length);
  out.set(a);
  out.set(b, a.length);
  return out;
}

/**
 * The barcode in the same JSON layout as `cliquescape barcode --format json`, plus the graph's id. `end` is
 * where the filtration stops: the grid's last threshold for barcodeRange "axis", the last edge for "full".
 */
function barcodeDocument(
  id: string,
  file: string,
  graph: WeightedGraph,
  barcode: Barcode,
  thresholds: Float64Array,
  spec: ResolvedRunSpec,
): string {
  const semantics = spec.preparation.weights;
  const end =
    spec.complex.barcodeRange === "axis"
      ? thresholds[thresholds.length - 1]
      : allEdgesGrid(graph, semantics).thresholds[0];
  const report: BarcodeReport & { id: string } = {
    id,
    file,
    directed: graph.directed,
    weights: spec.preparation.weights,
    prime: barcode.prime,
    start: barcode.start,
    end,
    bars: barcode.bars.map((bar) => ({ dim: bar.dim, birth: bar.birth, death: bar.death })),
  };
  return renderBarcode(report, "json");
}
