import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fromDenseMatrix } from "@cliquescape/core";
import { encodeNpy, npyValues, parseNpy, readGraphFile } from "@cliquescape/io";
import { afterAll, describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON } from "../support/python.js";

// Source of truth: numpy's own .npy writer (Debian's python3-numpy), checked against the NumPy format
// specification (NEP 1). CI installs python3-numpy; elsewhere, without it, these tests are skipped, loudly.
const missingNumpy = missingPythonModules(["numpy"]);
const hasNumpy = missingNumpy === null;
if (!hasNumpy) console.warn(`SKIPPED: .npy checks against numpy: ${missingNumpy}`);
const dir = mkdtempSync(join(tmpdir(), "cliquescape-npy-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Writes one file per case with numpy and prints, for each, the values as numpy sees them in C order
// (json uses Python's float repr, which round-trips float64 exactly) and the shape.
const WRITER = `
import json, sys, numpy as np
from numpy.lib import format as npformat
d = sys.argv[1]
rng = np.random.default_rng(20261202)
base = rng.random((5, 5))
base[rng.random((5, 5)) < 0.3] = 0.0
ints = rng.integers(-100, 100, size=(4, 4))
cases = {
  "float64": base,
  "float32": base.astype(np.float32),
  "int32": ints.astype(np.int32),
  "int8": ints.astype(np.int8),
  "uint16": np.abs(ints).astype(np.uint16),
  "int64": (ints * 10**12).astype(np.int64),
  "uint64": (np.abs(ints) * 10**12).astype(np.uint64),
  "bool": base > 0.5,
  "fortran": np.asfortranarray(base),
  "fortran_int16": np.asfortranarray(ints.astype(np.int16)),
  "bigendian_f8": base.astype(">f8"),
  "bigendian_i4": ints.astype(">i4"),
  "bigendian_fortran_f4": np.asfortranarray(base.astype(">f4")),
  "stack": rng.random((3, 4, 4)),
  "stack_fortran": np.asfortranarray(rng.random((3, 4, 4))),
}
out = {}
for name, a in cases.items():
  np.save(f"{d}/{name}.npy", a)
  out[name] = {"shape": list(a.shape), "values": a.astype(np.float64).ravel(order="C").tolist(),
               "fortran": bool(np.isfortran(a))}
for version in [(2, 0), (3, 0)]:
  name = f"version{version[0]}"
  with open(f"{d}/{name}.npy", "wb") as f:
    npformat.write_array(f, base, version=version)
  out[name] = {"shape": [5, 5], "values": base.ravel().tolist(), "fortran": False}
print(json.dumps(out))
`;

interface Case {
  shape: number[];
  values: number[];
  fortran: boolean;
}

describe.skipIf(!hasNumpy)(".npy files written by numpy", () => {
  const cases: Record<string, Case> = hasNumpy
    ? JSON.parse(execFileSync(PYTHON, ["-c", WRITER, dir], { encoding: "utf8" }))
    : {};

  it("reads every dtype, byte order, memory order and version to exactly numpy's values", () => {
    expect(Object.keys(cases)).toHaveLength(17);
    for (const [name, expected] of Object.entries(cases)) {
      const array = parseNpy(readFileSync(join(dir, `${name}.npy`)), `${name}.npy`);
      expect(array.shape, name).toEqual(expected.shape);
      // Makes sure the Fortran cases really exercise Fortran order (numpy writes fortran_order only then).
      expect(array.fortranOrder, name).toBe(expected.fortran);
      expect(Array.from(npyValues(array)), name).toEqual(expected.values);
    }
    expect(cases.fortran.fortran && cases.stack_fortran.fortran).toBe(true);
  });

  it("builds the same graphs the core builds from numpy's values (directed, zeros and false = no edge)", () => {
    for (const [name, expected] of Object.entries(cases)) {
      const { graphs } = readGraphFile(join(dir, `${name}.npy`), { directed: true, negative: "keep" });
      const [k, n] = expected.shape.length === 3 ? expected.shape : [1, expected.shape[0]];
      expect(graphs, name).toHaveLength(k);
      for (let g = 0; g < k; g++) {
        const slice = expected.values
          .slice(g * n * n, (g + 1) * n * n)
          .map((v) => (v === 0 ? Number.NaN : v));
        expect(graphs[g], `${name}[${g}]`).toEqual(
          fromDenseMatrix(n, slice, { directed: true, negative: "keep" }),
        );
      }
    }
  });

  it("our writer produces byte-for-byte what np.save writes for float64, float32 and int64", () => {
    const script = `
import sys, numpy as np
d = sys.argv[1]
a = np.arange(12, dtype=np.float64).reshape(3, 4) / 8 - 0.5
np.save(f"{d}/ref_f8.npy", a)
np.save(f"{d}/ref_f4.npy", a.astype(np.float32))
np.save(f"{d}/ref_i8.npy", (np.arange(12).reshape(3, 4) - 6) * 10**15)
np.save(f"{d}/ref_1d.npy", np.arange(3, dtype=np.float64))
`;
    execFileSync(PYTHON, ["-c", script, dir]);
    const a = Array.from({ length: 12 }, (_, k) => k / 8 - 0.5);
    const ints = Array.from({ length: 12 }, (_, k) => (k - 6) * 10 ** 15);
    expect(encodeNpy(a, [3, 4], "float64")).toEqual(new Uint8Array(readFileSync(join(dir, "ref_f8.npy"))));
    expect(encodeNpy(a, [3, 4], "float32")).toEqual(new Uint8Array(readFileSync(join(dir, "ref_f4.npy"))));
    expect(encodeNpy(ints, [3, 4], "int64")).toEqual(new Uint8Array(readFileSync(join(dir, "ref_i8.npy"))));
    expect(encodeNpy([0, 1, 2], [3])).toEqual(new Uint8Array(readFileSync(join(dir, "ref_1d.npy"))));
  });

  it("numpy loads what our writer wrote", () => {
    const values = [0.1, -2.5, 1e-300, 3.4e38, 7, 0];
    writeFileSync(join(dir, "ours.npy"), encodeNpy(values, [2, 3]));
    writeFileSync(join(dir, "ours_i8.npy"), encodeNpy([-(2 ** 53) + 1, 5], [2], "int64"));
    const script = `
import sys, json, numpy as np
d = sys.argv[1]
a = np.load(f"{d}/ours.npy")
b = np.load(f"{d}/ours_i8.npy")
print(json.dumps({"a": a.ravel().tolist(), "shape": list(a.shape), "dtype": str(a.dtype),
                  "b": b.tolist(), "bdtype": str(b.dtype)}))
`;
    const seen = JSON.parse(execFileSync(PYTHON, ["-c", script, dir], { encoding: "utf8" }));
    expect(seen).toEqual({
      a: values,
      shape: [2, 3],
      dtype: "float64",
      b: [-(2 ** 53) + 1, 5],
      bdtype: "int64",
    });
  });
});
