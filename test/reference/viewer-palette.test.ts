// The page's colours under simulated colour-vision deficiencies. Simulation: G. M. Machado, M. M. Oliveira,
// L. A. F. Fernandes, "A physiologically-based model for simulation of color vision deficiency", IEEE TVCG
// 15(6), 2009, at full severity, as implemented by culori (filterDeficiencyProt/Deuter/Trit). Colour
// difference: CIEDE2000 (culori's differenceCiede2000; G. Sharma, W. Wu, E. N. Dalal, "The CIEDE2000
// color-difference formula", Color Research & Application 30(1), 2005). Contrast: WCAG 2.1 contrast ratio
// (culori's wcagContrast), 4.5:1 for normal text (success criterion 1.4.3).
import {
  differenceCiede2000,
  filterDeficiencyDeuter,
  filterDeficiencyProt,
  filterDeficiencyTrit,
  wcagContrast,
} from "culori";
import { describe, expect, it } from "vitest";
import { PALETTE, SERIES } from "../../packages/viewer/src/palette.js";

const difference = differenceCiede2000();
const VISIONS: Record<string, (colour: string) => unknown> = {
  "normal vision": (colour) => colour,
  protanopia: filterDeficiencyProt(1),
  deuteranopia: filterDeficiencyDeuter(1),
  tritanopia: filterDeficiencyTrit(1),
};
const seen = (vision: string, a: string, b: string) =>
  difference(VISIONS[vision](a) as string, VISIONS[vision](b) as string);

// Our threshold for "clearly different" in a chart: ΔE00 ≥ 15. A just-noticeable difference is about
// 1–2 ΔE00 (common practice); 15 keeps series apart at a glance, in thin lines and small markers.
const APART = 15;

describe("palette under simulated colour-vision deficiencies (Machado et al. 2009)", () => {
  for (const vision of Object.keys(VISIONS)) {
    it(`keeps every pair of the ${SERIES.length} series colours ΔE00 ≥ ${APART} apart (${vision})`, () => {
      for (let i = 0; i < SERIES.length; i++)
        for (let j = i + 1; j < SERIES.length; j++)
          expect({
            pair: [SERIES[i], SERIES[j]],
            apart: seen(vision, SERIES[i], SERIES[j]) >= APART,
          }).toEqual({
            pair: [SERIES[i], SERIES[j]],
            apart: true,
          });
    });

    it(`keeps the loop apart from edges, dimmed elements, nodes and the β0–β2 colours (${vision})`, () => {
      for (const other of [
        PALETTE.edge,
        PALETTE.edgeDimmed,
        PALETTE.node,
        PALETTE.nodeDimmed,
        ...SERIES.slice(0, 3),
      ])
        expect({ other, apart: seen(vision, PALETTE.loop, other) >= APART }).toEqual({ other, apart: true });
    });
  }

  it("has text that meets WCAG 2.1 contrast for normal text (4.5:1)", () => {
    expect(wcagContrast(PALETTE.ink, PALETTE.paper)).toBeGreaterThanOrEqual(4.5);
    expect(wcagContrast(PALETTE.muted, PALETTE.panel)).toBeGreaterThanOrEqual(4.5);
    expect(wcagContrast(PALETTE.muted, PALETTE.paper)).toBeGreaterThanOrEqual(4.5);
    expect(wcagContrast(PALETTE.accent, PALETTE.panel)).toBeGreaterThanOrEqual(4.5);
  });

  it("would catch a palette that collapses: blue and plum look alike to a protanope", () => {
    // The check itself can fail: a dark blue and a plum of similar lightness merge under protanopia.
    expect(seen("protanopia", "#24528f", "#7a3b82")).toBeLessThan(APART);
    expect(seen("normal vision", "#24528f", "#7a3b82")).toBeGreaterThanOrEqual(APART);
  });
});
