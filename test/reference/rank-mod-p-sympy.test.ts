/**
 * rankModP (packages/core/src/homology/rank-mod-p.ts) on random sparse integer matrices against sympy's
 * rank over GF(p) (python3-sympy, `DomainMatrix(..., GF(p)).rank()`, through boundary_ranks.py). The
 * matrices are built to reach what boundary matrices of small complexes rarely do: coefficients of any sign
 * and size, the same row given twice in one column, columns that cancel to zero, pivots in row 0, many
 * columns sharing a pivot row (long elimination chains), and more columns than rows.
 */
import { describe, expect, it } from "vitest";
import { primeField } from "../../packages/core/src/homology/prime-field.js";
import { rankModP } from "../../packages/core/src/homology/rank-mod-p.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";
import { seededRandom } from "../support/random.js";

interface Job {
  rows: number;
  cols: number;
  p: number;
  entries: [number, number, number][];
}

function randomJob(seed: number, p: number): Job {
  const random = seededRandom(seed);
  const rows = 1 + Math.floor(random() * 9);
  const cols = 1 + Math.floor(random() * 12);
  const density = 0.2 + random() * 0.6;
  const entries: [number, number, number][] = [];
  for (let c = 0; c < cols; c++) {
    for (let r = 0; r < rows; r++) {
      if (random() >= density) continue;
      entries.push([r, c, Math.floor(random() * 21) - 10]);
      if (random() < 0.15) entries.push([r, c, Math.floor(random() * 21) - 10]); // the row again
    }
    // Now and then a column that is a sum of earlier ones, so elimination chains get long.
    if (c >= 2 && random() < 0.3) {
      const a = Math.floor(random() * c);
      const b = Math.floor(random() * c);
      for (const [r, cc, v] of entries.filter((e) => e[1] === a || e[1] === b))
        entries.push([r, c, v * (cc + 2)]);
    }
  }
  return { rows, cols, p, entries };
}

function ours(job: Job): number {
  const start = new Int32Array(job.cols + 1);
  const byCol = Array.from({ length: job.cols }, () => [] as [number, number][]);
  for (const [r, c, v] of job.entries) byCol[c].push([r, v]);
  const rows: number[] = [];
  const coefs: number[] = [];
  byCol.forEach((list, c) => {
    for (const [r, v] of list) {
      rows.push(r);
      coefs.push(v);
    }
    start[c + 1] = rows.length;
  });
  return rankModP(start, Int32Array.from(rows), Int32Array.from(coefs), job.rows, primeField(job.p));
}

const missing = missingPythonModules(["numpy", "sympy"]);

describe.skipIf(missing !== null)(
  `rankModP against sympy's rank over GF(p)${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    it("on 400 random sparse integer matrices, p = 2, 3, 5, 7, 11", () => {
      const jobs: Job[] = [];
      for (const p of [2, 3, 5, 7, 11])
        for (let s = 0; s < 80; s++) jobs.push(randomJob(9000 + 100 * p + s, p));
      const expected = runPythonScript<number[]>("boundary_ranks.py", jobs);
      // The sample reaches full and deficient ranks alike.
      expect(expected.filter((r, i) => r === Math.min(jobs[i].rows, jobs[i].cols)).length).toBeGreaterThan(
        50,
      );
      expect(expected.filter((r, i) => r < Math.min(jobs[i].rows, jobs[i].cols)).length).toBeGreaterThan(50);
      expect(jobs.map(ours)).toEqual(expected);
    });
  },
);
