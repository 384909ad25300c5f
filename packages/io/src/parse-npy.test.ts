import { describe, expect, it } from "vitest";
import { encodeNpy } from "./encode-npy.js";
import { InputFileError } from "./input-file-error.js";
import { npyToGraphs } from "./npy-graphs.js";
import { npyHeaderEnd, npyValues, parseNpy, parseNpyHeader } from "./parse-npy.js";
import type { GraphReadOptions } from "./read-options.js";

/**
 * Builds .npy bytes by hand, following the NumPy format specification (NEP 1): magic "\x93NUMPY",
 * major and minor version bytes, header length (uint16 LE for 1.0, uint32 LE for 2.0/3.0), the header
 * dictionary text ending in "\n", then the raw data.
 */
function npyBytes(header: string, data: ArrayLike<number>, major = 1): Uint8Array {
  const lengthBytes = major === 1 ? 2 : 4;
  const headerBytes = new TextEncoder().encode(`${header}\n`);
  const out = new Uint8Array(8 + lengthBytes + headerBytes.length + data.length);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, major, 0]);
  const view = new DataView(out.buffer);
  if (major === 1) view.setUint16(8, headerBytes.length, true);
  else view.setUint32(8, headerBytes.length, true);
  out.set(headerBytes, 8 + lengthBytes);
  out.set(Array.from(data), 8 + lengthBytes + headerBytes.length);
  return out;
}

function failure(bytes: Uint8Array, options: GraphReadOptions = {}): InputFileError {
  try {
    npyToGraphs(parseNpy(bytes, "a.npy"), "a.npy", options);
  } catch (error) {
    if (error instanceof InputFileError) return error;
    throw error;
  }
  throw new Error("expected an InputFileError");
}

const HEADER_2x2_U1 = "{'descr': '|u1', 'fortran_order': False, 'shape': (2, 2), }";

describe("parseNpy: hand-built files per the format specification", () => {
  it("reads versions 1.0, 2.0 and 3.0 (3.0 with a UTF-8 header)", () => {
    for (const major of [1, 2, 3]) {
      const array = parseNpy(npyBytes(HEADER_2x2_U1, [0, 7, 7, 0], major), "a.npy");
      expect(array.version).toBe(`${major}.0`);
      expect(Array.from(npyValues(array))).toEqual([0, 7, 7, 0]);
    }
  });

  it("reads a big-endian int16 in Fortran order element by element", () => {
    // Fortran order stores column by column: a[0,0], a[1,0], a[0,1], a[1,1] (NEP 1, 'fortran_order').
    const header = "{'descr': '>i2', 'fortran_order': True, 'shape': (2, 2), }";
    const data = [0, 1, 0xff, 0xfe, 0x01, 0x00, 0, 4]; // 1, -2, 256, 4 big-endian
    expect(Array.from(npyValues(parseNpy(npyBytes(header, data), "a.npy")))).toEqual([1, 256, -2, 4]);
  });

  it("accepts Python 2 era headers with long integers and double quotes", () => {
    const header = '{"descr": "|b1", "fortran_order": False, "shape": (2L, 2L)}';
    expect(parseNpy(npyBytes(header, [0, 1, 1, 0]), "a.npy").shape).toEqual([2, 2]);
  });
});

