import { curveColumns, type RunFolder } from "./run-folder.js";

/** One label's curve across the run: mean and standard deviation at every grid value. */
export interface LabelCurve {
  label: string;
  graphs: number;
  mean: number[];
  /** Sample standard deviation (n − 1); 0 for a single graph. */
  sd: number[];
}

/** Mean and spread of a curve (e.g. "betti_d1") per label, over the graphs that have it. */
export function labelCurves(run: RunFolder, curve: string): LabelCurve[] {
  const columns = curveColumns(run, curve);
  if (!columns) return [];
  return run.settings.labelNames.flatMap((label) => {
    const rows = run.graphs.filter((g) => g.label === label);
    if (rows.length === 0) return [];
    const mean = columns.map((c) => rows.reduce((sum, g) => sum + g.values[c], 0) / rows.length);
    const sd = columns.map((c, t) => {
      if (rows.length < 2) return 0;
      const ss = rows.reduce((sum, g) => sum + (g.values[c] - mean[t]) ** 2, 0);
      return Math.sqrt(ss / (rows.length - 1));
    });
    return [{ label, graphs: rows.length, mean, sd }];
  });
}
