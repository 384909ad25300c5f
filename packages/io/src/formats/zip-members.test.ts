// listZipMembers, readZipMember and readZipMemberPrefix on archives built byte by byte from PKWARE's
// APPNOTE 6.3 (zip-bytes.fixture.ts): ZIP64 records and extra fields, damaged directories, members the
// reader does not take. The ZIP64 archive is also read by Python's zipfile, as a check of the builder.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { deflateSync } from "fflate";
import { describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON } from "../../../../test/support/python.js";
import { errorOf } from "./mat-bytes.fixture.js";
import { zipArchive } from "./zip-bytes.fixture.js";
import { listZipMembers, readZipMember, readZipMemberPrefix } from "./zip-members.js";

const FILE = "t.npz";
const payload = (n: number, seed = 11) => Uint8Array.from({ length: n }, (_, k) => (k * 37 + seed) & 0xff);
const directoryStart = (bytes: Uint8Array, k = 0) => {
  let at = -1;
  for (let j = 0; j <= k; j++) {
    at = bytes.findIndex(
      (_, i) =>
        i > at && bytes[i] === 0x50 && bytes[i + 1] === 0x4b && bytes[i + 2] === 1 && bytes[i + 3] === 2,
    );
  }
  return at;
};

describe("ZIP64", () => {
  const a = payload(100);
  const b = payload(30, 5);
  // a.npy: all three fields in the ZIP64 extra field, after an extended-timestamp field (id 0x5455); b.bin:
  // only its local header offset. The end record's count and offset are in the ZIP64 end record.
  const archive = zipArchive(
    [
      {
        name: "a.npy",
        stored: a,
        zip64: ["size", "compressedSize", "localHeader"],
        otherExtra: [[0x5455, payload(5)]],
      },
      { name: "b.bin", stored: b, zip64: ["localHeader"] },
    ],
    { zip64End: true },
  );

  it("sizes, offsets and the member count come from the ZIP64 fields", () => {
    const members = listZipMembers(archive, FILE);
    expect(members.map((m) => [m.name, m.size, m.compressedSize, m.localHeader])).toEqual([
      ["a.npy", 100, 100, 0],
      ["b.bin", 30, 30, 30 + 5 + 100],
    ]);
    expect(readZipMember(archive, FILE, members[0])).toEqual(a);
    expect(readZipMember(archive, FILE, members[1])).toEqual(b);
  });

  const missing = missingPythonModules(["zipfile"]);
  it.skipIf(missing !== null)(
    `Python's zipfile reads the same archive alike${missing ? ` (skipped: ${missing})` : ""}`,
    () => {
      const dir = mkdtempSync(join(tmpdir(), "cliquescape-zip-"));
      try {
        writeFileSync(join(dir, "z.zip"), archive);
        const script = `import json, sys, zipfile
z = zipfile.ZipFile(sys.argv[1])
print(json.dumps([[i.filename, i.file_size, i.header_offset, list(z.read(i))] for i in z.infolist()]))`;
        const run = spawnSync(PYTHON, ["-c", script, join(dir, "z.zip")], { encoding: "utf8" });
        expect(run.stderr).toBe("");
        const members = listZipMembers(archive, FILE);
        expect(JSON.parse(run.stdout)).toEqual(
          members.map((m) => [m.name, m.size, m.localHeader, [...readZipMember(archive, FILE, m)]]),
        );
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  );

  it("a locator pointing where no ZIP64 end record is, or past 2^53, is a damaged archive", () => {
    const entry = { name: "a.npy", stored: a };
    const at0 = errorOf(() =>
      listZipMembers(zipArchive([entry], { zip64End: true, locatorTarget: 0n }), FILE),
    );
    expect(at0.problem).toBe("unreadable");
    expect(at0.message).toBe(`${FILE}: byte 0: damaged zip archive: the ZIP64 end record is missing`);
    const safe = 2n ** 53n - 1n;
    const farAway = errorOf(() =>
      listZipMembers(zipArchive([entry], { zip64End: true, locatorTarget: safe }), FILE),
    );
    expect(farAway.message).toBe(
      `${FILE}: byte 9007199254740991: damaged zip archive: the ZIP64 end record is missing`,
    );
    const past = zipArchive([entry], { zip64End: true, locatorTarget: 2n ** 53n });
    const e = errorOf(() => listZipMembers(past, FILE));
    expect(e.message).toBe(
      `${FILE}: byte ${past.length - 22 - 12}: damaged zip archive: the ZIP64 locator points past 2^53`,
    );
  });

  it("a ZIP64 end record whose entry count or directory offset passes 2^53 is a damaged archive", () => {
    const entry = { name: "a.npy", stored: a };
    const many = zipArchive([entry], { zip64End: true, record: { count: 2n ** 60n } });
    const record = many.length - 22 - 20 - 56;
    expect(errorOf(() => listZipMembers(many, FILE)).message).toBe(
      `${FILE}: byte ${record}: damaged zip archive: the ZIP64 entry count is past 2^53`,
    );
    const far = zipArchive([entry], { zip64End: true, record: { offset: 2n ** 60n } });
    expect(errorOf(() => listZipMembers(far, FILE)).message).toBe(
      `${FILE}: byte ${record}: damaged zip archive: the ZIP64 directory offset is past 2^53`,
    );
  });

  it("a ZIP64 end record cut short by the end of the file is a damaged archive, not a crash", () => {
    const whole = zipArchive([{ name: "a.npy", stored: a }], { zip64End: true });
    // The locator points 24 bytes before the end record: a ZIP64 signature there, then the record's fields
    // would run past the end of the file.
    const end = whole.length - 22;
    const forged = whole.slice();
    forged.set([0x50, 0x4b, 0x06, 0x06], end - 24);
    new DataView(forged.buffer).setBigUint64(end - 12, BigInt(end - 24), true);
    const e = errorOf(() => listZipMembers(forged, FILE));
    expect(e.problem).toBe("unreadable");
    expect(e.message).toMatch(new RegExp(`^t\\.npz: byte ${end - 24}: damaged zip archive: `));
  });

  it("a member whose ZIP64 extra field is missing values, or whose size passes 2^53, is a damaged archive", () => {
    const short = zipArchive([
      { name: "a.npy", stored: a, zip64: ["size", "compressedSize"], central: { zip64Values: [100n] } },
    ]);
    const e = errorOf(() => listZipMembers(short, FILE));
    expect(e.message).toBe(
      `${FILE}: byte ${directoryStart(short)}: damaged zip archive: zip member a.npy lacks the ZIP64 sizes its entry announces`,
    );
    const huge = zipArchive([
      { name: "a.npy", stored: a, zip64: ["size"], central: { zip64Values: [2n ** 60n] } },
    ]);
    expect(errorOf(() => listZipMembers(huge, FILE)).message).toBe(
      `${FILE}: byte ${directoryStart(huge)}: damaged zip archive: zip member a.npy is past 2^53 bytes`,
    );
  });
});

describe("damaged or unusual central directories", () => {
  const a = payload(40);

  it("an archive of 22 bytes, only its end record, has no members; 22 other bytes are not a zip", () => {
    expect(listZipMembers(zipArchive([]), FILE)).toEqual([]);
    const text = new TextEncoder().encode("twenty-two bytes long.");
    expect(text.length).toBe(22);
    expect(errorOf(() => listZipMembers(text, FILE)).message).toBe(
      `${FILE}: byte 0: not a zip archive: it does not start with "PK\\x03\\x04"`,
    );
  });

  it("an archive without members but with a comment has no members (it is a zip all the same)", () => {
    // Python's zipfile writes such an archive for ZipFile(path, "w") with .comment set and nothing added;
    // numpy.load lists no arrays in it (checked with Python 3.11 and numpy 2.4 when this test was written).
    const commented = zipArchive([], { comment: "no arrays" });
    expect(commented.length).toBe(31);
    expect(listZipMembers(commented, FILE)).toEqual([]);
  });

  it("a file without an end record is truncated at its length", () => {
    const whole = zipArchive([{ name: "a.npy", stored: a }]);
    const cut = whole.subarray(0, whole.length - 30);
    expect(errorOf(() => listZipMembers(cut, FILE)).message).toBe(
      `${FILE}: byte ${cut.length}: file is truncated: ${cut.length} bytes and no zip end-of-central-directory record`,
    );
  });

  it("a directory offset where no entry starts, and an entry whose name runs past the end", () => {
    const lost = zipArchive([{ name: "a.npy", stored: a }], { directoryOffset: 3 });
    expect(errorOf(() => listZipMembers(lost, FILE)).message).toBe(
      `${FILE}: byte 3: damaged zip archive: central directory entry 1 of 1 is missing or cut short`,
    );
    const long = zipArchive([
      { name: "a.npy", stored: a },
      { name: "b.npy", stored: a },
    ]);
    const second = directoryStart(long, 1);
    new DataView(long.buffer).setUint16(second + 28, 0xffff, true); // name length
    expect(errorOf(() => listZipMembers(long, FILE)).message).toBe(
      `${FILE}: byte ${second}: damaged zip archive: central directory entry 2 of 2 is cut short`,
    );
  });

  it("names are UTF-8 when flag bit 11 says so, else code page 437 (read as latin-1)", () => {
    const utf8 = zipArchive([{ name: "wé.npy", stored: a, flags: 0x800 }]);
    expect(listZipMembers(utf8, FILE)[0].name).toBe("wé.npy");
    const legacy = zipArchive([{ name: "wé.npy", stored: a }]);
    expect(listZipMembers(legacy, FILE)[0].name).toBe("wÃ©.npy");
  });

  it("an encrypted member is refused where its entry is", () => {
    const locked = zipArchive([{ name: "a.npy", stored: a, flags: 1 }]);
    const e = errorOf(() => listZipMembers(locked, FILE));
    expect(e.problem).toBe("unsupported-dtype");
    expect(e.message).toBe(`${FILE}: byte ${directoryStart(locked)}: zip member a.npy is encrypted`);
  });
});

describe("reading a member", () => {
  const a = payload(40);
  const read = (archive: Uint8Array) => readZipMember(archive, FILE, listZipMembers(archive, FILE)[0]);
  const prefix = (archive: Uint8Array) =>
    readZipMemberPrefix(archive, FILE, listZipMembers(archive, FILE)[0], 12);

  it("a compression method other than stored and deflated is named", () => {
    const bzip2 = zipArchive([{ name: "a.npy", stored: a, method: 12 }]);
    const e = errorOf(() => read(bzip2));
    expect(e.problem).toBe("unsupported-dtype");
    expect(e.message).toBe(
      `${FILE}: zip member a.npy uses compression method 12; only stored (0) and deflated (8) members are read`,
    );
  });

  it("a local header that is not there, and data that runs past the end of the file", () => {
    const lost = zipArchive([{ name: "a.npy", stored: a, central: { localHeader: 5 } }]);
    expect(errorOf(() => read(lost)).problem).toBe("unreadable");
    expect(errorOf(() => read(lost)).message).toBe(
      `${FILE}: byte 5: damaged zip archive: the local header of zip member a.npy is missing`,
    );
    const long = zipArchive([{ name: "a.npy", stored: a, central: { compressedSize: 10000 } }]);
    const e = errorOf(() => read(long));
    expect(e.problem).toBe("truncated");
    expect(e.message).toBe(
      `${FILE}: byte ${long.length}: file is truncated: zip member a.npy runs past the end of the file`,
    );
  });

  it("deflated bytes that do not inflate are a damaged archive, whole or in part", () => {
    const junk = zipArchive([{ name: "a.npy", stored: new Uint8Array(20).fill(0xff), method: 8, size: 100 }]);
    for (const e of [errorOf(() => read(junk)), errorOf(() => prefix(junk))]) {
      expect(e.problem).toBe("unreadable");
      expect(e.message).toMatch(/^t\.npz: damaged zip archive: zip member a\.npy cannot be inflated \(.+\)$/);
    }
  });

  it("a member holding fewer bytes than its entry declares", () => {
    const short = zipArchive([{ name: "a.npy", stored: a, size: 48 }]);
    expect(errorOf(() => read(short)).message).toBe(
      `${FILE}: damaged zip archive: zip member a.npy holds 40 bytes, its entry declares 48`,
    );
    const deflated = deflateSync(a);
    const bigger = zipArchive([{ name: "a.npy", stored: deflated, method: 8, size: 48, crc: 0 }]);
    expect(errorOf(() => read(bigger)).message).toBe(
      `${FILE}: damaged zip archive: zip member a.npy holds 40 bytes, its entry declares 48`,
    );
  });

  it("CRC-32 values are written with 8 hexadecimal digits", () => {
    const wrong = zipArchive([{ name: "a.npy", stored: a, crc: 0x1234 }]);
    expect(errorOf(() => read(wrong)).message).toMatch(
      /^t\.npz: zip member a\.npy fails its CRC-32 check \(the archive says 0x00001234, its bytes give 0x[0-9a-f]{8}\): the file is damaged$/,
    );
  });
});
