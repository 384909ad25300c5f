import {
  allEdgesGrid,
  type Barcode,
  edgeCount,
  type FeatureConfig,
  type WeightedGraph,
  type WorkControl,
} from "@cliquescape/core";
import { type DatasetEntry, graphFeatures } from "@cliquescape/io";
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
    const features = graphFeatures(graph, {
      config: featureConfigOf(spec),
      axis: spec.resolvedGrid,
      semantics,
      countBudget: spec.complex.simplexBudget ?? undefined,
      homologyBudget: { maxBytes: spec.complex.homologyMemoryMiB * 2 ** 20 },
      work,
    });
    const barcodeJson =
      spec.outputs.barcodes && features.barcode
        ? barcodeDocument(entry.id, relativeFile, graph, features.barcode, features.grid.thresholds, spec)
        : null;
    const bundle = spec.outputs.bundles ? gnnBundle(graph, labelCode, spec, coordinates, work) : null;
    return {
      ok: true,
      values: features.values,
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
    return { ok: false, failure: graphFailureOf(error, relativeFile), warnings };
  }
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
