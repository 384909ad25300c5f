// stackSlice, arrayGraph and arrayGraphs on arrays laid out by hand (worked by hand: element (i, j, g) of a
// stack holds 100·i + 10·j + g, so any mix-up of axes, order or graph shows in the values), in the four
// layouts a stack arrives in: C or Fortran order, graphs along axis 0 (numpy's k × n × n) or axis 2
// (MATLAB's n × n × k). Strides as the NumPy format specification (NEP 1) defines C and Fortran order.
import { describe, expect, it } from "vitest";
import { InputFileError } from "../input-file-error.js";
import { type NpyArray, npyStrides, npyValues } from "../parse-npy.js";
import { errorOf } from "./mat-bytes.fixture.js";
import { arrayGraph, arrayGraphs, type StackAxis, stackSlice } from "./matrix-stack.js";

const HEAD = 16; // bytes before the data, as a file's header would be

/** A float64 array of `shape` whose element at index `ix` is value(ix), stored in C or Fortran order. */
function array(shape: number[], fortranOrder: boolean, value: (ix: number[]) => number): NpyArray {
  const count = shape.reduce((a, b) => a * b, 1);
  const bytes = new Uint8Array(HEAD + 8 * count + 8); // 8 bytes after the data: reads past it show
  const view = new DataView(bytes.buffer);
  const strides = npyStrides({ shape, fortranOrder });
  const ix = new Array(shape.length).fill(0);
  for (let k = 0; k < count; k++) {
    const flat = ix.reduce((a, v, axis) => a + v * strides[axis], 0);
    view.setFloat64(HEAD + 8 * flat, value(ix), true);
    for (let axis = shape.length - 1; axis >= 0; axis--) {
      if (++ix[axis] < shape[axis]) break;
      ix[axis] = 0;
    }
  }
  view.setFloat64(HEAD + 8 * count, -1, true);
  return {
    version: "test",
    dtype: { kind: "f", size: 8, littleEndian: true, descr: "<f8" },
    fortranOrder,
    shape,
    dataOffset: HEAD,
    bytes,
    trailingBytes: 0,
  };
}

// Slices are checked on 2 × 2 matrices, 3 graphs.
const K = 3;
const N = 2;
const expected = (g: number) => [0, 10, 100, 110].map((v) => v + g); // row-major (i, j) of graph g

describe("stackSlice", () => {
  it.each([
    ["C order, graphs along axis 0", false, 0, true],
    ["Fortran order, graphs along axis 2", true, 2, true],
    ["Fortran order, graphs along axis 0", true, 0, false],
    ["C order, graphs along axis 2", false, 2, false],
  ] as const)("%s: graph g is the right matrix (a view: %s)", (_, fortran, axis, view) => {
    const shape = axis === 0 ? [K, N, N] : [N, N, K];
    const a = array(shape, fortran, (ix) =>
      axis === 0 ? 100 * ix[1] + 10 * ix[2] + ix[0] : 100 * ix[0] + 10 * ix[1] + ix[2],
    );
    for (let g = 0; g < K; g++) {
      const slice = stackSlice(a, axis as StackAxis, g);
      expect(slice.shape).toEqual([N, N]);
      expect([...npyValues(slice)]).toEqual(expected(g));
      expect(slice.bytes === a.bytes).toBe(view);
    }
  });
});

describe("arrayGraph: where an error in a slice is placed", () => {
  const nanAt = (fortran: boolean, axis: StackAxis, at: number[]) =>
    array(axis === 0 ? [K, N, N] : [N, N, K], fortran, (ix) =>
      ix.every((v, k) => v === at[k]) ? Number.NaN : 1,
    );
  const strict = { nanIsNoEdge: false };

  it("MATLAB's n × n × k: the element is (i, j, g); byte offsets only when they are the file's", () => {
    const a = nanAt(true, 2, [0, 1, 2]);
    const quiet = errorOf(() =>
      arrayGraph(a, 2, 2, "m.mat", strict, { prefix: 'variable "A": ', byteOffsetsInFile: false }),
    );
    expect(quiet.position).toEqual({ element: [0, 1, 2] });
    expect(quiet.message).toBe(
      'm.mat: element (0, 1, 2): variable "A": graph 2 of the stack: NaN is not a finite weight (set nanIsNoEdge to read NaN as "no edge")',
    );
    // Fortran order along axis 2 is a view of the file's bytes: its offsets are the file's.
    const placed = errorOf(() =>
      arrayGraph(a, 2, 2, "m.npy", strict, { prefix: "", byteOffsetsInFile: true }),
    );
    expect(placed.position).toEqual({ element: [0, 1, 2], byteOffset: HEAD + 8 * (0 + 1 * N + 2 * N * N) });
  });

  it("a gathered slice (Fortran order along axis 0) has no byte offsets in the file", () => {
    const a = nanAt(true, 0, [1, 1, 0]);
    const e = errorOf(() => arrayGraph(a, 0, 1, "f.npy", strict, { prefix: "", byteOffsetsInFile: true }));
    expect(e.position).toEqual({ element: [1, 1, 0] });
  });

  it("a single matrix: byte offsets only when they are the file's", () => {
    const a = array([N, N], false, (ix) => (ix[0] === 1 && ix[1] === 0 ? Number.NaN : 1));
    const quiet = errorOf(() => arrayGraphs(a, 0, "m.mat", strict, { prefix: "", byteOffsetsInFile: false }));
    expect(quiet.position).toEqual({ element: [1, 0] });
    const placed = errorOf(() => arrayGraphs(a, 0, "m.npy", strict, { prefix: "", byteOffsetsInFile: true }));
    expect(placed.position).toEqual({ element: [1, 0], byteOffset: HEAD + 8 * 2 });
  });
});

describe("arrayGraphs", () => {
  it("gives one graph per slice and each slice's notes, named by the slice", () => {
    const a = array([K, N, N], false, (ix) => (ix[0] === 1 && ix[1] !== ix[2] ? Number.NaN : 1 + ix[0]));
    const { graphs, warnings } = arrayGraphs(a, 0, "s.npy", {}, { prefix: "", byteOffsetsInFile: true });
    expect(graphs.map((g) => [...g.weights])).toEqual([[1, 1], [], [3, 3]]);
    expect(warnings).toEqual(["graph 1 of the stack: read 2 NaN cells as no edge"]);
    expect(
      arrayGraphs(
        array([N, N], false, () => 1),
        0,
        "m.npy",
        {},
        { prefix: "", byteOffsetsInFile: true },
      ).warnings,
    ).toEqual([]);
  });

  it("a stack of no matrices is refused, with the array's shape", () => {
    const empty = array([N, N, 0], true, () => 0);
    const e = errorOf(() =>
      arrayGraphs(empty, 2, "e.mat", {}, { prefix: 'variable "E": ', byteOffsetsInFile: false }),
    );
    expect(e).toBeInstanceOf(InputFileError);
    expect(e.problem).toBe("empty-file");
    expect(e.message).toBe(
      'e.mat: variable "E": array of shape (2, 2, 0) holds no matrices: there is no graph to read',
    );
  });
});
