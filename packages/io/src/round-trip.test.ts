import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fromDenseMatrix } from "@cliquescape/core";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { encodeNpy } from "./encode-npy.js";
import { readGraphFile } from "./read-graph-file.js";

const dir = mkdtempSync(join(tmpdir(), "cliquescape-roundtrip-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** RFC 4180 §2.7: a quoted field doubles its quotes. */
const quote = (s: string) => `"${s.replaceAll('"', '""')}"`;

/**
 * A weight cell: empty for "no edge", else the shortest decimal that reads back as the same double
 * (ECMAScript Number::toString), except that it writes -0 as "0", so the sign is spelled out.
 */
const cell = (w: number) => (Number.isNaN(w) ? "" : Object.is(w, -0) ? "-0" : String(w));

const weight = fc.oneof(
  fc.constant(Number.NaN),
  fc.constant(0),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.integer({ min: -5, max: 5 }),
);

const matrixCase = fc
  .record({
    n: fc.integer({ min: 1, max: 7 }),
    directed: fc.boolean(),
    semantics: fc.constantFrom("distance" as const, "similarity" as const),
  })
  .chain(({ n, directed, semantics }) =>
    fc.record({
      n: fc.constant(n),
      directed: fc.constant(directed),
      semantics: fc.constant(semantics),
      upper: fc.array(weight, { minLength: n * n, maxLength: n * n }),
      labels: fc.uniqueArray(fc.string({ minLength: 1, maxLength: 5 }), { minLength: n, maxLength: n }),
    }),
  )
  .map(({ n, directed, semantics, upper, labels }) => {
    // Undirected cases mirror the upper triangle so the matrix is symmetric, as an undirected file must be.
    const values = upper.slice();
    if (!directed)
      for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) values[i * n + j] = values[j * n + i];
    return { n, directed, semantics, values, labels };
  });

describe("round trip: a matrix written as CSV, TSV and .npy reads back to the same graph", () => {
  it("matches the core builder on the same numbers, for every format", () => {
    let run = 0;
    fc.assert(
      fc.property(matrixCase, ({ n, directed, semantics, values, labels }) => {
        run++;
        const options = { directed, semantics, negative: "keep" as const, nanIsNoEdge: true };
        // What the readers promise: 0 is an edge only for distance-like weights.
        const expectedValues = values.map((w) => (w === 0 && semantics === "similarity" ? Number.NaN : w));
        const expected = fromDenseMatrix(n, expectedValues, { directed, negative: "keep" });
        const rows = Array.from({ length: n }, (_, i) => values.slice(i * n, (i + 1) * n).map(cell));
        // A 1×1 matrix whose one cell is empty is a blank line, which no text table can tell from nothing;
        // the diagonal is ignored, so write a 0 there.
        if (n === 1) rows[0][0] = "0";

        const csv = join(dir, `m${run}.csv`);
        const header = ["", ...labels].map(quote).join(",");
        const body = rows.map((row, i) => [quote(labels[i]), ...row].join(","));
        writeFileSync(csv, `${[header, ...body].join("\r\n")}\r\n`);
        const fromCsv = readGraphFile(csv, { ...options, labelRow: true, labelColumn: true });
        expect(fromCsv.format).toBe("dense-matrix");
        expect(fromCsv.graphs).toEqual([{ ...expected, labels }]);

        const tsv = join(dir, `m${run}.tsv`);
        writeFileSync(
          tsv,
          `# written by the round-trip test\n${rows.map((row) => row.join("\t")).join("\n")}\n`,
        );
        expect(readGraphFile(tsv, { ...options, labelRow: false, labelColumn: false }).graphs).toEqual([
          expected,
        ]);

        const npy = join(dir, `m${run}.npy`);
        writeFileSync(npy, encodeNpy(values, [n, n]));
        expect(readGraphFile(npy, { ...options, labels }).graphs).toEqual([{ ...expected, labels }]);
      }),
      { numRuns: 150, seed: 20261202 },
    );
  });
});
