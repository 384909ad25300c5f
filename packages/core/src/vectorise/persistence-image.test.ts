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
