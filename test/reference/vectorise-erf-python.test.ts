/**
 * The error function behind the persistence images' exact pixel integrals, against Python's standard
 * library `math.erf` (Debian's python3, C99 libm's erf), over −8 … 8 including the switch between the
 * series and the continued fraction at |x| = 2.5.
 */
import { erf } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { missingPythonModules, runPythonScript } from "../support/python.js";

const missing = missingPythonModules(["math"]);
const suite = missing ? describe.skip : describe;

suite(`erf equals Python's math.erf${missing ? ` (skipped: ${missing})` : ""}`, () => {
  it("to 2e-15 over −8 … 8", () => {
    const xs: number[] = [];
    for (let i = -1600; i <= 1600; i++) xs.push(i / 200);
    xs.push(2.5 - 1e-12, 2.5 + 1e-12, 1e-300, -1e-9, 27.5);
    const expected = runPythonScript<number[]>("erf_values.py", xs);
    xs.forEach((x, i) => {
      expect(Math.abs(erf(x) - expected[i]), `erf(${x})`).toBeLessThan(2e-15);
    });
  });
});
