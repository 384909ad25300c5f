import type { PersistenceCurveKind } from "../vectorise/persistence-curve.js";
import { axisLabels } from "./axis-labels.js";
import type { FeatureAxis } from "./feature-axis.js";
import { type FeatureConfig, vectorisationOf } from "./feature-config.js";

/** The short name of each persistence curve in column names. */
export const CURVE_KIND_NAMES: Record<PersistenceCurveKind, string> = {
  lifespan: "lifespan",
  "normalised-lifespan": "normlife",
  entropy: "entropy",
};

/** Statistics read off the bars of each homology dimension, in column order. */
export const BAR_STATISTICS = [
  "count",
  "essential",
  "total_persistence",
  "max_persistence",
  "entropy",
] as const;

/** Numbers read off each curve, in column order. */
export const CURVE_STATISTICS = ["max", "peak_at", "area"] as const;

/**
 * Names of the curves a configuration has, in column order: simplex counts of dimensions 1..topDim
 * (dimension 0 is the node count, the same at every threshold), the Euler characteristic, Betti numbers of
 * dimensions 0..topDim−1. Curve summaries cover all of them, whether or not the curves are columns too.
 */
export function curveNames(config: FeatureConfig): string[] {
  const names: string[] = [];
  for (let k = 1; k <= config.topDim; k++) names.push(`simplices_d${k}`);
  names.push("euler");
  for (let k = 0; k < config.topDim; k++) names.push(`betti_d${k}`);
  return names;
}

/** Column suffix of each axis value: `w0.45` for a weight threshold, `dens0.1` for an edge density. */
export function axisSuffixes(axis: FeatureAxis): string[] {
  const prefix = axis.kind === "weight" ? "w" : "dens";
  return axisLabels(axis.values).map((label) => prefix + label);
}

/**
 * Column names of the topological families, in the order `topologicalFeatures` fills them. They depend on
 * the configuration and the axis only, never on a graph, so every row of a dataset has the same columns:
 *
 * - simplex counts: `simplices_d{k}_{axis}` for k = 1..topDim, each over the whole axis;
 * - Euler characteristic: `euler_{axis}`;
 * - Betti numbers: `betti_d{k}_{axis}` for k = 0..topDim−1;
 * - curve summaries: `{curve}_max`, `{curve}_peak_at`, `{curve}_area` for every curve of `curveNames`;
 * - barcode summaries: `bars_d{k}_{count|essential|total_persistence|max_persistence|entropy}`;
 * - landscapes: `landscape_d{k}_l{j}_{axis}` for layers j = 1..landscapeLayers;
 * - images: `image_d{k}_b{x}_p{y}`, pixel x along birth and y along persistence, from 0;
 * - entropy: `entropy_d{k}`;
 * - persistence curves: `pcurve_{lifespan|normlife|entropy}_d{k}_{axis}`.
 *
 * `{axis}` is `w` or `dens` followed by the axis value (see axisLabels). The network family is not here:
 * its columns come from @cliquescape/io and follow these.
 */
export function topologicalFeatureNames(config: FeatureConfig, axis: FeatureAxis): string[] {
  const { families, topDim } = config;
  const suffixes = axisSuffixes(axis);
  const names: string[] = [];
  const curve = (name: string) => {
    for (const suffix of suffixes) names.push(`${name}_${suffix}`);
  };
  if (families.simplexCounts) for (let k = 1; k <= topDim; k++) curve(`simplices_d${k}`);
  if (families.euler) curve("euler");
  if (families.betti) for (let k = 0; k < topDim; k++) curve(`betti_d${k}`);
  if (families.curveSummaries) {
    for (const name of curveNames(config)) for (const stat of CURVE_STATISTICS) names.push(`${name}_${stat}`);
  }
  if (families.barcodeSummaries) {
    for (let k = 0; k < topDim; k++) for (const stat of BAR_STATISTICS) names.push(`bars_d${k}_${stat}`);
  }
  const v = vectorisationOf(config);
  if (families.landscapes) {
    for (let k = 0; k < topDim; k++)
      for (let j = 1; j <= v.landscapeLayers; j++) curve(`landscape_d${k}_l${j}`);
  }
  if (families.images) {
    const r = v.imageResolution;
    for (let k = 0; k < topDim; k++)
      for (let x = 0; x < r; x++) for (let y = 0; y < r; y++) names.push(`image_d${k}_b${x}_p${y}`);
  }
  if (families.entropy) for (let k = 0; k < topDim; k++) names.push(`entropy_d${k}`);
  if (families.persistenceCurves) {
    for (const kind of v.curves)
      for (let k = 0; k < topDim; k++) curve(`pcurve_${CURVE_KIND_NAMES[kind]}_d${k}`);
  }
  return names;
}
