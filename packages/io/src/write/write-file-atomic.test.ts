import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { writeFileAtomic } from "./write-file-atomic.js";

const dir = mkdtempSync(join(tmpdir(), "cliquescape-atomic-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("writeFileAtomic", () => {
  it("creates missing folders, writes text and bytes, replaces content, leaves no temporary file", () => {
    const path = join(dir, "a", "b", "out.csv");
    writeFileAtomic(path, "first\n");
    expect(readFileSync(path, "utf8")).toBe("first\n");
    writeFileAtomic(path, new Uint8Array([1, 2, 3]));
    expect([...readFileSync(path)]).toEqual([1, 2, 3]);
    expect(readdirSync(join(dir, "a", "b"))).toEqual(["out.csv"]);
  });

  it("writes pieces of text and bytes in order", () => {
    const path = join(dir, "pieces.txt");
    writeFileAtomic(path, ["a,", new Uint8Array([0x62, 0x0a]), "ü\n"]);
    expect(readFileSync(path, "utf8")).toBe("a,b\nü\n");
  });

  it("on failure keeps the old file and removes the temporary one", () => {
    const target = join(dir, "taken");
    mkdirSync(join(target, "inside"), { recursive: true });
    // Renaming a file over a non-empty folder fails: the write must fail cleanly.
    expect(() => writeFileAtomic(target, "data")).toThrow();
    expect(existsSync(join(target, "inside"))).toBe(true);
    expect(readdirSync(dir).filter((name) => name.endsWith(".tmp"))).toEqual([]);
  });

  it("when the pieces fail halfway, the old file stays and no temporary file is left", () => {
    const path = join(dir, "kept.txt");
    writeFileAtomic(path, "old\n");
    function* failing() {
      yield "new, ";
      throw new RangeError("row 3 has 2 cells but the header has 4");
    }
    expect(() => writeFileAtomic(path, failing())).toThrow("row 3 has 2 cells");
    expect(readFileSync(path, "utf8")).toBe("old\n");
    expect(readdirSync(dir).filter((name) => name.endsWith(".tmp"))).toEqual([]);
  });
});

describe("stageFile", () => {
  it("writes the whole content under a temporary name, with its length and SHA-256, until committed", async () => {
    const { createHash } = await import("node:crypto");
    const { stageFile } = await import("./write-file-atomic.js");
    const path = join(dir, "staged.csv");
    const staged = stageFile(path, ["id,x\n", new Uint8Array([0x61, 0x2c, 0x31, 0x0a])]);
    expect(existsSync(path)).toBe(false);
    expect(readFileSync(staged.temporary, "utf8")).toBe("id,x\na,1\n");
    expect(staged.bytes).toBe(9);
    // Reference: node:crypto's SHA-256 of the same bytes (FIPS 180-4).
    expect(staged.sha256).toBe(createHash("sha256").update("id,x\na,1\n").digest("hex"));
    staged.commit();
    expect(readFileSync(path, "utf8")).toBe("id,x\na,1\n");
    expect(existsSync(staged.temporary)).toBe(false);
    const dropped = stageFile(path, "other\n");
    dropped.discard();
    expect(readFileSync(path, "utf8")).toBe("id,x\na,1\n");
    expect(existsSync(dropped.temporary)).toBe(false);
  });
});
