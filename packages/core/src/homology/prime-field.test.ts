import { describe, expect, it } from "vitest";
import { isPrime, modP, primeField } from "./prime-field.js";

describe("primeField", () => {
  it("tabulates inverses that multiply to 1", () => {
    for (const p of [2, 3, 5, 7, 101, 65521]) {
      const { inverse } = primeField(p);
      for (let a = 1; a < p; a += Math.max(1, Math.floor(p / 200))) expect((a * inverse[a]) % p).toBe(1);
    }
  });

  it("rejects non-primes and huge primes", () => {
    expect(() => primeField(4)).toThrow(RangeError);
    expect(() => primeField(1)).toThrow(RangeError);
    expect(() => primeField(2.5)).toThrow(RangeError);
    expect(() => primeField(65537)).toThrow(RangeError);
    expect(() => primeField(4)).toThrow("coefficients need a prime p with 2 ≤ p ≤ 65521, got 4");
    expect(isPrime(97)).toBe(true);
    expect(isPrime(91)).toBe(false);
    // Against trial division by every smaller number (the definition), squares of primes included.
    for (let n = -2; n < 200; n++) {
      let divisors = 0;
      for (let d = 2; d < n; d++) if (n % d === 0) divisors++;
      expect(isPrime(n)).toBe(n >= 2 && divisors === 0);
    }
  });

  it("reduces negatives into 0 .. p-1", () => {
    expect(modP(-1, 5)).toBe(4);
    expect(modP(-10, 5)).toBe(0);
    expect(modP(7, 5)).toBe(2);
  });
});