describe("parseNpy: errors", () => {
  it("empty file", () => {
    expect(failure(new Uint8Array(0)).message).toBe("a.npy: file is empty (0 bytes)");
  });

  it("bad magic, with the offending byte", () => {
    const bytes = npyBytes(HEADER_2x2_U1, [0, 1, 1, 0]);
    bytes[3] = 0x58;
    expect(failure(bytes).message).toBe(
      'a.npy: byte 3: not a .npy file: it does not start with "\\x93NUMPY"',
    );
    expect(failure(new TextEncoder().encode("0,1\n1,0\n")).problem).toBe("bad-npy");
  });

  it("unknown version", () => {
    expect(failure(npyBytes(HEADER_2x2_U1, [0, 1, 1, 0], 4)).message).toBe(
      "a.npy: byte 6: unsupported .npy format version 4.0 (this reader knows 1.0, 2.0 and 3.0)",
    );
  });

  it("malformed header dictionary, with the byte where parsing stopped", () => {
    // The dictionary is never closed: parsing stops at the end of the 58-byte header, byte 10 + 58 = 68.
    const error = failure(npyBytes("{'descr': '<f8', 'fortran_order': False, 'shape': (2, 2) ", []));
    expect(error.message).toBe(
      'a.npy: byte 68: header is not a valid dictionary: expected "}" but found the end of the header',
    );
    expect(failure(npyBytes("{'descr': '<f8', 'shape': (2, 2)}", [])).reason).toBe(
      "header keys are 'descr', 'shape'; a .npy header has exactly 'descr', 'fortran_order' and 'shape' (numpy refuses any other set)",
    );
    expect(failure(npyBytes("{'descr': '<f8', 'fortran_order': 0, 'shape': (2, 2)}", [])).reason).toBe(
      "header has no 'fortran_order' True/False",
    );
    expect(failure(npyBytes("{'descr': '<f8', 'fortran_order': False, 'shape': (2, -1)}", [])).reason).toBe(
      "header 'shape' (2, -1) is not a tuple of non-negative integers",
    );
  });

  it("unsupported dtypes: complex, float16, strings, structured", () => {
    for (const descr of ["<c16", "<f2", "<U8", "|S3", "<M8"]) {
      const error = failure(
        npyBytes(`{'descr': '${descr}', 'fortran_order': False, 'shape': (1, 1), }`, [0]),
      );
      expect(error.problem).toBe("unsupported-dtype");
      expect(error.position.byteOffset).toBe(10); // where the version 1.0 header starts
      expect(error.reason).toMatch(new RegExp(`^unsupported dtype "${descr}"; supported: float32, float64,`));
    }
    const structured = "{'descr': [('a', '<f8')], 'fortran_order': False, 'shape': (1,), }";
    expect(failure(npyBytes(structured, [])).reason).toBe("structured (record) arrays are not supported");
  });

  it("truncated in the magic, in the header and in the data", () => {
    const whole = encodeNpy([0, 1, 1, 0], [2, 2]);
    expect(failure(whole.subarray(0, 4)).message).toBe(
      "a.npy: file is truncated: 4 bytes, inside the .npy magic string",
    );
    expect(failure(whole.subarray(0, 40)).message).toBe(
      "a.npy: byte 8: file is truncated: the header claims 118 bytes, ending at byte 128, but the file has 40",
    );
    expect(failure(whole.subarray(0, whole.length - 1)).message).toBe(
      "a.npy: byte 159: file is truncated: shape (2, 2) of <f8 needs 32 bytes of data after byte 128, but only 31 are there",
    );
    // One dimension is written as Python writes a 1-tuple, as in the header (numpy.lib.format writes
    // 'shape': (3,)), and as the header errors quote it.
    const vector = encodeNpy([1, 2, 3], [3]);
    expect(failure(vector.subarray(0, vector.length - 8)).reason).toBe(
      "file is truncated: shape (3,) of <f8 needs 24 bytes of data after byte 128, but only 16 are there",
    );
  });

  it("refuses a forged huge shape before allocating anything", () => {
    const error = failure(
      npyBytes("{'descr': '<f8', 'fortran_order': False, 'shape': (100000000000, 100000000000), }", []),
    );
    expect(error.problem).toBe("too-large");
    expect(error.reason).toBe(
      "header shape (100000000000, 100000000000) describes more data than any file can hold",
    );
    const big = failure(
      npyBytes("{'descr': '<f8', 'fortran_order': False, 'shape': (100000, 100000), }", []),
    );
    expect(big.problem).toBe("truncated");
  });
});

