// CSV text as outside readers see it: Python's csv module (Debian's python3, RFC 4180 dialect) must give
// back every cell, and float() every number exactly; our own reader (text-rows.ts) must agree.
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON } from "../../../../test/support/python.js";
import { textRows } from "../text-rows.js";
import { encodeCell, encodeCsv, encodeCsvChunks } from "./encode-csv.js";

const missing = missingPythonModules(["csv"]);
const header = ["id", "label", "x", "note"];
const rows = [
  ["g1", "ring", 0.1, "plain"],
  ["g,2", 'say "hi"', 1 / 3, "two\nlines"],
  [" padded ", "#not a comment", -5e-324, "crlf\r\nhere"],
  ["g4", null, 1.7976931348623157e308, undefined],
  ["g5", "ünïcödé 🧠", 123456789012345680000, true],
];

describe("encodeCsv", () => {
  const text = encodeCsv(header, rows);
  const asStrings = rows.map((row) => row.map((c) => (c === null || c === undefined ? "" : String(c))));

  it("quotes only what needs quoting and writes numbers with String(x)", () => {
    expect(encodeCell("plain")).toBe("plain");
    expect(encodeCell('a"b')).toBe('"a""b"');
    expect(encodeCell(0.1)).toBe("0.1");
    expect(encodeCell(null)).toBe("");
    expect(encodeCsv(["a"], [[""], [null]])).toBe('a\n""\n""\n');
    expect(() => encodeCsv(["a", "b"], [["1"]])).toThrow("row 0 has 1 cells but the header has 2");
  });

  it("gives the same text in pieces, consuming the rows as it goes", () => {
    let produced = 0;
    function* many() {
      for (let k = 0; k < 20000; k++) {
        produced++;
        yield [`g${k}`, "", "", k / 7];
      }
    }
    const pieces = encodeCsvChunks(header, many());
    const first = pieces.next();
    expect(first.done).toBe(false);
    expect(produced).toBeLessThan(20000);
    const rest = [...pieces];
    expect(rest.length).toBeGreaterThan(1);
    expect(first.value + rest.join("")).toBe(encodeCsv(header, many()));
  });

  it("reads back through our text-rows reader", () => {
    const read = [...textRows(text, ",", "t.csv")].map((r) => r.cells);
    expect(read).toEqual([header, ...asStrings]);
  });

  it.skipIf(missing !== null)(
    `Python's csv module reads every cell and float() every number exactly${missing ? ` (skipped: ${missing})` : ""}`,
    () => {
      const script = `
import csv, io, json, sys
rows = list(csv.reader(io.StringIO(sys.stdin.read(), newline="")))
print(json.dumps({"rows": rows, "x": [float(r[2]) for r in rows[1:]]}))
`;
      const run = spawnSync(PYTHON, ["-c", script], { input: text, encoding: "utf8" });
      expect(run.stderr).toBe("");
      const parsed = JSON.parse(run.stdout) as { rows: string[][]; x: number[] };
      expect(parsed.rows).toEqual([header, ...asStrings]);
      expect(parsed.x).toEqual(rows.map((r) => r[2]));
    },
  );
});
