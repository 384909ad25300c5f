// The run page's summaries of a run folder against numpy and scikit-learn on the same features.csv:
// per-label mean and sample standard deviation of a curve (numpy mean, std(ddof=1)), and the feature
// map's principal components (sklearn.preprocessing.StandardScaler + sklearn.decomposition.PCA).
import { readFileSync, rmSync } from "node:fs";
import { dirname, join } from "node:path";
import { axisSuffixes } from "@cliquescape/core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { featureMap } from "../../packages/viewer/src/run/feature-map.js";
import { labelCurves } from "../../packages/viewer/src/run/label-curves.js";
import { type RunFolder, readRunFolder, runCurves } from "../../packages/viewer/src/run/run-folder.js";
import { demoSubsetRun } from "../browser/demo-subset.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";

const missing = missingPythonModules(["numpy", "sklearn"]);

interface Reference {
  labels: Record<string, { mean: number[]; sd: number[] }>;
  explained: [number, number];
  points: [number, number][];
}

describe.skipIf(missing)(
  `run page summaries vs numpy and scikit-learn${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    let folder: string;
    let run: RunFolder;
    let reference: Reference;

    beforeAll(() => {
      folder = demoSubsetRun(4);
      const read = (name: string) => readFileSync(join(folder, name), "utf8");
      run = readRunFolder({
        "spec.json": read("spec.json"),
        "features.csv": read("features.csv"),
        "errors.csv": read("errors.csv"),
      });
      reference = runPythonScript<Reference>("run_summaries.py", {
        features: join(folder, "features.csv"),
        curve: "betti_d1",
        axis: axisSuffixes(run.settings.axis),
      });
    });
    afterAll(() => rmSync(dirname(folder), { recursive: true, force: true }));

    it("reads the run: 12 graphs, three labels, the curves extract wrote", () => {
      expect(run.graphs).toHaveLength(12);
      expect(run.settings.labelNames).toEqual(["islands", "ring", "scrambled"]);
      expect(runCurves(run)).toEqual([
        "betti_d0",
        "betti_d1",
        "betti_d2",
        "euler",
        "simplices_d1",
        "simplices_d2",
        "simplices_d3",
      ]);
    });

    it("gives each label's mean β1 curve and its sample standard deviation as numpy does", () => {
      const curves = labelCurves(run, "betti_d1");
      expect(curves.map((c) => c.label)).toEqual(Object.keys(reference.labels));
      for (const curve of curves) {
        const ref = reference.labels[curve.label];
        curve.mean.forEach((m, t) => {
          expect(m).toBeCloseTo(ref.mean[t], 10);
        });
        curve.sd.forEach((s, t) => {
          expect(s).toBeCloseTo(ref.sd[t], 10);
        });
      }
    });

    it("maps the feature table on the principal components sklearn finds (same variance shares, same points up to sign and scale)", () => {
      const map = featureMap(run)!;
      expect(map.explained[0]).toBeCloseTo(reference.explained[0], 8);
      expect(map.explained[1]).toBeCloseTo(reference.explained[1], 8);
      // ml-pca scales by the sample standard deviation, StandardScaler by the population one: the scores differ
      // by a constant factor per component, and a component's sign is arbitrary. Compare unit-length columns.
      for (const axis of [0, 1]) {
        const ours = map.points.map((p) => p[axis]);
        const theirs = reference.points.map((p) => p[axis]);
        const unit = (xs: number[]) => {
          const norm = Math.hypot(...xs);
          return xs.map((x) => x / norm);
        };
        const a = unit(ours);
        const b = unit(theirs);
        const sign = Math.sign(a.reduce((s, x, i) => s + x * b[i], 0));
        a.forEach((x, i) => {
          expect(sign * x).toBeCloseTo(b[i], 8);
        });
      }
    });
  },
);
