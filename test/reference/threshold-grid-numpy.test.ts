/**
 * Evenly spaced thresholds (`--grid even:…`) against numpy.linspace (Debian's python3-numpy), which users
 * compare them with: the same values within two units in the last place (numpy computes start + i·step,
 * we compute start + (stop − start)·i / (num − 1): the two roundings may differ by an ulp), and both ends
 * exactly — numpy pins its last value to stop, and so must we, or the last edge may fall outside the grid.
 */
import { evenGrid } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { missingPythonModules, runPythonScript } from "../support/python.js";

const missing = missingPythonModules(["numpy"]);

// (1, 0.1, 10): unpinned, the last value would be 0.10000000000000009 (computed here, 2 Dec 2026).
const CASES: [number, number, number][] = [
  [0.1, 0.7, 7],
  [1, 0.1, 10],
  [-0.3, 0.7, 11],
  [0.05, 0.95, 19],
  [2, 2, 3],
  [0.25, 0.75, 2],
];

describe.skipIf(missing !== null)(
  `evenGrid against numpy.linspace${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    it("same values within 2 ulp, ends exact, in filtration order for either semantics", () => {
      const reference = runPythonScript<number[][]>("linspace.py", CASES);
      CASES.forEach(([first, last, count], k) => {
        const expected = [...new Set(reference[k])];
        for (const semantics of ["distance", "similarity"] as const) {
          const got = Array.from(evenGrid(first, last, count, semantics).thresholds);
          // Distances ascend, similarities descend: numpy's order or its reverse.
          const ascending = expected[0] <= expected[expected.length - 1];
          const ordered = (semantics === "distance") === ascending ? expected : [...expected].reverse();
          expect(got.length).toBe(ordered.length);
          got.forEach((x, i) => {
            expect(Math.abs(x - ordered[i])).toBeLessThanOrEqual(
              2 * Number.EPSILON * Math.max(1, Math.abs(x)),
            );
          });
          expect(got).toContain(first);
          expect(got).toContain(last);
        }
      });
    });
  },
);
