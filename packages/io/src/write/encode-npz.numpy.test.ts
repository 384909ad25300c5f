// Our .npz files as numpy sees them: numpy.load(allow_pickle=False) from Debian's python3-numpy must give
// the exact values, dtypes and shapes. The zip layout follows PKWARE APPNOTE; members follow NumPy NEP 1.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON } from "../../../../test/support/python.js";
import { encodeNpz, type NpzArray } from "./encode-npz.js";

const missing = missingPythonModules(["numpy"]);
const dir = mkdtempSync(join(tmpdir(), "cliquescape-npz-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Prints every array as numpy loaded it: dtype string, shape, and values (floats as Python repr via json,
// int64 as decimal strings so nothing passes through a float).
const LOADER = `
import json, sys, numpy as np
out = {}
with np.load(sys.argv[1], allow_pickle=False) as z:
    for name in z.files:
        a = z[name]
        if a.dtype.kind == "i":
            values = [str(int(x)) for x in a.ravel()]
        elif a.dtype.kind == "U":
            values = [str(x) for x in a.ravel()]
        else:
            values = [float(x) for x in a.ravel()]
        out[name] = {"dtype": a.dtype.str, "shape": list(a.shape), "values": values}
print(json.dumps(out))
`;

const ARRAYS: NpzArray[] = [
  { name: "X", values: new Float32Array([0.1, -2.5, 3.25, 1e-7, 65504, Math.PI]), shape: [2, 3] },
  { name: "exact", values: new Float64Array([0.1, 1 / 3, -0, 5e-324, Number.MAX_VALUE, Math.E]) },
  { name: "y", values: new Int32Array([0, 1, -1, 2147483647, -2147483648]) },
  {
    name: "edge_index",
    values: new BigInt64Array([0n, 1n, 2n, 9007199254740993n, -9223372036854775808n, 9223372036854775807n]),
    shape: [2, 3],
  },
  { name: "counts", values: [0, 3, 17, 2 ** 53 - 1] },
  { name: "doubles", values: [0.5, -1.25], dtype: "float64" },
  // An explicit dtype wins over the typed array's own type.
  { name: "narrowed", values: new Float64Array([0.1, 2]), dtype: "float32" },
  { name: "ids", values: ["sub-01", "sub-02", "ünïcödé", "🧠 brain", 'a,b "q"', "x"] },
  { name: "feature_names", values: ["betti_1_max", "euler_area"] },
  { name: "no_names", values: [], dtype: "unicode" },
  { name: "empty", values: new Float64Array(0), shape: [0, 4] },
];

function load(path: string) {
  const run = spawnSync(PYTHON, ["-c", LOADER, path], { encoding: "utf8" });
  if (run.status !== 0) throw new Error(`numpy could not load ${path}:\n${run.stderr}`);
  return JSON.parse(run.stdout) as Record<
    string,
    { dtype: string; shape: number[]; values: (number | string)[] }
  >;
}

describe.skipIf(missing !== null)(`numpy loads our .npz${missing ? ` (skipped: ${missing})` : ""}`, () => {
  it.each([
    ["stored", false],
    ["deflated", true],
  ])("%s: exact values, dtypes and shapes, without pickle", (_, compress) => {
    const path = join(dir, `all-${compress}.npz`);
    writeFileSync(path, encodeNpz(ARRAYS, { compress }));
    const loaded = load(path);
    expect(Object.keys(loaded)).toEqual(ARRAYS.map((a) => a.name));
    expect(loaded.X).toEqual({
      dtype: "<f4",
      shape: [2, 3],
      values: [...new Float32Array(ARRAYS[0].values as Float32Array)],
    });
    expect(loaded.exact).toEqual({
      dtype: "<f8",
      shape: [6],
      values: [0.1, 1 / 3, -0, 5e-324, Number.MAX_VALUE, Math.E],
    });
    expect(Object.is(loaded.exact.values[2], -0)).toBe(true);
    expect(loaded.y).toEqual({
      dtype: "<i8",
      shape: [5],
      values: ["0", "1", "-1", "2147483647", "-2147483648"],
    });
    expect(loaded.edge_index).toEqual({
      dtype: "<i8",
      shape: [2, 3],
      values: ["0", "1", "2", "9007199254740993", "-9223372036854775808", "9223372036854775807"],
    });
    expect(loaded.counts).toEqual({ dtype: "<i8", shape: [4], values: ["0", "3", "17", "9007199254740991"] });
    expect(loaded.doubles).toEqual({ dtype: "<f8", shape: [2], values: [0.5, -1.25] });
    expect(loaded.narrowed).toEqual({ dtype: "<f4", shape: [2], values: [Math.fround(0.1), 2] });
    // Width = the longest string in code points ("🧠 brain" is 7, "ünïcödé" 7, 'a,b "q"' 7).
    expect(loaded.ids).toEqual({ dtype: "<U7", shape: [6], values: ARRAYS[7].values });
    expect(loaded.feature_names).toEqual({
      dtype: "<U11",
      shape: [2],
      values: ["betti_1_max", "euler_area"],
    });
    expect(loaded.no_names).toEqual({ dtype: "<U1", shape: [0], values: [] });
    expect(loaded.empty).toEqual({ dtype: "<f8", shape: [0, 4], values: [] });
  });
});

describe("encodeNpz", () => {
  it("gives byte-identical output for the same input, whatever the time zone", () => {
    const zone = process.env.TZ;
    try {
      process.env.TZ = "Pacific/Kiritimati";
      const first = encodeNpz(ARRAYS, { compress: true });
      process.env.TZ = "America/Adak";
      const second = encodeNpz(ARRAYS, { compress: true });
      expect(Buffer.from(second).equals(Buffer.from(first))).toBe(true);
      // Local file header (APPNOTE 4.3.7): last-modified time at byte 10, date at 12; 1980-01-01 00:00 is
      // time 0 and date (0 << 9) | (1 << 5) | 1 = 0x21.
      const view = new DataView(first.buffer, first.byteOffset);
      expect(view.getUint32(0, true)).toBe(0x04034b50);
      expect([view.getUint16(10, true), view.getUint16(12, true)]).toEqual([0, 0x21]);
    } finally {
      if (zone === undefined) delete process.env.TZ;
      else process.env.TZ = zone;
    }
  });

  it("refuses what numpy could not read back as given", () => {
    expect(() =>
      encodeNpz([
        { name: "a", values: [1] },
        { name: "a", values: [2] },
      ]),
    ).toThrow('two arrays are named "a"');
    expect(() => encodeNpz([{ name: "n", values: [1.5] }])).toThrow(
      /array "n": value 1.5 at position 0 is not an exact integer/,
    );
    expect(() => encodeNpz([{ name: "s", values: ["a\u0000b"] }])).toThrow(
      /array "s": string 0 contains U\+0000/,
    );
    expect(() => encodeNpz([{ name: "m", values: new Float64Array(5), shape: [2, 2] }])).toThrow(
      /array "m": shape \(2, 2\) needs 4 values, got 5/,
    );
    expect(() => encodeNpz([{ name: "a/b", values: [1] }])).toThrow(/empty or contains "\/"/);
  });
});
