// parseMat on MAT-files built byte by byte from the MATLAB 7 MAT-File Format document (MathWorks), each
// layout worked by hand (builders in mat-bytes.fixture.ts): headers that are not Level 5, elements cut
// short or lying about their size, compressed elements (zlib streams built by hand per RFC 1950/1951 where
// their exact length matters), and the limits checked before a variable is unpacked.
import { describe, expect, it } from "vitest";
import {
  compressedElement,
  concat,
  dimsElement,
  doublesElement,
  element,
  errorOf,
  flagsElement,
  matFile,
  matHeader,
  matrixElement,
  miMatrix,
  nameElement,
  storedZlib,
} from "./mat-bytes.fixture.js";
import { parseMat } from "./parse-mat.js";

const FILE = "t.mat";
const BIG = 2 ** 31;
const parse = (bytes: Uint8Array, maxBytes = BIG, maxCells?: number) =>
  parseMat(bytes, FILE, maxBytes, maxCells);

/** An miMATRIX of class double with the given dimensions and name, all values 0 (compresses to little). */
function zeros(name: string, dims: number[]): Uint8Array {
  const count = dims.reduce((a, b) => a * b, 1);
  return miMatrix([
    flagsElement(6),
    dimsElement(dims),
    nameElement(name),
    doublesElement(new Array(count).fill(0)),
  ]);
}

/** The doubles of a variable's array, in its (column-major) order. */
function doublesOf(
  array: NonNullable<ReturnType<typeof parseMat>[number]["array"]>,
  count: number,
): number[] {
  const view = new DataView(array.bytes.buffer, array.bytes.byteOffset, array.bytes.byteLength);
  return Array.from({ length: count }, (_, k) =>
    view.getFloat64(array.dataOffset + 8 * k, array.dtype.littleEndian),
  );
}

describe("parseMat: headers that are not Level 5", () => {
  it("an HDF5 file (MATLAB -v7.3) is named as such from its signature alone", () => {
    // HDF5 File Format Specification, superblock: the format signature \x89 H D F \r \n \x1a \n.
    const hdf5 = new Uint8Array(512);
    hdf5.set([0x89, 0x48, 0x44, 0x46, 0x0d, 0x0a, 0x1a, 0x0a]);
    const e = errorOf(() => parse(hdf5));
    expect(e.problem).toBe("unknown-format");
    expect(e.message).toBe(
      `${FILE}: a MATLAB 7.3 MAT-file (HDF5) is not read; save it with save(..., '-v7')`,
    );
    // A second byte "H" alone does not make a file HDF5.
    const text = new TextEncoder().encode("THE MATRIX\n1 2\n2 1\n");
    expect(errorOf(() => parse(text)).message).toBe(
      `${FILE}: byte 0: not a Level 5 MAT-file: the header does not start with "MATLAB"`,
    );
  });

  it("an endian indicator other than IM or MI, and a version other than 0x0100, are refused at their byte", () => {
    const body = matrixElement("M", 1, 1, [1], true);
    const indicator = errorOf(() => parse(concat(matHeader(true, "XY"), body)));
    expect(indicator.problem).toBe("unknown-format");
    expect(indicator.message).toBe(
      `${FILE}: byte 126: not a Level 5 MAT-file: endian indicator is "XY", not "IM" or "MI"`,
    );
    const version = errorOf(() => parse(concat(matHeader(true, undefined, 0x0200), body)));
    expect(version.problem).toBe("unknown-format");
    expect(version.message).toBe(`${FILE}: byte 124: MAT-file version 0x200 is not Level 5 (0x0100)`);
  });
});