describe("npyToGraphs", () => {
  it("one graph from (n, n), k graphs from (k, n, n)", () => {
    const stack = [0, 1, 1, 0, 0, 2, 2, 0, 0, 0, 0, 0];
    const { graphs } = npyToGraphs(parseNpy(encodeNpy(stack, [3, 2, 2]), "s.npy"), "s.npy");
    expect(graphs.map((g) => Array.from(g.weights))).toEqual([[1, 1], [2, 2], []]);
  });

  it("bool arrays: true is an edge of weight 1, false is none even for distances", () => {
    const bytes = npyBytes(
      "{'descr': '|b1', 'fortran_order': False, 'shape': (3, 3), }",
      [1, 1, 0, 1, 1, 1, 0, 1, 1],
    );
    const { graphs } = npyToGraphs(parseNpy(bytes, "b.npy"), "b.npy", { semantics: "distance" });
    expect(Array.from(graphs[0].targets)).toEqual([1, 0, 2, 1]);
    expect(Array.from(graphs[0].weights)).toEqual([1, 1, 1, 1]);
  });

  it("shape errors", () => {
    expect(failure(encodeNpy([1, 2, 3], [3])).message).toBe(
      "a.npy: array of shape (3,) is neither a matrix (n, n) nor a stack of matrices (k, n, n)",
    );
    expect(failure(encodeNpy([1, 2, 3, 4, 5, 6], [2, 3])).message).toBe(
      "a.npy: matrices of shape (2, 3) are not square",
    );
  });

  it("NaN off the diagonal is an error naming the element and its byte; the diagonal is ignored", () => {
    const error = failure(encodeNpy([Number.NaN, 1, Number.NaN, 0], [2, 2]), { nanIsNoEdge: false });
    expect(error.message).toBe(
      'a.npy: element (1, 0) at byte 144: NaN is not a finite weight (set nanIsNoEdge to read NaN as "no edge")',
    );
    const { graphs } = npyToGraphs(
      parseNpy(encodeNpy([Number.NaN, 1, Number.NaN, 0], [2, 2]), "a.npy"),
      "a.npy",
      { symmetrize: "max" },
    );
    expect(Array.from(graphs[0].weights)).toEqual([1, 1]);
  });

  it("infinity, negative and asymmetric entries in a stack name the element", () => {
    expect(failure(encodeNpy([0, Number.POSITIVE_INFINITY, 1, 0], [2, 2])).message).toBe(
      "a.npy: element (0, 1) at byte 136: weight Infinity is not a finite number",
    );
    const stack = [0, 1, 1, 0, 0, -3, -3, 0];
    expect(failure(encodeNpy(stack, [2, 2, 2]), { negative: "error" }).message).toBe(
      "a.npy: element (1, 0, 1) at byte 168: negative weight -3; choose a negative-weight policy (abs, drop or keep) to accept it",
    );
    expect(failure(encodeNpy([0, 1, 1, 0, 0, 2, 5, 0], [2, 2, 2])).message).toBe(
      "a.npy: element (1, 0, 1) at byte 168: matrix is not symmetric: 2 here but 5 at element (1, 1, 0) (relative difference 0.6, above the tolerance 1e-9); read it as directed or choose a symmetrize policy (max, min, mean)",
    );
  });

  it("warns when 64-bit integers lose precision as float64", () => {
    // 2^60 + 1 needs 61 significant bits; a float64 holds 53 (IEEE 754 binary64).
    const data = new Uint8Array(32);
    new DataView(data.buffer).setBigInt64(8, 2n ** 60n + 1n, true);
    new DataView(data.buffer).setBigInt64(16, 2n ** 60n + 1n, true);
    const bytes = npyBytes("{'descr': '<i8', 'fortran_order': False, 'shape': (2, 2), }", data);
    const { graphs, warnings } = npyToGraphs(parseNpy(bytes, "a.npy"), "a.npy");
    expect(Array.from(graphs[0].weights)).toEqual([2 ** 60, 2 ** 60]);
    expect(warnings).toEqual([
      "2 64-bit integer weights exceed 2^53 and were rounded to the nearest float64",
    ]);
  });

  it("warns about bytes after the data", () => {
    const bytes = encodeNpy([0, 1, 1, 0], [2, 2]);
    const padded = new Uint8Array(bytes.length + 3);
    padded.set(bytes);
    expect(npyToGraphs(parseNpy(padded, "a.npy"), "a.npy").warnings).toEqual([
      "ignored 3 bytes after the array data",
    ]);
  });
});

