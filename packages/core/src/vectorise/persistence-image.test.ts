import { describe, expect, it } from "vitest";
import { persistenceImage } from "./persistence-image.js";

// H. Adams et al., "Persistence images: a stable vector representation of persistent homology", JMLR 18
// (2017), Section 4: the image integrates the persistence surface Σ w(u) φ_u over each pixel, so when the
// pixels cover the support the pixels sum to Σ w(u) up to the Gaussian tails.
describe("persistence images (Adams et al. 2017)", () => {
  const births = [1, 2.5, 3, 4.2];
  const deaths = [2, 5, 7, 4.9];

  it("total mass equals the sum of the weights when the grid covers the support", () => {
    const sigma = 0.3;
    for (const weighting of ["none", "linear"] as const) {
      const image = persistenceImage(births, deaths, {
        birthRange: [-2, 8],
        persistenceRange: [-2, 7],
        resolution: [23, 17],
        sigma,
        weighting,
        rampEnd: 5,
      });
      const mass = image.reduce((s, x) => s + x, 0);
      const weights = births.map((b, i) => (weighting === "none" ? 1 : Math.min(1, (deaths[i] - b) / 5)));
      // The nearest range edge is 3 persistence units = 10 σ from a point: tails below 1e-20.
      expect(mass).toBeCloseTo(
        weights.reduce((s, w) => s + w, 0),
        12,
      );
    }
  });

  it("a grid cut through a point's centre keeps half of its mass along that axis", () => {
    const image = persistenceImage([0], [3], {
      birthRange: [0, 10],
      persistenceRange: [-10, 20],
      resolution: [5, 5],
      sigma: 0.5,
      weighting: "none",
    });
    expect(image.reduce((s, x) => s + x, 0)).toBeCloseTo(0.5, 14);
  });

  it("pixels are the exact integrals: one pixel equal to the product of two normal masses", () => {
    const image = persistenceImage([0], [1], {
      birthRange: [-1, 1],
      persistenceRange: [0, 2],
      resolution: [2, 2],
      sigma: 1,
      weighting: "none",
    });
    // Φ(0) − Φ(−1) = 0.3413447460685429 (standard normal table; recalled from memory);
    // pixel (birth 0..1, persistence 1..2) = (Φ(1) − Φ(0)) (Φ(1) − Φ(0)).
    const q = 0.3413447460685429;
    expect(image[1 * 2 + 1]).toBeCloseTo(q * q, 14);
    expect(image[0 * 2 + 0]).toBeCloseTo(q * q, 14);
  });
});

describe("persistence images: the grid's far edges are the ranges' ends", () => {
  // "Persistence images: a stable vector representation of persistent homology" (JMLR 18, 2017),
  // Section 4: the pixels split the ranges [b0, b1] × [p0, p1]. A Gaussian centred on a pixel's edge keeps
  // half its mass on each side, however small σ (worked by hand), so a point at (b1, p1) puts 1/2 × 1/2 in
  // the last pixel. With [0.1, 1] split in 3, 0.1 + 3 × 0.3 is 0.9999999999999999 in floating point: the
  // last edge must be the range's end itself, not a sum of widths. σ = 1e-320 (subnormal) makes the normal
  // masses of the other pixels erf(±∞) differences.
  it("a point on the ranges' ends keeps a quarter of its mass in the last pixel", () => {
    const image = persistenceImage([1], [2], {
      birthRange: [0.1, 1],
      persistenceRange: [0.1, 1],
      resolution: [3, 3],
      sigma: 1e-320,
      weighting: "none",
    });
    expect(Array.from(image)).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 0.25]);
  });
});

describe("persistence images: the options are checked", () => {
  const options = {
    birthRange: [0, 1],
    persistenceRange: [0, 1],
    resolution: [2, 2],
    sigma: 0.5,
    weighting: "none",
  } as const;
  const image = (change: object) => () => persistenceImage([0], [1], { ...options, ...change });

  it("accepts one pixel along either axis", () => {
    expect(image({ resolution: [1, 3] })()).toHaveLength(3);
    expect(image({ resolution: [3, 1] })()).toHaveLength(3);
    expect(image({ resolution: [1, 1] })()).toHaveLength(1);
  });

  it("refuses pixel counts below 1 or not integers, naming them", () => {
    for (const [nb, np] of [
      [0, 3],
      [3, 0],
      [-1, 3],
      [1.5, 3],
      [3, 1.5],
      [Number.NaN, 3],
    ])
      expect(image({ resolution: [nb, np] }), `${nb} × ${np}`).toThrow(
        new RangeError(`resolution must be two integers ≥ 1, got ${nb} × ${np}`),
      );
  });

  it("refuses empty or reversed pixel ranges along either axis", () => {
    for (const change of [
      { birthRange: [1, 1] },
      { birthRange: [1, 0] },
      { persistenceRange: [2, 2] },
      { persistenceRange: [2, 1] },
    ])
      expect(image(change), JSON.stringify(change)).toThrow(
        new RangeError("pixel ranges must be increasing"),
      );
  });

  it("refuses ranges whose width is not finite: their pixels would have no edges (0 × ∞ is NaN)", () => {
    for (const [birthRange, persistenceRange] of [
      [
        [0, Number.POSITIVE_INFINITY],
        [0, 1],
      ],
      [
        [Number.NEGATIVE_INFINITY, 0],
        [0, 1],
      ],
      [
        [0, 1],
        [0, Number.POSITIVE_INFINITY],
      ],
      [
        [-1e308, 1e308],
        [0, 1],
      ], // both ends finite, the width 2e308 is not
      [
        [0, 1],
        [-1e308, 1e308],
      ],
    ])
      expect(image({ birthRange, persistenceRange }), `${birthRange} × ${persistenceRange}`).toThrow(
        new RangeError(
          `pixel ranges must have finite widths, got [${birthRange[0]}, ${birthRange[1]}] × [${persistenceRange[0]}, ${persistenceRange[1]}]`,
        ),
      );
    expect(image({ birthRange: [-1e307, 1e307], persistenceRange: [-1e307, 1e307] })()).toHaveLength(4);
  });

  it("refuses a deviation that is not positive and finite, naming it", () => {
    for (const sigma of [0, -1, Number.POSITIVE_INFINITY, Number.NaN])
      expect(image({ sigma }), `${sigma}`).toThrow(new RangeError(`sigma must be positive, got ${sigma}`));
    expect(image({ sigma: Number.MIN_VALUE })()).toHaveLength(4);
  });
});
