// Damaged, empty and hostile .npz and .mat files give clear errors naming the file. The .mat files here are
// built byte by byte from the MATLAB 7 MAT-File Format document (MathWorks): 128-byte header with the
// "IM"/"MI" endian indicator, miMATRIX elements (array flags, dimensions, name, real part), miCOMPRESSED
// zlib wrappers; the zip layout follows PKWARE APPNOTE.
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { deflateSync, zlibSync } from "fflate";
import { afterAll, describe, expect, it } from "vitest";
import { readGraphFile } from "../read-graph-file.js";
import { encodeNpz } from "../write/encode-npz.js";
import { concat, errorOf, matFile, matrixElement } from "./mat-bytes.fixture.js";
import { readNpzFile } from "./read-npz.js";

const dir = mkdtempSync(join(tmpdir(), "cliquescape-bad-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const put = (name: string, bytes: Uint8Array) => {
  const path = join(dir, name);
  writeFileSync(path, bytes);
  return path;
};

// A directed 3-node matrix in column-major order: M(1,2) = 0.5, M(2,3) = 0.25, M(3,1) = 2.
const COLUMN_MAJOR = [0, 0, 2, 0.5, 0, 0, 0, 0.25, 0];

describe(".mat built from the format document", () => {
  it.each([
    ["little-endian", true, false],
    ["big-endian", false, false],
    ["compressed little-endian", true, true],
    ["compressed big-endian", false, true],
  ])("%s: column-major data gives the right arcs", (_, le, compress) => {
    const path = put(`m-${le}-${compress}.mat`, matFile("M", 3, 3, COLUMN_MAJOR, le, compress));
    const graph = readGraphFile(path, { directed: true }).graphs[0];
    const arcs: [number, number, number][] = [];
    for (let u = 0; u < 3; u++) {
      for (let e = graph.offsets[u]; e < graph.offsets[u + 1]; e++)
        arcs.push([u, graph.targets[e], graph.weights[e]]);
    }
    expect(arcs).toEqual([
      [0, 1, 0.5],
      [1, 2, 0.25],
      [2, 0, 2],
    ]);
  });
});

describe(".mat: a double variable stored as miUINT8", () => {
  it("reads the small integers as the double values they are", () => {
    const header = matFile("M", 1, 1, [0], true, false).subarray(0, 128);
    const element = matrixElement("W", 3, 3, [0, 7, 0, 7, 0, 255, 0, 255, 0], true, "miUINT8");
    const graph = readGraphFile(put("uint8-storage.mat", concat(header, element))).graphs[0];
    expect([...graph.offsets]).toEqual([0, 1, 3, 4]);
    expect([...graph.targets]).toEqual([1, 0, 2, 1]);
    expect([...graph.weights]).toEqual([7, 7, 255, 255]);
  });
});

describe("bad .mat files", () => {
  const good = matFile("M", 3, 3, COLUMN_MAJOR, true, false);
  const packed = matFile("M", 3, 3, COLUMN_MAJOR, true, true);

  it("0 bytes", () => {
    const e = errorOf(() => readGraphFile(put("empty.mat", new Uint8Array(0))));
    expect(e.problem).toBe("empty-file");
    expect(e.message).toMatch(/empty\.mat: file is empty \(0 bytes\)$/);
  });

  it.each([60, 127])("cut inside the header (%i bytes)", (length) => {
    const e = errorOf(() => readGraphFile(put(`cut${length}.mat`, good.subarray(0, length))));
    expect(e.problem).toBe("truncated");
    expect(e.message).toContain(`file is truncated: ${length} bytes, inside the 128-byte header`);
  });

  it.each([132, 150, good.length - 4])("cut inside the data (%i bytes)", (length) => {
    const e = errorOf(() => readGraphFile(put(`data${length}.mat`, good.subarray(0, length))));
    expect(e.problem).toBe("truncated");
    expect(e.message).toMatch(
      /file is truncated: (a data element tag is cut short|a miMATRIX element declares \d+ bytes but only \d+ follow)/,
    );
  });

  it("cut inside a compressed element", () => {
    const e = errorOf(() => readGraphFile(put("packed-cut.mat", packed.subarray(0, packed.length - 10))));
    expect(e.problem).toBe("truncated");
    expect(e.message).toMatch(
      /packed-cut\.mat: byte 128: file is truncated: a miCOMPRESSED element declares/,
    );
  });

  it("damaged compressed bytes", () => {
    const damaged = packed.slice();
    damaged.fill(0xff, 140, 150);
    const e = errorOf(() => readGraphFile(put("damaged.mat", damaged)));
    expect(e.message).toMatch(/damaged\.mat: byte 128: .*(cannot be unpacked|truncated)/);
  });

  it("a compressed variable larger than maxBytes is refused before it is unpacked whole", () => {
    const big = matFile("B", 300, 300, new Array(90000).fill(1), true, true);
    expect(big.length).toBeLessThan(20000);
    const e = errorOf(() => readGraphFile(put("big.mat", big), { maxBytes: 100000 }));
    expect(e.problem).toBe("too-large");
    expect(e.message).toMatch(
      /big\.mat: byte 128: variable "B": a compressed variable unpacks to 703\.\d KiB, more than the limit of 97\.7 KiB/,
    );
  });

  it("HDF5-based (-v7.3) and non-MAT files", () => {
    const v73 = new Uint8Array(512).fill(0x20);
    const text = "MATLAB 7.3 MAT-file, Platform: GLNXA64, Created on: today HDF5 schema 1.00 .";
    for (let k = 0; k < text.length; k++) v73[k] = text.charCodeAt(k);
    expect(() => readGraphFile(put("v73.mat", v73))).toThrow(
      /MATLAB 7\.3 MAT-file \(HDF5\) is not read; save it with save\(\.\.\., '-v7'\)/,
    );
    expect(() => readGraphFile(put("text.mat", new TextEncoder().encode("1 2\n3 4\n")))).toThrow(
      /text\.mat: byte 0: not a Level 5 MAT-file: the header does not start with "MATLAB"/,
    );
  });
});

describe("bad .npz files", () => {
  const matrix = { name: "w", values: new Float64Array([0, 1, 1, 0]), shape: [2, 2] };
  const stored = encodeNpz([matrix]);
  const deflated = encodeNpz([{ ...matrix, values: new Float64Array(400).fill(0.5), shape: [20, 20] }], {
    compress: true,
  });

  it("0 bytes", () => {
    const e = errorOf(() => readGraphFile(put("empty.npz", new Uint8Array(0))));
    expect(e.problem).toBe("empty-file");
    expect(e.message).toMatch(/empty\.npz: file is empty \(0 bytes\)$/);
  });

  it.each([10, 100, stored.length - 30])("cut short (%i bytes)", (length) => {
    const e = errorOf(() => readGraphFile(put(`cut${length}.npz`, stored.subarray(0, length))));
    expect(e.problem).toBe("truncated");
    expect(e.message).toContain(
      `file is truncated: ${length} bytes and no zip end-of-central-directory record`,
    );
  });

  it("not a zip", () => {
    expect(() => readGraphFile(put("text.npz", new TextEncoder().encode("hello")))).toThrow(
      /text\.npz: byte 0: not a zip archive/,
    );
  });

  it("damaged deflated member", () => {
    const damaged = deflated.slice();
    damaged.fill(0, 60, 90);
    const e = errorOf(() => readGraphFile(put("damaged.npz", damaged)));
    expect(e.message).toMatch(/damaged\.npz: (damaged zip archive: .+|array "w": .+)$/);
  });

  it("members whose declared size passes maxBytes are refused before inflating", () => {
    const e = errorOf(() => readNpzFile(put("deflated.npz", deflated), { maxBytes: 1536 }));
    expect(deflated.length).toBeLessThan(1536);
    expect(e.problem).toBe("too-large");
    expect(e.message).toMatch(
      /deflated\.npz: array "w": zip member w\.npy unpacks to 3\.3 KiB, more than the limit of 1\.5 KiB/,
    );
  });

  it("a truncated member inside an intact zip names the array", () => {
    const shortMember = encodeNpz([{ name: "w", values: new Float64Array([1, 2]), shape: [2] }]);
    // Rewrite the shape in the member's header to promise more data than it has.
    const text = new TextDecoder("latin1").decode(shortMember);
    const at = text.indexOf("(2,)");
    const forged = shortMember.slice();
    forged.set(new TextEncoder().encode("(9,)"), at);
    // The zip's CRC-32 no longer matches the member: refused before the .npy is even parsed.
    const e = errorOf(() => readNpzFile(put("forged.npz", forged), { array: "w" }));
    expect(e.problem).toBe("bad-checksum");
    expect(e.message).toMatch(
      /forged\.npz: array "w": zip member w\.npy fails its CRC-32 check \(the archive says 0x[0-9a-f]{8}, its bytes give 0x[0-9a-f]{8}\): the file is damaged$/,
    );
  });
});

/** A zip (PKWARE APPNOTE 4.3) of one deflated member whose directory declares `size` bytes and `crc`. */
function zipOfOneMember(name: string, deflated: Uint8Array, size: number, crc: number): Uint8Array {
  const nameBytes = new TextEncoder().encode(name);
  const local = new Uint8Array(30 + nameBytes.length);
  const lv = new DataView(local.buffer);
  lv.setUint32(0, 0x04034b50, true);
  lv.setUint16(4, 20, true);
  lv.setUint16(8, 8, true); // deflated
  lv.setUint32(14, crc, true);
  lv.setUint32(18, deflated.length, true);
  lv.setUint32(22, size, true);
  lv.setUint16(26, nameBytes.length, true);
  local.set(nameBytes, 30);
  const central = new Uint8Array(46 + nameBytes.length);
  const cv = new DataView(central.buffer);
  cv.setUint32(0, 0x02014b50, true);
  cv.setUint16(4, 20, true);
  cv.setUint16(6, 20, true);
  cv.setUint16(10, 8, true);
  cv.setUint32(16, crc, true);
  cv.setUint32(20, deflated.length, true);
  cv.setUint32(24, size, true);
  cv.setUint16(28, nameBytes.length, true);
  central.set(nameBytes, 46);
  const end = new Uint8Array(22);
  const ev = new DataView(end.buffer);
  ev.setUint32(0, 0x06054b50, true);
  ev.setUint16(8, 1, true);
  ev.setUint16(10, 1, true);
  ev.setUint32(12, central.length, true);
  ev.setUint32(16, local.length + deflated.length, true);
  return concat(local, deflated, central, end);
}

describe("declared sizes are checked before anything is unpacked", () => {
  // Only the first bytes are really there: unpacking the whole member (or variable) would fail on the
  // missing data, so the too-large error below can only come from the header, read first.
  it(".npz: a member declaring an 11000×11000 float64 matrix is refused from its header", () => {
    const header = "{'descr': '<f8', 'fortran_order': False, 'shape': (11000, 11000), }";
    const text = `${header}${" ".repeat(128 - 10 - header.length - 1)}\n`;
    const npy = new Uint8Array(128 + 4096);
    npy.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0]);
    new DataView(npy.buffer).setUint16(8, text.length, true);
    npy.set(new TextEncoder().encode(text), 10);
    const declared = 128 + 11000 * 11000 * 8;
    const path = put("huge.npz", zipOfOneMember("w.npy", deflateSync(npy), declared, 0));
    const e = errorOf(() => readGraphFile(path));
    expect(e.problem).toBe("too-large");
    expect(e.message).toBe(
      `${path}: array "w": a 11000×11000 matrix has 121000000 cells, more than the limit of 67108864; raise maxCells if you have the memory`,
    );
  });

  it(".mat: a compressed variable declaring an 11000×11000 double matrix is refused from its header", () => {
    const le = true;
    const sub = (type: number, data: Uint8Array, declared = data.length) => {
      const out = new Uint8Array(8 + Math.ceil(data.length / 8) * 8);
      new DataView(out.buffer).setUint32(0, type, le);
      new DataView(out.buffer).setUint32(4, declared, le);
      out.set(data, 8);
      return out;
    };
    const flags = new Uint8Array(8);
    new DataView(flags.buffer).setUint32(0, 6, le); // mxDOUBLE_CLASS
    const dims = new Uint8Array(8);
    new DataView(dims.buffer).setInt32(0, 11000, le);
    new DataView(dims.buffer).setInt32(4, 11000, le);
    const dataTag = new Uint8Array(8);
    new DataView(dataTag.buffer).setUint32(0, 9, le); // miDOUBLE
    new DataView(dataTag.buffer).setUint32(4, 11000 * 11000 * 8, le);
    const body = concat(sub(6, flags), sub(5, dims), sub(1, new TextEncoder().encode("C")), dataTag);
    const tag = new Uint8Array(8);
    new DataView(tag.buffer).setUint32(0, 14, le);
    new DataView(tag.buffer).setUint32(4, body.length + 11000 * 11000 * 8 - 0, le);
    const packed = zlibSync(concat(tag, body, new Uint8Array(4096)));
    const outer = new Uint8Array(8);
    new DataView(outer.buffer).setUint32(0, 15, le);
    new DataView(outer.buffer).setUint32(4, packed.length, le);
    const header = matFile("M", 1, 1, [0], true, false).subarray(0, 128);
    const path = put("huge.mat", concat(header, outer, packed));
    const e = errorOf(() => readGraphFile(path));
    expect(e.problem).toBe("too-large");
    expect(e.message).toBe(
      `${path}: byte 128: variable "C": a 11000×11000 matrix has 121000000 cells, more than the limit of 67108864; raise maxCells if you have the memory`,
    );
  });
});

describe("random bytes after a valid .mat header", () => {
  it("are reported as no MAT-file data, not as a truncated file", () => {
    const header = matFile("M", 1, 1, [0], true, false).subarray(0, 128);
    const noise = new Uint8Array(64).map((_, k) => (k * 151 + 89) % 256);
    const path = put("noise.mat", concat(header, noise));
    const e = errorOf(() => readGraphFile(path));
    expect(e.problem).toBe("bad-header");
    expect(e.message).toMatch(
      /noise\.mat: byte 128: no MAT-file data element starts here: its tag \(0x[0-9a-f]{8}\) names no MATLAB data type; the bytes are damaged or not MAT-file data$/,
    );
  });
});