// Hostile and empty headers of the audit of issue 8. numpy.lib.format refuses a header whose keys are not
// exactly descr, fortran_order and shape ("Header does not contain the correct keys"), recalled from its
// source; the messages here are ours.
describe("parseNpy: headers that must not be believed", () => {
  it("a __proto__ key is a key like any other: refused for the keys, not read through the prototype", () => {
    const header = "{'__proto__': {'descr': '<f8', 'fortran_order': False, 'shape': (2, 2)}}";
    const error = failure(npyBytes(header, new Uint8Array(32)));
    expect(error.problem).toBe("bad-npy");
    expect(error.message).toBe(
      "a.npy: byte 10: header keys are '__proto__'; a .npy header has exactly 'descr', 'fortran_order' and 'shape' (numpy refuses any other set)",
    );
    expect(({} as Record<string, unknown>).descr).toBeUndefined();
    const extra = "{'descr': '<f8', 'fortran_order': False, 'shape': (2, 2), 'note': 'x'}";
    expect(failure(npyBytes(extra, new Uint8Array(32))).reason).toMatch(
      /^header keys are 'descr', 'fortran_order', 'note', 'shape'; /,
    );
  });

  it("a header nested 200,000 levels deep is a clear error, not a stack overflow", () => {
    const deep = `{'descr': ${"[".repeat(200_000)}${"]".repeat(200_000)}}`;
    const bytes = npyBytes(deep, [], 2);
    const error = failure(bytes);
    expect(error.problem).toBe("bad-npy");
    expect(error.message).toBe(
      "a.npy: byte 53: header is not a valid dictionary: nested more than 32 levels deep",
    );
  });

  it("shapes above 2^53 are too large, not 'not integers'; huge products too", () => {
    const big = "{'descr': '<f8', 'fortran_order': False, 'shape': (18446744073709551617, 2), }";
    const error = failure(npyBytes(big, []));
    expect(error.problem).toBe("too-large");
    expect(error.message).toBe(
      "a.npy: byte 10: header shape (18446744073709551617, 2) has a dimension above 2^53: more data than any file can hold",
    );
    const long = `{'descr': '<f8', 'fortran_order': False, 'shape': (${"9".repeat(60)},), }`;
    expect(failure(npyBytes(long, [])).problem).toBe("too-large");
  });

  it("(0, 0), (3, 0, 0) and (0, 3, 3) arrays hold no graph and are refused like an empty file", () => {
    for (const [shape, what] of [
      ["(0, 0)", "nodes"],
      ["(3, 0, 0)", "nodes"],
      ["(0, 3, 3)", "matrices"],
    ]) {
      const error = failure(npyBytes(`{'descr': '<f8', 'fortran_order': False, 'shape': ${shape}, }`, []));
      expect(error.problem).toBe("empty-file");
      expect(error.message).toBe(
        `a.npy: array of shape ${shape} holds no ${what}: there is no graph to read`,
      );
    }
  });
});

describe("npyHeaderEnd: where the data start, from the first bytes only (NEP 1 layout)", () => {
  it("10 + the uint16 length for version 1.0, 12 + the uint32 length for 2.0 and 3.0", () => {
    const v1 = npyBytes(HEADER_2x2_U1, [0, 1, 1, 0]);
    expect(npyHeaderEnd(v1)).toBe(v1.length - 4);
    expect(npyHeaderEnd(v1.subarray(0, 10))).toBe(v1.length - 4);
    for (const major of [2, 3]) {
      const v = npyBytes(HEADER_2x2_U1, [0, 1, 1, 0], major);
      expect(npyHeaderEnd(v), `version ${major}`).toBe(v.length - 4);
      expect(npyHeaderEnd(v.subarray(0, 12))).toBe(v.length - 4);
      // The uint32 length is not all there yet.
      expect(npyHeaderEnd(v.subarray(0, 11))).toBeUndefined();
    }
  });

  it("undefined for too few bytes or another magic", () => {
    const v1 = npyBytes(HEADER_2x2_U1, [0, 1, 1, 0]);
    expect(npyHeaderEnd(v1.subarray(0, 9))).toBeUndefined();
    const other = v1.slice();
    other[3] = 0x41;
    expect(npyHeaderEnd(other)).toBeUndefined();
  });
});

/**
 * A .npy file as the NumPy format specification lays it out (NEP 1, "A simple file format for NumPy arrays";
 * numpy.lib.format): magic "\x93NUMPY", major and minor version bytes, the header length as a little-endian
 * uint16 (1.0) or uint32 (2.0, 3.0), then the header, padded with spaces and ended by "\n" so that magic,
 * version, length and header together fill a multiple of 64 bytes, then the data. `header` is bytes, so a
 * test can write latin-1 (1.0, 2.0) or UTF-8 (3.0) itself.
 */
function specNpy(header: Uint8Array, major: number, data: ArrayLike<number> = []): Uint8Array {
  const lengthBytes = major === 1 ? 2 : 4;
  const unpadded = 8 + lengthBytes + header.length + 1;
  const headerLength = header.length + ((64 - (unpadded % 64)) % 64) + 1;
  const out = new Uint8Array(8 + lengthBytes + headerLength + data.length);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, major, 0]);
  const view = new DataView(out.buffer);
  if (major === 1) view.setUint16(8, headerLength, true);
  else view.setUint32(8, headerLength, true);
  out.set(header, 8 + lengthBytes);
  out.fill(0x20, 8 + lengthBytes + header.length, 8 + lengthBytes + headerLength - 1);
  out[8 + lengthBytes + headerLength - 1] = 0x0a;
  out.set(Array.from(data), 8 + lengthBytes + headerLength);
  return out;
}

