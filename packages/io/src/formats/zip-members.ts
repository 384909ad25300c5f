import CRC32 from "crc-32";
import { Inflate, inflateSync } from "fflate";
import { InputFileError } from "../input-file-error.js";
import { formatBytes } from "../read-options.js";

/** What the zip's central directory says about one member, before anything is inflated. */
export interface ZipMemberInfo {
  name: string;
  /** Uncompressed size as declared. */
  size: number;
  /** 0 = stored, 8 = deflated (PKWARE APPNOTE 4.4.5). */
  compression: number;
  /** Size of the member's data as stored in the archive. */
  compressedSize: number;
  /** CRC-32 of the uncompressed bytes, as declared (unsigned). */
  crc32: number;
  /** Byte offset of the member's local header in the archive. */
  localHeader: number;
}

// Record signatures of PKWARE's APPNOTE: local header (4.3.7), central directory header (4.3.12), end of
// central directory (4.3.16), and the ZIP64 end record and its locator (4.3.14, 4.3.15).
const LOCAL_HEADER = 0x04034b50;
const CENTRAL_HEADER = 0x02014b50;
const END_RECORD = 0x06054b50;
const ZIP64_END_RECORD = 0x06064b50;
const ZIP64_LOCATOR = 0x07064b50;
// Fields that do not fit 32 bits hold 0xFFFFFFFF and move to the ZIP64 extra field, id 1 (4.5.3).
const ZIP64_MARK = 0xffffffff;

/**
 * Lists a zip's members from its central directory (ZIP64 included). Errors name the file and say what is
 * wrong: not a zip, cut short, or a damaged directory.
 */
export function listZipMembers(bytes: Uint8Array, file: string): ZipMemberInfo[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const u32 = (at: number) => (at + 4 <= bytes.length ? view.getUint32(at, true) : -1);
  if (bytes.length === 0) throw new InputFileError(file, "empty-file", "file is empty (0 bytes)");
  // An archive without members is its end record alone, followed by the archive's comment if it has one.
  if (u32(0) !== LOCAL_HEADER && u32(0) !== END_RECORD) {
    throw new InputFileError(
      file,
      "unknown-format",
      'not a zip archive: it does not start with "PK\\x03\\x04"',
      {
        byteOffset: 0,
      },
    );
  }
  // The end record sits in the last 22 + 65535 (comment) bytes; without it the file was cut short.
  let end = -1;
  for (let at = bytes.length - 22; at >= Math.max(0, bytes.length - 22 - 0xffff); at--) {
    if (u32(at) === END_RECORD) {
      end = at;
      break;
    }
  }
  if (end < 0) {
    throw new InputFileError(
      file,
      "truncated",
      `file is truncated: ${bytes.length} bytes and no zip end-of-central-directory record`,
      { byteOffset: bytes.length },
    );
  }
  const damaged = (what: string, at: number): never => {
    throw new InputFileError(file, "unreadable", `damaged zip archive: ${what}`, { byteOffset: at });
  };
  let count = view.getUint16(end + 10, true);
  let offset = view.getUint32(end + 16, true);
  if (end >= 20 && u32(end - 20) === ZIP64_LOCATOR) {
    const record = safeUint64(view, end - 12) ?? damaged("the ZIP64 locator points past 2^53", end - 12);
    if (u32(record) !== ZIP64_END_RECORD) damaged("the ZIP64 end record is missing", record);
    count = safeUint64(view, record + 32) ?? damaged("the ZIP64 entry count is past 2^53", record);
    offset = safeUint64(view, record + 48) ?? damaged("the ZIP64 directory offset is past 2^53", record);
  }
  const members: ZipMemberInfo[] = [];
  let at = offset;
  for (let k = 0; k < count; k++) {
    if (u32(at) !== CENTRAL_HEADER || at + 46 > bytes.length) {
      damaged(`central directory entry ${k + 1} of ${count} is missing or cut short`, at);
    }
    const flags = view.getUint16(at + 8, true);
    const nameLength = view.getUint16(at + 28, true);
    const extraLength = view.getUint16(at + 30, true);
    const commentLength = view.getUint16(at + 32, true);
    const next = at + 46 + nameLength + extraLength + commentLength;
    if (next > bytes.length) damaged(`central directory entry ${k + 1} of ${count} is cut short`, at);
    const rawName = bytes.subarray(at + 46, at + 46 + nameLength);
    // Bit 11: the name is UTF-8; otherwise code page 437, which agrees with latin-1 on the ASCII names numpy writes.
    const name = new TextDecoder((flags & 0x800) !== 0 ? "utf-8" : "latin1").decode(rawName);
    if ((flags & 1) !== 0) {
      throw new InputFileError(file, "unsupported-dtype", `zip member ${name} is encrypted`, {
        byteOffset: at,
      });
    }
    const member: ZipMemberInfo = {
      name,
      compression: view.getUint16(at + 10, true),
      crc32: view.getUint32(at + 16, true),
      compressedSize: view.getUint32(at + 20, true),
      size: view.getUint32(at + 24, true),
      localHeader: view.getUint32(at + 42, true),
    };
    const wide = (["size", "compressedSize", "localHeader"] as const).filter(
      (key) => member[key] === ZIP64_MARK,
    );
    if (wide.length > 0) {
      const extra = zip64Extra(view, at + 46 + nameLength, extraLength);
      if (extra === undefined || extra.length < wide.length * 8) {
        damaged(`zip member ${name} lacks the ZIP64 sizes its entry announces`, at);
      }
      wide.forEach((key, j) => {
        member[key] =
          safeUint64(view, (extra as { at: number }).at + 8 * j) ??
          damaged(`zip member ${name} is past 2^53 bytes`, at);
      });
    }
    members.push(member);
    at = next;
  }
  return members;
}

