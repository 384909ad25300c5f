import { PCA } from "ml-pca";
import type { RunFolder } from "./run-folder.js";

export interface FeatureMap {
  /** x, y per graph (run order). */
  points: [number, number][];
  /** Share of the variance each of the two axes explains. */
  explained: [number, number];
  /** Feature columns used: finite in every row and not constant. */
  columns: number;
}

/**
 * A 2-D map of the feature table: principal component analysis of the standardised columns (each column
 * centred and scaled to unit variance; constant or incomplete columns left out), via ml-pca.
 */
export function featureMap(run: RunFolder): FeatureMap | null {
  const rows = run.graphs;
  if (rows.length < 3) return null;
  const keep: number[] = [];
  for (let j = 0; j < run.featureNames.length; j++) {
    const first = rows[0].values[j];
    let finite = true;
    let constant = true;
    for (const row of rows) {
      if (!Number.isFinite(row.values[j])) finite = false;
      if (row.values[j] !== first) constant = false;
    }
    if (finite && !constant) keep.push(j);
  }
  if (keep.length < 2) return null;
  const matrix = rows.map((row) => keep.map((j) => row.values[j]));
  const pca = new PCA(matrix, { scale: true });
  const projected = pca.predict(matrix, { nComponents: 2 }).to2DArray();
  const explained = pca.getExplainedVariance();
  return {
    points: projected.map((p) => [p[0], p[1]] as [number, number]),
    explained: [explained[0], explained[1]],
    columns: keep.length,
  };
}
