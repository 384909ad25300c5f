import type { WeightedGraph } from "../graph/weighted-graph.js";
import type { Barcode } from "../homology/barcode.js";
import { axisPositions } from "../vectorise/axis-positions.js";
import { persistenceCurve } from "../vectorise/persistence-curve.js";
import { persistenceImage } from "../vectorise/persistence-image.js";
import { persistenceLandscape } from "../vectorise/persistence-landscape.js";
import { windowedDiagram } from "../vectorise/windowed-diagram.js";
import { persistenceEntropy } from "./bar-summary.js";
import { needsVectorisation, vectorisationOf } from "./feature-config.js";
import type { TopologicalFeatureOptions } from "./topological-features.js";

/**
 * Appends the vectorisation families' values to `values`, in the order of topologicalFeatureNames: the
 * barcode is read through the axis window (windowedDiagram) in axis positions (axisPositions), so every
 * graph's landscapes, images and curves sit on the same grid.
 */
export function vectorisationValues(
  graph: WeightedGraph,
  barcode: Barcode,
  options: TopologicalFeatureOptions,
  values: number[],
): void {
  const { config, axis, semantics } = options;
  if (!needsVectorisation(config)) return;
  const { families, topDim } = config;
  const v = vectorisationOf(config);
  const { position, samples, span } = axisPositions(graph, axis, semantics);
  const diagrams = Array.from({ length: topDim }, (_, k) =>
    windowedDiagram(barcode, k, position, span, v.essential),
  );
  const push = (xs: ArrayLike<number>) => {
    for (let i = 0; i < xs.length; i++) values.push(xs[i]);
  };
  if (families.landscapes) {
    for (const d of diagrams) push(persistenceLandscape(d.births, d.deaths, v.landscapeLayers, samples));
  }
  if (families.images) {
    const r = v.imageResolution;
    // A one-value axis has no width: its image is all zeros (nothing can be placed on it).
    for (const d of diagrams) {
      if (!(span > 0)) {
        push(new Float64Array(r * r));
        continue;
      }
      push(
        persistenceImage(d.births, d.deaths, {
          birthRange: [0, span],
          persistenceRange: [0, span],
          resolution: [r, r],
          sigma: v.imageSigma === null ? span / r : v.imageSigma * span,
          weighting: v.imageWeighting,
        }),
      );
    }
  }
  if (families.entropy) {
    for (const d of diagrams) values.push(persistenceEntropy(d.deaths.map((x, i) => x - d.births[i])));
  }
  if (families.persistenceCurves) {
    for (const kind of v.curves) for (const d of diagrams) push(persistenceCurve(d, kind, samples));
  }
}
