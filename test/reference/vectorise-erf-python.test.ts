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

  it("at the ends: erf(±∞) = ±1 and erf(±0) = ±0, as math.erf gives them", () => {
    // JSON has no infinities and no −0 on the way in: Python reads the strings with float(). Its json
    // writes −0.0 back, which JSON.parse reads as −0.
    const [plus, minus, zero, minusZero] = runPythonScript<number[]>("erf_values.py", [
      "inf",
      "-inf",
      0,
      "-0.0",
    ]);
    expect(erf(Number.POSITIVE_INFINITY)).toBe(plus);
    expect(erf(Number.NEGATIVE_INFINITY)).toBe(minus);
    const sign = (v: number) => (Object.is(v, -0) ? "-0" : String(v));
    expect(Object.is(erf(0), zero), `erf(0) = ${sign(erf(0))}`).toBe(true);
    expect(Object.is(minusZero, -0), "math.erf(-0.0) is -0.0").toBe(true);
    expect(Object.is(erf(-0), minusZero), `erf(-0) = ${sign(erf(-0))}`).toBe(true);
  });

  it("at |x| = 2.5 the continued fraction is used: within 2.2e-16 of math.erf there", () => {
    // The series is accurate to about 1e-15 up to 2.5 but off by 9e-16 at 2.5 itself (mpmath at 40 digits
    // gives erf(2.5) = 0.99959304798255504106…); the continued fraction is within one unit of the last place.
    const [at, atMinus] = runPythonScript<number[]>("erf_values.py", [2.5, -2.5]);
    expect(Math.abs(erf(2.5) - at)).toBeLessThanOrEqual(Number.EPSILON);
    expect(Math.abs(erf(-2.5) - atMinus)).toBeLessThanOrEqual(Number.EPSILON);
  });
});
