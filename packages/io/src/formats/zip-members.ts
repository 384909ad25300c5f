import { type UnzipFileInfo, unzipSync } from "fflate";
import { InputFileError } from "../input-file-error.js";
import { formatBytes } from "../read-options.js";

/** What the zip's central directory says about one member, before anything is inflated. */
export interface ZipMemberInfo {
  name: string;
  /** Uncompressed size as declared. */
  size: number;
  /** 0 = stored, 8 = deflated (PKWARE APPNOTE 4.4.5). */
  compression: number;
}

// Every zip ends with an end-of-central-directory record "PK\x05\x06" (PKWARE APPNOTE 4.3.16).
const LOCAL_HEADER = [0x50, 0x4b, 0x03, 0x04];
const END_RECORD = [0x50, 0x4b, 0x05, 0x06];

/** Lists a zip's members from its central directory. Errors name the file and say what is wrong. */
export function listZipMembers(bytes: Uint8Array, file: string): ZipMemberInfo[] {
  checkZipShape(bytes, file);
  const members: ZipMemberInfo[] = [];
  unzipInto(bytes, file, (info) => {
    members.push({ name: info.name, size: info.originalSize, compression: info.compression });
    return false;
  });
  return members;
}

/**
 * Inflates the members `wanted` accepts, refusing before any inflation when their declared sizes add up
 * to more than `maxBytes` (a small zip can declare gigabytes). Only stored and deflated members are read.
 */
export function extractZipMembers(
  bytes: Uint8Array,
  file: string,
  wanted: (name: string) => boolean,
  maxBytes: number,
): Map<string, Uint8Array> {
  let total = 0;
  for (const member of listZipMembers(bytes, file)) {
    if (!wanted(member.name)) continue;
    if (member.compression !== 0 && member.compression !== 8) {
      throw new InputFileError(
        file,
        "unsupported-dtype",
        `zip member ${member.name} uses compression method ${member.compression}; only stored (0) and deflated (8) members are read`,
      );
    }
    total += member.size;
    if (total > maxBytes) {
      throw new InputFileError(
        file,
        "too-large",
        `zip members unpack to more than the limit of ${formatBytes(maxBytes)}; raise maxBytes if you have the memory`,
      );
    }
  }
  const out = new Map<string, Uint8Array>();
  const files = unzipInto(bytes, file, (info) => wanted(info.name));
  for (const [name, data] of Object.entries(files)) out.set(name, data);
  return out;
}

function checkZipShape(bytes: Uint8Array, file: string): void {
  if (bytes.length === 0) throw new InputFileError(file, "empty-file", "file is empty (0 bytes)");
  if (!startsWith(bytes, LOCAL_HEADER, 0) && !(bytes.length === 22 && startsWith(bytes, END_RECORD, 0))) {
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
  const from = Math.max(0, bytes.length - 22 - 0xffff);
  for (let at = bytes.length - 22; at >= from; at--) if (startsWith(bytes, END_RECORD, at)) return;
  throw new InputFileError(
    file,
    "truncated",
    `file is truncated: ${bytes.length} bytes and no zip end-of-central-directory record`,
    { byteOffset: bytes.length },
  );
}

function unzipInto(
  bytes: Uint8Array,
  file: string,
  filter: (info: UnzipFileInfo) => boolean,
): Record<string, Uint8Array> {
  try {
    return unzipSync(bytes, { filter });
  } catch (error) {
    if (error instanceof InputFileError) throw error;
    throw new InputFileError(file, "unreadable", `damaged zip archive: ${(error as Error).message}`);
  }
}

function startsWith(bytes: Uint8Array, prefix: readonly number[], at: number): boolean {
  if (at < 0 || at + prefix.length > bytes.length) return false;
  return prefix.every((b, k) => bytes[at + k] === b);
}