describe("parseMat: miMATRIX elements", () => {
  it("an miMATRIX of 0 bytes is an empty variable", () => {
    expect(parse(concat(matHeader(), element(14, new Uint8Array(0))))).toEqual([
      { name: "", className: "empty", dims: [0, 0], complex: false, byteOffset: 128 },
    ]);
  });

  it("names each class by its mxCLASS number, logical by its flag", () => {
    // Format document, "MATLAB Array Types and Classes": 1 cell … 15 uint64; 16 and 17 as scipy.io.matlab's
    // _mio5_params names them (mxFUNCTION_CLASS = 16, mxOPAQUE_CLASS = 17; python3-scipy 1.17.1).
    const names = [
      "cell",
      "struct",
      "object",
      "char",
      "sparse",
      "double",
      "single",
      "int8",
      "uint8",
      "int16",
      "uint16",
      "int32",
      "uint32",
      "int64",
      "uint64",
      "function handle",
      "opaque",
    ];
    const parts = names.map((_, k) =>
      miMatrix([flagsElement(k + 1), dimsElement([1, 1]), nameElement(`v${k + 1}`), doublesElement([k + 1])]),
    );
    // Logical: flag 0x02 over class uint8, one byte per value.
    parts.push(
      miMatrix([
        flagsElement(9, 0x02),
        dimsElement([1, 1]),
        nameElement("b"),
        element(2, new Uint8Array([1])),
      ]),
    );
    parts.push(miMatrix([flagsElement(20), dimsElement([1, 1]), nameElement("odd")]));
    const variables = parse(concat(matHeader(), ...parts));
    expect(variables.map((v) => [v.name, v.className])).toEqual([
      ...names.map((n, k) => [`v${k + 1}`, n]),
      ["b", "logical"],
      ["odd", "class 20"],
    ]);
  });

  it("gives the data's dtype as numpy writes it: '|u1' for bytes, '<' or '>' by the file's byte order", () => {
    // numpy.dtype("u1").str, .dtype(">f8").str, .dtype("<f8").str: "|u1", ">f8", "<f8" (python3-numpy).
    const bytes = concat(matHeader(), matrixElement("U", 2, 2, [0, 1, 1, 0], true, "miUINT8"));
    expect(parse(bytes)[0].array?.dtype.descr).toBe("|u1");
    expect(parse(matFile("B", 1, 1, [2], false, false))[0].array?.dtype.descr).toBe(">f8");
    expect(parse(matFile("L", 1, 1, [2], true, false))[0].array?.dtype.descr).toBe("<f8");
  });

  it.each([
    [
      "array flags shorter than 8 bytes",
      [element(6, new Uint8Array(4)), dimsElement([1, 1]), nameElement("M"), doublesElement([1])],
      "bad-header",
      "array flags sub-element is shorter than 8 bytes",
    ],
    [
      "a negative dimension",
      [flagsElement(6), dimsElement([2, -3]), nameElement("N"), doublesElement([])],
      "bad-header",
      'variable "N" has a negative dimension (2×-3)',
    ],
    [
      "data of a type that holds no numbers (miUTF8, 16)",
      [flagsElement(6), dimsElement([1, 2]), nameElement("M"), element(16, new Uint8Array(16))],
      "bad-header",
      'variable "M": data of element type 16 is not numeric',
    ],
    [
      "fewer values than the dimensions need",
      [flagsElement(6), dimsElement([3, 3]), nameElement("M"), doublesElement([1, 2, 3, 4, 5, 6, 7, 8])],
      "truncated",
      'variable "M": 3×3 elements of 8 bytes need 72 bytes, the element holds 64',
    ],
  ])("%s is refused at the variable's byte", (_, parts, problem, reason) => {
    const e = errorOf(() => parse(concat(matHeader(), miMatrix(parts))));
    expect(e.problem).toBe(problem);
    expect(e.message).toBe(`${FILE}: byte 128: ${reason}`);
  });

  it("data running past its miMATRIX element is refused even when the file goes on", () => {
    const parts = [flagsElement(6), dimsElement([1, 2]), nameElement("M"), doublesElement([1, 2])];
    const body = concat(...parts);
    // The element declares 16 bytes less than its data needs; the 16 bytes are still in the file.
    const e = errorOf(() => parse(concat(matHeader(), miMatrix(parts, true, body.length - 16))));
    expect(e.problem).toBe("bad-header");
    expect(e.message).toBe(`${FILE}: byte 128: variable "M": its data runs past the end of its element`);
  });

  it("an element of another type cut short names its type and the bytes that follow", () => {
    const tag = new Uint8Array(8);
    new DataView(tag.buffer).setUint32(0, 2, true); // miUINT8
    new DataView(tag.buffer).setUint32(4, 100, true);
    const e = errorOf(() => parse(concat(matHeader(), tag, new Uint8Array(10))));
    expect(e.problem).toBe("truncated");
    expect(e.message).toBe(
      `${FILE}: byte 128: file is truncated: a type 2 element declares 100 bytes but only 10 follow`,
    );
  });
});

