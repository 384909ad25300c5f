import { describe, expect, it } from "vitest";
import type { FeatureAxis } from "./feature-axis.js";
import { DEFAULT_FEATURE_CONFIG, type FeatureConfig } from "./feature-config.js";
import { topologicalFeatureNames } from "./feature-names.js";
import { topologicalFeatures } from "./topological-features.js";
import { weightedSquare } from "./weighted-square.fixture.js";

// The weighted square (hand-computed barcode, see the fixture): H0 bars [0,1) [0,2) [0,3) and [0, ∞);
// H1 one bar [4, 5). On an axis 0..6 the positions are the weights themselves.
const vectorised: FeatureConfig = {
  ...DEFAULT_FEATURE_CONFIG,
  topDim: 2,
  families: {
    simplexCounts: false,
    euler: false,
    betti: false,
    curveSummaries: false,
    barcodeSummaries: false,
    network: false,
    landscapes: true,
    images: true,
    entropy: true,
    persistenceCurves: true,
  },
};

function row(config: FeatureConfig, axis: FeatureAxis, mirrored = false) {
  const names = topologicalFeatureNames(config, axis);
  const { values } = topologicalFeatures(weightedSquare(mirrored), {
    config,
    axis,
    semantics: mirrored ? "similarity" : "distance",
  });
  expect(values.length).toBe(names.length);
  return (name: string) => {
    const i = names.indexOf(name);
    if (i < 0) throw new Error(`no column ${name}`);
    return values[i];
  };
}

const weights = { kind: "weight", values: [0, 1, 2, 3, 4, 4.5, 5, 6] } as const;