/**
 * A member's bytes, inflated if deflated, after checking them against the CRC-32 and size the directory
 * declares (as numpy, through Python's zipfile, does): a flipped bit is an error, never a wrong weight.
 * Only stored and deflated members are read. A stored member is a view of `bytes`, not a copy.
 */
export function readZipMember(bytes: Uint8Array, file: string, member: ZipMemberInfo): Uint8Array {
  const data = memberData(bytes, file, member);
  let out: Uint8Array;
  if (member.compression === 0) out = data;
  else {
    try {
      // Into a buffer of the declared size: a stream that says less and unpacks to more cannot grow it.
      out = inflateSync(data, { out: new Uint8Array(member.size) });
    } catch (error) {
      throw new InputFileError(
        file,
        "unreadable",
        `damaged zip archive: zip member ${member.name} cannot be inflated (${(error as Error).message})`,
      );
    }
  }
  if (out.length !== member.size) {
    throw new InputFileError(
      file,
      "unreadable",
      `damaged zip archive: zip member ${member.name} holds ${out.length} bytes, its entry declares ${member.size}`,
    );
  }
  const crc = CRC32.buf(out) >>> 0;
  if (crc !== member.crc32) {
    throw new InputFileError(
      file,
      "bad-checksum",
      `zip member ${member.name} fails its CRC-32 check (the archive says ${hex(member.crc32)}, its bytes give ${hex(crc)}): the file is damaged`,
    );
  }
  return out;
}

/**
 * The first `length` bytes of a member (fewer if it is shorter), inflating no more than needed: enough to
 * read a header and check the size it declares before the whole member is unpacked. Not CRC-checked.
 */
export function readZipMemberPrefix(
  bytes: Uint8Array,
  file: string,
  member: ZipMemberInfo,
  length: number,
): Uint8Array {
  const data = memberData(bytes, file, member);
  const wanted = Math.min(length, member.size);
  if (member.compression === 0) return data.subarray(0, wanted);
  const chunks: Uint8Array[] = [];
  let have = 0;
  const stream = new Inflate((chunk) => {
    chunks.push(chunk);
    have += chunk.length;
  });
  // Small steps: a kilobyte of deflate unpacks to at most about a megabyte (APPNOTE's maximum ratio).
  const step = 1024;
  try {
    for (let at = 0; at < data.length && have < wanted; at += step) {
      stream.push(data.subarray(at, at + step), at + step >= data.length);
    }
  } catch (error) {
    throw new InputFileError(
      file,
      "unreadable",
      `damaged zip archive: zip member ${member.name} cannot be inflated (${(error as Error).message})`,
    );
  }
  const out = new Uint8Array(Math.min(have, wanted));
  let at = 0;
  for (const chunk of chunks) {
    if (at >= out.length) break;
    const piece = chunk.subarray(0, out.length - at);
    out.set(piece, at);
    at += piece.length;
  }
  return out;
}

/** Refuses, before inflating, a member whose declared size is above `maxBytes`. */
export function checkZipMemberSize(file: string, member: ZipMemberInfo, maxBytes: number): void {
  if (member.size > maxBytes) {
    throw new InputFileError(
      file,
      "too-large",
      `zip member ${member.name} unpacks to ${formatBytes(member.size)}, more than the limit of ${formatBytes(maxBytes)}; raise maxBytes if you have the memory`,
    );
  }
}

// The member's stored bytes, found through its local header.
function memberData(bytes: Uint8Array, file: string, member: ZipMemberInfo): Uint8Array {
  if (member.compression !== 0 && member.compression !== 8) {
    throw new InputFileError(
      file,
      "unsupported-dtype",
      `zip member ${member.name} uses compression method ${member.compression}; only stored (0) and deflated (8) members are read`,
    );
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const at = member.localHeader;
  if (at + 30 > bytes.length || view.getUint32(at, true) !== LOCAL_HEADER) {
    throw new InputFileError(
      file,
      "unreadable",
      `damaged zip archive: the local header of zip member ${member.name} is missing`,
      { byteOffset: at },
    );
  }
  const start = at + 30 + view.getUint16(at + 26, true) + view.getUint16(at + 28, true);
  if (start + member.compressedSize > bytes.length) {
    throw new InputFileError(
      file,
      "truncated",
      `file is truncated: zip member ${member.name} runs past the end of the file`,
      { byteOffset: bytes.length },
    );
  }
  return bytes.subarray(start, start + member.compressedSize);
}

// The ZIP64 extended-information extra field (header id 1) among a record's extra fields.
function zip64Extra(
  view: DataView,
  from: number,
  length: number,
): { at: number; length: number } | undefined {
  for (let at = from; at + 4 <= from + length; ) {
    const id = view.getUint16(at, true);
    const size = view.getUint16(at + 2, true);
    if (id === 1) return { at: at + 4, length: size };
    at += 4 + size;
  }
  return undefined;
}

function safeUint64(view: DataView, at: number): number | undefined {
  if (at < 0 || at + 8 > view.byteLength) return undefined;
  const value = view.getBigUint64(at, true);
  return value <= BigInt(Number.MAX_SAFE_INTEGER) ? Number(value) : undefined;
}

function hex(value: number): string {
  return `0x${value.toString(16).padStart(8, "0")}`;
}