describe("parseMat: miCOMPRESSED elements", () => {
  const BAD_TAG = new Uint8Array([0x63, 0, 0, 0, 8, 0, 0, 0]); // type 99: no MAT-file data type
  const noType = (where: string) =>
    `no MAT-file data element starts here${where}: its tag (0x00000063) names no MATLAB data type; the bytes are damaged or not MAT-file data`;

  it("a bad tag inside a compressed element is placed at the compressed element", () => {
    const e = errorOf(() => parse(concat(matHeader(), compressedElement(BAD_TAG))));
    expect(e.problem).toBe("bad-header");
    expect(e.message).toBe(`${FILE}: byte 128: ${noType(" inside the compressed element")}`);
  });

  it("a bad tag among a compressed variable's fields is that error, even when its declared size passes maxBytes", () => {
    const inner = concat(new Uint8Array(8), BAD_TAG, new Uint8Array(8));
    new DataView(inner.buffer).setUint32(0, 14, true);
    new DataView(inner.buffer).setUint32(4, 10 * 2 ** 20, true); // declares 10 MiB
    const e = errorOf(() => parse(concat(matHeader(), compressedElement(inner)), 2 ** 20));
    expect(e.problem).toBe("bad-header");
    expect(e.message).toBe(`${FILE}: byte 128: ${noType(" inside the compressed element")}`);
  });

  it("a bad tag where a compressed variable's data starts is placed at the compressed element", () => {
    const inner = miMatrix([
      flagsElement(6),
      dimsElement([1, 1]),
      nameElement("D"),
      BAD_TAG,
      new Uint8Array(8),
    ]);
    const first = matrixElement("A", 1, 1, [1], true);
    expect(first.length).toBe(72);
    const e = errorOf(() => parse(concat(matHeader(), first, compressedElement(inner))));
    expect(e.problem).toBe("bad-header");
    expect(e.message).toBe(`${FILE}: byte 200: ${noType(" inside the compressed element")}`);
  });

  it("a compressed element holding something other than an miMATRIX is skipped", () => {
    const other = compressedElement(element(2, new Uint8Array([1, 2, 3, 4, 5, 6, 7, 8])));
    const variables = parse(concat(matHeader(), other, matrixElement("M", 1, 1, [4], true)));
    expect(variables.map((v) => v.name)).toEqual(["M"]);
  });

  it("a compressed element of 0 bytes cannot be unpacked", () => {
    const empty = compressedElement(new Uint8Array(0), true, new Uint8Array(0));
    const e = errorOf(() => parse(concat(matHeader(), empty)));
    expect(e.problem).toBe("truncated");
    expect(e.message).toMatch(
      /^t\.mat: byte 128: a compressed element cannot be unpacked \(.+\); the file is truncated or damaged$/,
    );
  });

  it("a zlib stream cut short at exactly 1024 bytes cannot be unpacked", () => {
    // 248 doubles: an element of 2056 bytes, one stored block; the stream stops inside it.
    const inner = miMatrix([
      flagsElement(6),
      dimsElement([1, 248]),
      nameElement("v"),
      doublesElement(new Array(248).fill(1)),
    ]);
    const stream = storedZlib(inner).subarray(0, 1024);
    const e = errorOf(() => parse(concat(matHeader(), compressedElement(inner, true, stream))));
    expect(e.problem).toBe("truncated");
    expect(e.message).toMatch(
      /^t\.mat: byte 128: a compressed element cannot be unpacked \(.+\); the file is truncated or damaged$/,
    );
  });

  it("a zlib stream of exactly 1024 bytes is read whole", () => {
    // 118 doubles: an element of 1008 bytes in two stored blocks, 2 + 509 + 509 + 4 = 1024 bytes.
    const values = Array.from({ length: 118 }, (_, k) => k + 0.5);
    const inner = miMatrix([
      flagsElement(6),
      dimsElement([1, 118]),
      nameElement("v"),
      doublesElement(values),
    ]);
    expect(inner.length).toBe(1008);
    const stream = storedZlib(inner, [504]);
    expect(stream.length).toBe(1024);
    const [v] = parse(concat(matHeader(), compressedElement(inner, true, stream)));
    expect(v.dims).toEqual([1, 118]);
    expect(doublesOf(v.array!, 118)).toEqual(values);
  });

  it("a compressed variable whose stream holds less than it declares is truncated, with the byte counts", () => {
    const parts = [
      flagsElement(6),
      dimsElement([3, 3]),
      nameElement("M"),
      doublesElement(new Array(9).fill(2)),
    ];
    const body = concat(...parts);
    expect(body.length).toBe(128);
    const e = errorOf(() => parse(concat(matHeader(), compressedElement(miMatrix(parts, true, 928)))));
    expect(e.problem).toBe("truncated");
    expect(e.message).toBe(
      `${FILE}: byte 128: file is truncated: a miMATRIX element inside the compressed element declares 928 bytes but only 128 follow`,
    );
  });

  it("a variable whose header passes 4096 bytes (1025 dimensions) is read from the whole element", () => {
    const dims = new Array(1025).fill(1);
    const inner = miMatrix([flagsElement(6), dimsElement(dims), nameElement("H"), doublesElement([7])]);
    const [v] = parse(concat(matHeader(), compressedElement(inner)));
    expect(v.dims).toEqual(dims);
    expect(doublesOf(v.array!, 1)).toEqual([7]);
  });

  it("such a variable declaring more than maxBytes is refused from its declared size", () => {
    const dims = new Array(1100).fill(1);
    const body = concat(flagsElement(6), dimsElement(dims), nameElement("H"), doublesElement([7]));
    const inner = concat(new Uint8Array(8), body);
    new DataView(inner.buffer).setUint32(0, 14, true);
    new DataView(inner.buffer).setUint32(4, 10 * 2 ** 20, true);
    const e = errorOf(() => parse(concat(matHeader(), compressedElement(inner)), 2 ** 20));
    expect(e.problem).toBe("too-large");
    expect(e.message).toBe(
      `${FILE}: byte 128: a compressed variable unpacks to 10 MiB, more than the limit of 1 MiB; raise maxBytes if you have the memory`,
    );
  });
});

