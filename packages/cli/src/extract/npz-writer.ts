import { encodeNpy, type NpyWriteDtype } from "@cliquescape/io";

/*
 * .npz writing: a zip archive of .npy members, stored uncompressed, loadable by numpy.load without pickle.
 * Mirrors the contract of the io package's encodeNpz (being written alongside); switch to it once it lands.
 */

export type NpzArray =
  | { name: string; dtype: NpyWriteDtype; shape: number[]; values: ArrayLike<number> }
  | { name: string; dtype: "unicode"; shape: number[]; values: readonly string[] };

export function encodeNpz(arrays: readonly NpzArray[]): Uint8Array {
  const members = arrays.map((array) => ({
    name: new TextEncoder().encode(`${array.name}.npy`),
    data:
      array.dtype === "unicode"
        ? encodeUnicodeNpy(array.values, array.shape)
        : encodeNpy(array.values, array.shape, array.dtype),
  }));
  return zipStored(members);
}

/**
 * A string array as .npy with descr '<U{L}': each element L UTF-32LE code units, zero-padded, L the longest
 * element in code points (NumPy format documentation, "unicode" dtype; at least 1 as numpy writes).
 */
export function encodeUnicodeNpy(values: readonly string[], shape: readonly number[]): Uint8Array {
  const count = shape.reduce((a, b) => a * b, 1);
  if (values.length !== count)
    throw new RangeError(`shape (${shape}) needs ${count} strings, got ${values.length}`);
  const points = values.map((text) => Array.from(text, (ch) => ch.codePointAt(0)!));
  const width = Math.max(1, ...points.map((p) => p.length));
  const shapeText = shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(", ")})`;
  const dict = `{'descr': '<U${width}', 'fortran_order': False, 'shape': ${shapeText}, }`;
  const dataOffset = Math.ceil((10 + dict.length + 1) / 64) * 64;
  const header = `${dict}${" ".repeat(dataOffset - 10 - dict.length - 1)}\n`;
  if (header.length > 0xffff) throw new RangeError("npy header too long");
  const out = new Uint8Array(dataOffset + count * width * 4);
  const view = new DataView(out.buffer);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0]);
  view.setUint16(8, header.length, true);
  for (let k = 0; k < header.length; k++) out[10 + k] = header.charCodeAt(k);
  points.forEach((codes, i) => {
    codes.forEach((code, j) => {
      view.setUint32(dataOffset + (i * width + j) * 4, code, true);
    });
  });
  return out;
}

// Zip constants (PKWARE APPNOTE.TXT, sections 4.3.7, 4.3.12, 4.3.16). Fixed date 1980-01-01 so the same
// arrays always give the same bytes.
const DOS_DATE = (0 << 9) | (1 << 5) | 1;

function zipStored(members: { name: Uint8Array; data: Uint8Array }[]): Uint8Array {
  let size = 22;
  for (const m of members) size += 30 + m.name.length + m.data.length + 46 + m.name.length;
  if (size > 0xffffffff) throw new RangeError("npz archive over 4 GiB: too large for a zip without Zip64");
  const out = new Uint8Array(size);
  const view = new DataView(out.buffer);
  let at = 0;
  const offsets: number[] = [];
  const crcs = members.map((m) => crc32(m.data));
  members.forEach((m, i) => {
    offsets.push(at);
    view.setUint32(at, 0x04034b50, true);
    view.setUint16(at + 4, 20, true);
    view.setUint16(at + 12, DOS_DATE, true);
    view.setUint32(at + 14, crcs[i], true);
    view.setUint32(at + 18, m.data.length, true);
    view.setUint32(at + 22, m.data.length, true);
    view.setUint16(at + 26, m.name.length, true);
    out.set(m.name, at + 30);
    out.set(m.data, at + 30 + m.name.length);
    at += 30 + m.name.length + m.data.length;
  });
  const directoryStart = at;
  members.forEach((m, i) => {
    view.setUint32(at, 0x02014b50, true);
    view.setUint16(at + 4, 20, true);
    view.setUint16(at + 6, 20, true);
    view.setUint16(at + 14, DOS_DATE, true);
    view.setUint32(at + 16, crcs[i], true);
    view.setUint32(at + 20, m.data.length, true);
    view.setUint32(at + 24, m.data.length, true);
    view.setUint16(at + 28, m.name.length, true);
    view.setUint32(at + 42, offsets[i], true);
    out.set(m.name, at + 46);
    at += 46 + m.name.length;
  });
  view.setUint32(at, 0x06054b50, true);
  view.setUint16(at + 8, members.length, true);
  view.setUint16(at + 10, members.length, true);
  view.setUint32(at + 12, at - directoryStart, true);
  view.setUint32(at + 16, directoryStart, true);
  return out;
}

let crcTable: Uint32Array | undefined;

/** CRC-32 (IEEE 802.3 polynomial 0xEDB88320, reflected), as zip requires. */
export function crc32(data: Uint8Array): number {
  if (!crcTable) {
    crcTable = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      crcTable[n] = c >>> 0;
    }
  }
  let crc = 0xffffffff;
  for (let i = 0; i < data.length; i++) crc = crcTable[(crc ^ data[i]) & 0xff] ^ (crc >>> 8);
  return (crc ^ 0xffffffff) >>> 0;
}
