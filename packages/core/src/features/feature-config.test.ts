import { describe, expect, it } from "vitest";
import { MAX_PRIME } from "../homology/prime-field.js";
import {
  checkFeatureConfig,
  DEFAULT_FEATURE_CONFIG,
  type FeatureConfig,
  type FeatureFamilies,
  needsBarcode,
  needsVectorisation,
  type VectorisationConfig,
} from "./feature-config.js";

const base = DEFAULT_FEATURE_CONFIG;
const withVectorisation = (v: Partial<Record<keyof VectorisationConfig, unknown>>): FeatureConfig => ({
  ...base,
  vectorisation: v as Partial<VectorisationConfig>,
});

describe("checkFeatureConfig", () => {
  it("accepts the defaults and every bound of every setting", () => {
    const accepted: FeatureConfig[] = [
      base,
      { ...base, topDim: 1 },
      { ...base, prime: 2 },
      { ...base, prime: MAX_PRIME },
      { ...base, barcodeRange: "full" },
      withVectorisation({ essential: "drop" }),
      withVectorisation({ landscapeLayers: 1 }),
      withVectorisation({ landscapeLayers: 100 }),
      withVectorisation({ imageResolution: 1 }),
      withVectorisation({ imageResolution: 200 }),
      withVectorisation({ imageSigma: 1e-9 }),
      withVectorisation({ imageSigma: null }),
      withVectorisation({ imageWeighting: "none" }),
      withVectorisation({ curves: [] }),
      withVectorisation({ curves: ["entropy", "lifespan"] }),
    ];
    for (const config of accepted) expect(() => checkFeatureConfig(config)).not.toThrow();
  });

  it("refuses each setting out of range, naming it and the value given", () => {
    const refused: [FeatureConfig, string][] = [
      [{ ...base, topDim: 0 }, "topDim must be an integer ≥ 1 (edges at least), got 0"],
      [{ ...base, topDim: 1.5 }, "got 1.5"],
      [{ ...base, barcodeRange: "some" as "axis" }, 'barcodeRange must be "axis" or "full", got "some"'],
      [{ ...base, prime: 4 }, `prime must be a prime between 2 and ${MAX_PRIME}, got 4`],
      // 65537 is prime (a Fermat prime) but above the largest prime the field arithmetic takes.
      [{ ...base, prime: 65537 }, "got 65537"],
      [
        withVectorisation({ essential: "keep" }),
        'vectorisation.essential must be "cut" or "drop", got "keep"',
      ],
      [
        withVectorisation({ landscapeLayers: 0 }),
        "vectorisation.landscapeLayers must be an integer in 1..100, got 0",
      ],
      [withVectorisation({ landscapeLayers: 101 }), "landscapeLayers must be an integer in 1..100, got 101"],
      [withVectorisation({ landscapeLayers: 2.5 }), "landscapeLayers must be an integer in 1..100, got 2.5"],
      [
        withVectorisation({ imageResolution: 0 }),
        "vectorisation.imageResolution must be an integer in 1..200, got 0",
      ],
      [withVectorisation({ imageResolution: 201 }), "imageResolution must be an integer in 1..200, got 201"],
      [withVectorisation({ imageResolution: 3.5 }), "imageResolution must be an integer in 1..200, got 3.5"],
      [
        withVectorisation({ imageSigma: 0 }),
        "vectorisation.imageSigma must be a positive number or null, got 0",
      ],
      [withVectorisation({ imageSigma: -1 }), "imageSigma must be a positive number or null, got -1"],
      [withVectorisation({ imageSigma: Number.POSITIVE_INFINITY }), "got Infinity"],
      [withVectorisation({ imageSigma: Number.NaN }), "got NaN"],
      [
        withVectorisation({ imageWeighting: "square" }),
        'vectorisation.imageWeighting must be "linear" or "none", got "square"',
      ],
      [
        withVectorisation({ curves: ["lifespan", "height"] }),
        'unknown persistence curve "height"; choose from lifespan, normalised-lifespan, entropy',
      ],
    ];
    for (const [config, message] of refused) {
      expect(() => checkFeatureConfig(config), message).toThrow(RangeError);
      expect(() => checkFeatureConfig(config), message).toThrow(message);
    }
  });
});

describe("needsVectorisation and needsBarcode", () => {
  const none: FeatureFamilies = {
    simplexCounts: true,
    euler: true,
    betti: false,
    curveSummaries: false,
    barcodeSummaries: false,
    network: true,
  };
  const only = (family: keyof FeatureFamilies): FeatureConfig => ({
    ...base,
    families: { ...none, [family]: true },
  });

  it("each vectorisation family alone needs the vectorisation and the barcode", () => {
    for (const family of ["landscapes", "images", "entropy", "persistenceCurves"] as const) {
      expect(needsVectorisation(only(family)), family).toBe(true);
      expect(needsBarcode(only(family)), family).toBe(true);
    }
    expect(needsVectorisation({ ...base, families: none })).toBe(false);
  });

  it("each barcode family alone needs the barcode; counts, Euler and network statistics do not", () => {
    for (const family of ["betti", "curveSummaries", "barcodeSummaries"] as const) {
      expect(needsBarcode(only(family)), family).toBe(true);
      expect(needsVectorisation(only(family)), family).toBe(false);
    }
    expect(needsBarcode({ ...base, families: none })).toBe(false);
  });
});