const ascii = (text: string) => new TextEncoder().encode(text);
const F8_2x2 = "{'descr': '<f8', 'fortran_order': False, 'shape': (2, 2), }";

describe("parseNpy: mistakes found by mutation testing to be untested (third round)", () => {
  it("the padding helper follows the specification: the data start at a multiple of 64", () => {
    for (const major of [1, 2, 3]) {
      const bytes = specNpy(ascii(F8_2x2), major, new Uint8Array(32));
      expect(npyHeaderEnd(bytes), `version ${major}`).toBe(128);
      expect(Array.from(npyValues(parseNpy(bytes, "a.npy")))).toEqual([0, 0, 0, 0]);
    }
    // The same bytes as our writer, which io-npy-numpy.test.ts checks byte for byte against np.save.
    expect(specNpy(ascii(F8_2x2), 1, new Uint8Array(32))).toEqual(encodeNpy([0, 0, 0, 0], [2, 2]));
  });

  it("cut after the magic, before or inside the header length: the byte count, and no byte named", () => {
    const v1 = specNpy(ascii(F8_2x2), 1, new Uint8Array(32));
    const v2 = specNpy(ascii(F8_2x2), 2, new Uint8Array(32));
    const cases: [Uint8Array, string][] = [
      [v1.subarray(0, 6), "file is truncated: 6 bytes, before the version number"],
      [v1.subarray(0, 7), "file is truncated: 7 bytes, before the version number"],
      // The version is there: the cut is inside the 2-byte (1.0) or 4-byte (2.0) length field.
      [v1.subarray(0, 8), "file is truncated: 8 bytes, inside the header length field"],
      [v1.subarray(0, 9), "file is truncated: 9 bytes, inside the header length field"],
      [v2.subarray(0, 11), "file is truncated: 11 bytes, inside the header length field"],
    ];
    for (const [bytes, reason] of cases) {
      const error = failure(bytes);
      expect(error.message).toBe(`a.npy: ${reason}`);
      expect(error.problem).toBe("truncated");
      // No byte is named: the position carries no byteOffset key at all, not one set to undefined.
      expect(error.position).toStrictEqual({});
    }
  });

  it("cut right after the length field: the header length is read and found past the end", () => {
    // 118 (1.0) or 116 (2.0) bytes of padded header after 10 or 12 bytes of magic, version and length.
    expect(failure(specNpy(ascii(F8_2x2), 1).subarray(0, 10)).message).toBe(
      "a.npy: byte 8: file is truncated: the header claims 118 bytes, ending at byte 128, but the file has 10",
    );
    expect(failure(specNpy(ascii(F8_2x2), 2).subarray(0, 12)).message).toBe(
      "a.npy: byte 8: file is truncated: the header claims 116 bytes, ending at byte 128, but the file has 12",
    );
  });

  it("versions 0.0 and 1.1 are unknown, at byte 6", () => {
    for (const [major, minor] of [
      [0, 0],
      [1, 1],
    ]) {
      const bytes = specNpy(ascii(F8_2x2), 1, new Uint8Array(32));
      bytes[6] = major;
      bytes[7] = minor;
      expect(failure(bytes).message).toBe(
        `a.npy: byte 6: unsupported .npy format version ${major}.${minor} (this reader knows 1.0, 2.0 and 3.0)`,
      );
    }
  });

  it("a 3.0 header is UTF-8 and a 2.0 header latin-1: a non-ASCII key is named as written", () => {
    // 'é' is C3 A9 in UTF-8 and E9 in latin-1 (ISO/IEC 8859-1; Unicode U+00E9).
    const keys =
      "header keys are 'descr', 'fortran_order', 'shape', 'é'; a .npy header has exactly 'descr', 'fortran_order' and 'shape' (numpy refuses any other set)";
    const v3 = failure(specNpy(ascii(`${F8_2x2.slice(0, -1)}'é': 1}`), 3, new Uint8Array(32)));
    expect(v3.message).toBe(`a.npy: byte 12: ${keys}`);
    const latin1 = Uint8Array.from([...ascii(`${F8_2x2.slice(0, -1)}'`), 0xe9, ...ascii("': 1}")]);
    const v2 = failure(specNpy(latin1, 2, new Uint8Array(32)));
    expect(v2.message).toBe(`a.npy: byte 12: ${keys}`);
  });

  it("a parse error after a multi-byte UTF-8 character names its byte, not its character index", () => {
    // "{'é': 1, 'descr': ]}": the "]" is character 18 of the header but byte 19 ('é' takes two bytes);
    // the 3.0 header starts at byte 12, so the "]" is byte 31. In latin-1 (2.0) 'é' is one byte: byte 30.
    const v3 = failure(specNpy(ascii("{'é': 1, 'descr': ]}"), 3));
    expect(v3.message).toBe('a.npy: byte 31: header is not a valid dictionary: unexpected "]"');
    expect(specNpy(ascii("{'é': 1, 'descr': ]}"), 3)[31]).toBe(0x5d); // "]"
    const latin1 = Uint8Array.from([...ascii("{'"), 0xe9, ...ascii("': 1, 'descr': ]}")]);
    expect(failure(specNpy(latin1, 2)).message).toBe(
      'a.npy: byte 30: header is not a valid dictionary: unexpected "]"',
    );
  });

  it("headers that are not a dict, an empty dict, a descr that is no string, a shape that is no tuple", () => {
    const cases: [string, string][] = [
      ["[1, 2]", "header is not a dictionary"],
      ["None", "header is not a dictionary"],
      [
        "{}",
        "header keys are none; a .npy header has exactly 'descr', 'fortran_order' and 'shape' (numpy refuses any other set)",
      ],
      ["{'descr': 8, 'fortran_order': False, 'shape': (2, 2)}", "header has no 'descr' string"],
      ["{'descr': '<f8', 'fortran_order': False, 'shape': 4}", "header 'shape' is not a tuple"],
    ];
    for (const [header, reason] of cases) {
      const error = failure(specNpy(ascii(header), 1));
      expect(error.message, header).toBe(`a.npy: byte 10: ${reason}`);
      expect(error.problem).toBe("bad-npy");
    }
  });

  it("a one-dimensional shape is written with its trailing comma, as Python writes a 1-tuple", () => {
    expect(
      failure(specNpy(ascii("{'descr': '<f8', 'fortran_order': False, 'shape': (-1,), }"), 1)).message,
    ).toBe("a.npy: byte 10: header 'shape' (-1,) is not a tuple of non-negative integers");
  });

  it("a dimension below -2^53 is not 'too large' but not a non-negative integer", () => {
    const error = failure(
      specNpy(ascii("{'descr': '<f8', 'fortran_order': False, 'shape': (-18446744073709551617, 2), }"), 1),
    );
    expect(error.problem).toBe("bad-npy");
    expect(error.message).toBe(
      "a.npy: byte 10: header 'shape' (-18446744073709551617, 2) is not a tuple of non-negative integers",
    );
  });

  it("the size limit counts bytes, elements × itemsize, and 2^53 - 1 bytes is still allowed", () => {
    // 2^50 float64 elements are 2^53 bytes: one over Number.MAX_SAFE_INTEGER (2^53 - 1, ECMA-262).
    const over = failure(
      specNpy(ascii("{'descr': '<f8', 'fortran_order': False, 'shape': (1125899906842624,), }"), 1),
    );
    expect(over.problem).toBe("too-large");
    expect(over.message).toBe(
      "a.npy: byte 10: header shape (1125899906842624,) describes more data than any file can hold",
    );
    // 2^53 - 1 one-byte elements: exactly at the limit, so the header is accepted (the data then is missing).
    const header = parseNpyHeader(
      specNpy(ascii("{'descr': '|u1', 'fortran_order': False, 'shape': (9007199254740991,), }"), 1),
      "a.npy",
    );
    expect(header.dataBytes).toBe(Number.MAX_SAFE_INTEGER);
    expect(header.dataOffset).toBe(128);
  });

  it("an array with a zero dimension has no values, and reading them reads no byte", () => {
    for (const shape of ["(0, 3)", "(0,)", "(2, 0)"]) {
      const bytes = specNpy(ascii(`{'descr': '<f8', 'fortran_order': False, 'shape': ${shape}, }`), 1);
      expect(npyHeaderEnd(bytes)).toBe(bytes.length); // no data at all
      expect(npyValues(parseNpy(bytes, "a.npy")), shape).toEqual(new Float64Array(0));
    }
  });
});
