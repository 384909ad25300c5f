// Zip archives built byte by byte from PKWARE's APPNOTE 6.3: local file headers (4.3.7), central directory
// headers (4.3.12), the end of central directory record (4.3.16), the ZIP64 end record and its locator
// (4.3.14, 4.3.15) and the ZIP64 extended information extra field (4.5.3), whose 8-byte values appear in
// the order original size, compressed size, local header offset, only for fields marked 0xFFFFFFFF.
import { crc32 } from "node:zlib";
import { concat } from "./mat-bytes.fixture.js";

export interface ZipEntry {
  name: string;
  /** The member's bytes as stored in the archive (already deflated for method 8). */
  stored: Uint8Array;
  /** Uncompressed size; by default the stored length. */
  size?: number;
  /** CRC-32 of the uncompressed bytes; by default that of `stored` (right for stored members). */
  crc?: number;
  method?: number;
  flags?: number;
  /** Fields moved to a ZIP64 extra field in the central directory. */
  zip64?: ("size" | "compressedSize" | "localHeader")[];
  /** Extra fields placed before the ZIP64 one (id, data). */
  otherExtra?: [number, Uint8Array][];
  /** Overrides of what the central directory says. */
  central?: { compressedSize?: number; localHeader?: number; zip64Values?: bigint[] };
}

const u16 = (v: number) => {
  const b = new Uint8Array(2);
  new DataView(b.buffer).setUint16(0, v, true);
  return b;
};
const u32 = (v: number) => {
  const b = new Uint8Array(4);
  new DataView(b.buffer).setUint32(0, v >>> 0, true);
  return b;
};
const u64 = (v: bigint) => {
  const b = new Uint8Array(8);
  new DataView(b.buffer).setBigUint64(0, v, true);
  return b;
};

function extraField(id: number, data: Uint8Array): Uint8Array {
  return concat(u16(id), u16(data.length), data);
}

/**
 * The archive; `zip64End` adds the ZIP64 end record and locator (the end record then holds 0xFFFF and
 * 0xFFFFFFFF), `locatorTarget` makes the locator point elsewhere, `comment` ends the end record.
 */
export function zipArchive(
  entries: ZipEntry[],
  options: {
    zip64End?: boolean;
    locatorTarget?: bigint;
    comment?: string;
    directoryOffset?: number;
    /** What the ZIP64 end record says: entry count and directory offset. */
    record?: { count?: bigint; offset?: bigint };
  } = {},
): Uint8Array {
  const locals: Uint8Array[] = [];
  const centrals: Uint8Array[] = [];
  let offset = 0;
  for (const e of entries) {
    const name = new TextEncoder().encode(e.name);
    const size = e.size ?? e.stored.length;
    const crc = e.crc ?? crc32(e.stored);
    const local = concat(
      u32(0x04034b50),
      u16(20),
      u16(e.flags ?? 0),
      u16(e.method ?? 0),
      u32(0), // time, date
      u32(crc),
      u32(e.stored.length),
      u32(size),
      u16(name.length),
      u16(0),
      name,
      e.stored,
    );
    const values: Record<string, bigint> = {
      size: BigInt(size),
      compressedSize: BigInt(e.central?.compressedSize ?? e.stored.length),
      localHeader: BigInt(e.central?.localHeader ?? offset),
    };
    const wide = e.zip64 ?? [];
    const field = (key: string) => (wide.includes(key as never) ? 0xffffffff : Number(values[key]));
    const zip64Data = concat(...(e.central?.zip64Values ?? wide.map((k) => values[k])).map(u64));
    const extra = concat(
      ...(e.otherExtra ?? []).map(([id, data]) => extraField(id, data)),
      wide.length > 0 || e.central?.zip64Values ? extraField(1, zip64Data) : new Uint8Array(0),
    );
    centrals.push(
      concat(
        u32(0x02014b50),
        u16(20),
        u16(20),
        u16(e.flags ?? 0),
        u16(e.method ?? 0),
        u32(0),
        u32(crc),
        u32(field("compressedSize")),
        u32(field("size")),
        u16(name.length),
        u16(extra.length),
        u16(0), // comment
        u16(0), // disk
        u16(0), // internal attributes
        u32(0), // external attributes
        u32(field("localHeader")),
        name,
        extra,
      ),
    );
    locals.push(local);
    offset += local.length;
  }
  const directory = concat(...centrals);
  const directoryOffset = options.directoryOffset ?? offset;
  const comment = new TextEncoder().encode(options.comment ?? "");
  const parts = [...locals, directory];
  if (options.zip64End) {
    const record = offset + directory.length;
    parts.push(
      concat(
        u32(0x06064b50),
        u64(44n), // size of the rest of the record
        u16(45),
        u16(45),
        u32(0),
        u32(0),
        u64(BigInt(entries.length)),
        u64(options.record?.count ?? BigInt(entries.length)),
        u64(BigInt(directory.length)),
        u64(options.record?.offset ?? BigInt(directoryOffset)),
      ),
      concat(u32(0x07064b50), u32(0), u64(options.locatorTarget ?? BigInt(record)), u32(1)),
    );
  }
  const big = options.zip64End === true;
  parts.push(
    concat(
      u32(0x06054b50),
      u16(0),
      u16(0),
      u16(big ? 0xffff : entries.length),
      u16(big ? 0xffff : entries.length),
      u32(directory.length),
      u32(big ? 0xffffffff : directoryOffset),
      u16(comment.length),
      comment,
    ),
  );
  return concat(...parts);
}