describe("vectorisation families on the weighted square", () => {
  it("landscapes: the H1 bar [4, 5) is a tent of height 0.5 at 4.5 (Bubenik 2015, Definition 3)", () => {
    const get = row(vectorised, weights);
    expect(get("landscape_d1_l1_w4")).toBe(0);
    expect(get("landscape_d1_l1_w4.5")).toBe(0.5);
    expect(get("landscape_d1_l1_w5")).toBe(0);
    expect(get("landscape_d1_l2_w4.5")).toBe(0);
    // H0 with the essential bar cut at 6: tents of [0,1) [0,2) [0,3) [0,6); at 2: 2, 1, 0, 0 → λ1 = 2, λ2 = 1.
    expect(get("landscape_d0_l1_w2")).toBe(2);
    expect(get("landscape_d0_l2_w2")).toBe(1);
    expect(get("landscape_d0_l3_w2")).toBe(0);
  });

  it("entropy: −Σ p ln p of the windowed lengths; essential bars cut at the axis end or dropped", () => {
    const h = (lengths: number[]) => {
      const total = lengths.reduce((s, x) => s + x, 0);
      return -lengths.reduce((s, x) => s + (x / total) * Math.log(x / total), 0);
    };
    expect(row(vectorised, weights)("entropy_d0")).toBeCloseTo(h([1, 2, 3, 6]), 14);
    expect(row(vectorised, weights)("entropy_d1")).toBe(0);
    const dropped = { ...vectorised, vectorisation: { essential: "drop" as const } };
    expect(row(dropped, weights)("entropy_d0")).toBeCloseTo(h([1, 2, 3]), 14);
  });

  it("persistence curves: lifespan at 0 sums every H0 length; the essential bar is alive at the end", () => {
    const get = row(vectorised, weights);
    expect(get("pcurve_lifespan_d0_w0")).toBe(12);
    expect(get("pcurve_lifespan_d0_w6")).toBe(6);
    expect(get("pcurve_lifespan_d1_w4.5")).toBe(1);
    expect(get("pcurve_normlife_d0_w2")).toBeCloseTo(9 / 12, 15);
  });

  it("images: the pixels of H1 sum to at most its weight ℓ / span = 1/6", () => {
    const config = { ...vectorised, vectorisation: { imageResolution: 4 } };
    const names = topologicalFeatureNames(config, weights).filter((n) => n.startsWith("image_d1_"));
    expect(names).toHaveLength(16);
    const get = row(config, weights);
    const mass = names.reduce((s, n) => s + get(n), 0);
    expect(mass).toBeGreaterThan(0.5 / 6); // most of its Gaussian is inside the window
    expect(mass).toBeLessThanOrEqual(1 / 6 + 1e-15);
  });

  // H0 differs: similarity vertices are born at the largest weight (5 here), distance ones at 0.
  it("similarity weights mirrored (6 − w) give the same H1 vectors on the mirrored axis", () => {
    const mirroredAxis = { kind: "weight", values: weights.values.map((w) => 6 - w) } as const;
    const a = topologicalFeatures(weightedSquare(), {
      config: vectorised,
      axis: weights,
      semantics: "distance",
    });
    const b = topologicalFeatures(weightedSquare(true), {
      config: vectorised,
      axis: mirroredAxis,
      semantics: "similarity",
    });
    const names = topologicalFeatureNames(vectorised, weights);
    const h1 = (values: Float64Array) => Array.from(values).filter((_, i) => names[i].includes("_d1"));
    expect(h1(b.values)).toEqual(h1(a.values));
    expect(h1(a.values).some((x) => x > 0)).toBe(true);
  });

  it("a density axis reads the same bars in density units: H1 lives from 4/6 to 5/6 of the possible edges", () => {
    const axis = { kind: "density", values: [0, 0.5, 0.75, 1] } as const;
    const get = row({ ...vectorised, topDim: 2 }, axis);
    // The tent of [4/6, 5/6) at 0.75: min(0.75 − 4/6, 5/6 − 0.75) = 1/12.
    expect(get("landscape_d1_l1_dens0.75")).toBeCloseTo(1 / 12, 15);
  });

  it("names depend on the configuration only: layers, resolution, curves", () => {
    const config = {
      ...vectorised,
      vectorisation: { landscapeLayers: 2, imageResolution: 3, curves: ["entropy" as const] },
    };
    const names = topologicalFeatureNames(config, weights);
    expect(names.filter((n) => n.startsWith("landscape_"))).toHaveLength(2 * 2 * weights.values.length);
    expect(names.filter((n) => n.startsWith("image_"))).toHaveLength(2 * 9);
    expect(names.filter((n) => n.startsWith("pcurve_"))).toEqual(
      [0, 1].flatMap((k) => weights.values.map((w) => `pcurve_entropy_d${k}_w${w}`)),
    );
  });

  it("each family alone gives its own columns only, with the values it has among all four", () => {
    const names = topologicalFeatureNames(vectorised, weights);
    const { values } = topologicalFeatures(weightedSquare(), {
      config: vectorised,
      axis: weights,
      semantics: "distance",
    });
    const off = { landscapes: false, images: false, entropy: false, persistenceCurves: false };
    for (const family of ["landscapes", "images", "entropy", "persistenceCurves"] as const) {
      const config = { ...vectorised, families: { ...vectorised.families, ...off, [family]: true } };
      const own = topologicalFeatureNames(config, weights);
      expect(own.length, family).toBeGreaterThan(0);
      // row() checks that the values are exactly as many as the names.
      const get = row(config, weights);
      for (const name of own) expect(get(name), name).toBe(values[names.indexOf(name)]);
    }
  });

  it("entropy reads lengths death − birth, also when bars are born away from the axis start", () => {
    // Mirrored square as similarities on the axis 6 … 0 (positions 6 − w): vertices are born at weight 5
    // (position 1); H0 bars [1, 2) and [1, 3) in positions (the one dying at 5 has length 0 and is not
    // kept), the essential one cut at 6 → lengths 1, 2, 5 (worked by hand from the fixture's description).
    const h = (lengths: number[]) => {
      const total = lengths.reduce((s, x) => s + x, 0);
      return -lengths.reduce((s, x) => s + (x / total) * Math.log(x / total), 0);
    };
    const mirroredAxis = { kind: "weight", values: weights.values.map((w) => 6 - w) } as const;
    expect(row(vectorised, mirroredAxis, true)("entropy_d0")).toBeCloseTo(h([1, 2, 5]), 14);
  });

  it("a one-value axis has no width: every image pixel is 0", () => {
    const config = {
      ...vectorised,
      families: { ...vectorised.families, landscapes: false, entropy: false, persistenceCurves: false },
      vectorisation: { imageResolution: 3 },
    };
    const axis = { kind: "weight", values: [4.5] } as const;
    const names = topologicalFeatureNames(config, axis);
    expect(names).toHaveLength(2 * 9);
    const get = row(config, axis);
    for (const name of names) expect(get(name), name).toBe(0);
  });

  it("imageSigma is a fraction of the axis span: 0.25 of a span of 6 is the one-pixel default at 4 pixels", () => {
    // Default sigma: one pixel = span / resolution = 6 / 4 = 1.5 = 0.25 · 6 (the option's documented meaning).
    const images = { ...vectorised.families, landscapes: false, entropy: false, persistenceCurves: false };
    const at = (sigma: number | null) =>
      topologicalFeatures(weightedSquare(), {
        config: { ...vectorised, families: images, vectorisation: { imageResolution: 4, imageSigma: sigma } },
        axis: weights,
        semantics: "distance",
      }).values;
    const byDefault = at(null);
    expect(Array.from(at(0.25))).toEqual(Array.from(byDefault));
    expect(byDefault.some((x) => x > 0)).toBe(true);
    expect(Array.from(at(0.05))).not.toEqual(Array.from(byDefault));
  });
});
