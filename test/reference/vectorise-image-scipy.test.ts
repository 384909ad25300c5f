/**
 * Persistence image pixels against their definition ("Persistence images: a stable vector
 * representation of persistent homology", JMLR 18, 2017, Section 4): the integral of the persistence
 * surface over each pixel, computed by Debian's python3-scipy `scipy.integrate.dblquad` in two dimensions
 * (test/support/python/persistence_image_integrals.py), not through the separable normal masses the core
 * uses. The ranges start away from 0 along both axes, so that each pixel's width and offset matter.
 */
import { persistenceImage } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { missingPythonModules, runPythonScript } from "../support/python.js";

const missing = missingPythonModules(["scipy"]);
const suite = missing ? describe.skip : describe;

suite(`persistence image pixels equal scipy's dblquad of the surface${missing ? ` (skipped: ${missing})` : ""}`, () => {
  it("three points, linear weights, a 4 × 3 grid over [-0.5, 4.5] × [0.5, 3.5]", () => {
    const query = {
      births: [1, 2.5, 3.2],
      deaths: [3.2, 5.6, 4],
      birthRange: [-0.5, 4.5] as [number, number],
      persistenceRange: [0.5, 3.5] as [number, number],
      resolution: [4, 3] as [number, number],
      sigma: 0.6,
      rampEnd: 2,
    };
    const expected = runPythonScript<number[]>("persistence_image_integrals.py", query);
    const image = persistenceImage(query.births, query.deaths, { ...query, weighting: "linear" });
    expect(image).toHaveLength(12);
    expected.forEach((value, i) => {
      expect(Math.abs(image[i] - value), `pixel ${i}: ${image[i]} vs ${value}`).toBeLessThan(1e-10);
    });
    // The reference is not flat: the pixels hold clearly different masses, so a shifted grid shows.
    expect(Math.max(...expected) - Math.min(...expected)).toBeGreaterThan(0.05);
  });
});