describe("parseMat: the limits on compressed variables", () => {
  // A 30×30 double matrix of zeros: an element of 7264 bytes (more than the 4096 read for its header).
  const A = zeros("A", [30, 30]);
  const B = zeros("B", [30, 30]);

  it("a variable declaring exactly maxBytes is read", () => {
    expect(A.length).toBe(7264);
    const [a] = parse(concat(matHeader(), compressedElement(A)), 7264);
    expect(a.refused).toBeUndefined();
    expect(a.dims).toEqual([30, 30]);
    expect(doublesOf(a.array!, 900)).toEqual(new Array(900).fill(0));
  });

  it("maxBytes bounds the variables together: the second is refused with what is left", () => {
    const variables = parse(concat(matHeader(), compressedElement(A), compressedElement(B)), 10896);
    expect(variables[0].refused).toBeUndefined();
    expect(variables[1].refused?.problem).toBe("too-large");
    expect(variables[1].refused?.message).toBe(
      `${FILE}: byte ${128 + compressedElement(A).length}: variable "B": a compressed variable unpacks to 7.1 KiB, more than the limit of 3.5 KiB; raise maxBytes if you have the memory`,
    );
  });

  it("a stream that unpacks to more than it declares stops at the limit", () => {
    const lying = compressedElement(concat(A, new Uint8Array(200000)));
    const e = errorOf(() => parse(concat(matHeader(), lying), 102400));
    expect(e.problem).toBe("too-large");
    expect(e.message).toBe(
      `${FILE}: byte 128: a compressed variable unpacks to more than the limit of 100 KiB; raise maxBytes if you have the memory`,
    );
    // After a first variable, the limit is what that one left: 102400 − 7264 bytes.
    const second = compressedElement(concat(B, new Uint8Array(90000)));
    const first = compressedElement(A);
    const e2 = errorOf(() => parse(concat(matHeader(), first, second), 102400));
    expect(e2.message).toBe(
      `${FILE}: byte ${128 + first.length}: a compressed variable unpacks to more than the limit of 92.9 KiB; raise maxBytes if you have the memory`,
    );
  });

  it("only real numeric variables count against maxBytes: a long char variable is listed, not refused", () => {
    const text = new Uint8Array(10000);
    for (let k = 0; k < text.length; k += 2) text[k] = 0x78; // "x" as miUINT16 (4)
    const label = miMatrix([flagsElement(4), dimsElement([1, 5000]), nameElement("label"), element(4, text)]);
    const variables = parse(concat(matHeader(), compressedElement(label), compressedElement(A)), 8000);
    expect(variables.map((v) => [v.name, v.className, v.refused === undefined])).toEqual([
      ["label", "char", true],
      ["A", "double", true],
    ]);
  });

  it.each([
    ["a numpy stack k × n × n", [2, 30, 30]],
    ["a MATLAB stack n × n × k", [30, 30, 2]],
  ])("maxCells bounds each matrix of %s, from the header", (_, dims) => {
    const [s] = parse(concat(matHeader(), compressedElement(zeros("S", dims))), BIG, 100);
    expect(s.refused?.problem).toBe("too-large");
    expect(s.refused?.message).toBe(
      `${FILE}: byte 128: variable "S": a 30×30 matrix has 900 cells, more than the limit of 100; raise maxCells if you have the memory`,
    );
  });

  it("a 4-D variable is not a matrix: maxCells does not refuse it", () => {
    const [f] = parse(concat(matHeader(), compressedElement(zeros("F", [20, 20, 20, 2]))), BIG, 100);
    expect(f.refused).toBeUndefined();
    expect(f.array?.shape).toEqual([20, 20, 20, 2]);
  });

  it("an empty stack of 10000×10000 matrices is refused by maxCells (the matrices' size, not their count)", () => {
    const [z] = parse(concat(matHeader(), compressedElement(zeros("Z", [10000, 10000, 0]))));
    expect(z.refused?.message).toBe(
      `${FILE}: byte 128: variable "Z": a 10000×10000 matrix has 100000000 cells, more than the limit of 67108864; raise maxCells if you have the memory`,
    );
  });

  it("negative dimensions are refused as such, not by maxCells", () => {
    const inner = miMatrix([
      flagsElement(6),
      dimsElement([-10000, -10000, 2]),
      nameElement("N"),
      doublesElement([]),
    ]);
    const e = errorOf(() => parse(concat(matHeader(), compressedElement(inner))));
    expect(e.problem).toBe("bad-header");
    expect(e.message).toBe(`${FILE}: byte 128: variable "N" has a negative dimension (-10000×-10000×2)`);
  });
});
