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
 * centred and scaled to unit sample variance; constant or incomplete columns left out). The covariance
 * matrix of the standardised columns is summed here over typed arrays and ml-pca finds its eigenvectors;
 * only the two components shown are projected. (ml-pca's own path — an SVD of the whole table through
 * ml-matrix's element accessors, then every component projected — took about 0.3 s of a 1,000-graph
 * report's opening.) A component's sign is arbitrary: each is turned so that its largest loading is
 * positive (the convention of scikit-learn's `svd_flip` on the components, as recalled from memory), so
 * the map is the same on every opening.
 */
export function featureMap(run: RunFolder): FeatureMap | null {
  const rows = run.graphs;
  const n = rows.length;
  if (n < 3) return null;
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
  const p = keep.length;
  if (p < 2) return null;
  // Standardised table, row-major: z[i * p + c].
  const z = new Float64Array(n * p);
  keep.forEach((j, c) => {
    let mean = 0;
    for (let i = 0; i < n; i++) mean += rows[i].values[j];
    mean /= n;
    let squares = 0;
    for (let i = 0; i < n; i++) squares += (rows[i].values[j] - mean) ** 2;
    const sd = Math.sqrt(squares / (n - 1));
    for (let i = 0; i < n; i++) z[i * p + c] = (rows[i].values[j] - mean) / sd;
  });
  // Covariance of the standardised columns (the correlation matrix), upper triangle summed row by row.
  const sums = new Float64Array(p * p);
  for (let i = 0; i < n; i++) {
    const row = i * p;
    for (let a = 0; a < p; a++) {
      const za = z[row + a];
      if (za === 0) continue;
      const out = a * p;
      for (let b = a; b < p; b++) sums[out + b] += za * z[row + b];
    }
  }
  const covariance = Array.from({ length: p }, () => new Array<number>(p));
  for (let a = 0; a < p; a++)
    for (let b = a; b < p; b++) covariance[a][b] = covariance[b][a] = sums[a * p + b] / (n - 1);
  const pca = new PCA(covariance, { isCovarianceMatrix: true });
  const vectors = pca.getEigenvectors();
  const axes = [0, 1].map((k) => {
    const w = vectors.getColumn(k);
    let largest = 0;
    for (let c = 1; c < p; c++) if (Math.abs(w[c]) > Math.abs(w[largest])) largest = c;
    return w[largest] < 0 ? w.map((x) => -x) : w;
  });
  const points: [number, number][] = [];
  for (let i = 0; i < n; i++) {
    let x = 0;
    let y = 0;
    for (let c = 0; c < p; c++) {
      x += z[i * p + c] * axes[0][c];
      y += z[i * p + c] * axes[1][c];
    }
    points.push([x, y]);
  }
  const explained = pca.getExplainedVariance();
  return { points, explained: [explained[0], explained[1]], columns: p };
}
