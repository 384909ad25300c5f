import { mkdirSync, mkdtempSync, rmSync, truncateSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { encodeNpy } from "./encode-npy.js";
import { InputFileError } from "./input-file-error.js";
import { type GraphFileOptions, readGraphFile, readNpyFile } from "./read-graph-file.js";
import { writeNpyFile } from "./write-npy-file.js";

const dir = mkdtempSync(join(tmpdir(), "cliquescape-read-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function file(name: string, content: string | Uint8Array): string {
  const path = join(dir, name);
  writeFileSync(path, content);
  return path;
}

function failure(path: string, options: GraphFileOptions = {}): InputFileError {
  try {
    readGraphFile(path, options);
  } catch (error) {
    if (error instanceof InputFileError) return error;
    throw error;
  }
  throw new Error("expected an InputFileError");
}

describe("readGraphFile: choosing the reader", () => {
  it("reads a .csv matrix, a .csv edge list, a .txt whitespace matrix and a .tsv", () => {
    expect(readGraphFile(file("m.csv", "0,1\n1,0\n"))).toMatchObject({
      format: "dense-matrix",
      warnings: [],
    });
    const edges = readGraphFile(file("e.csv", "source,target,weight\na,b,2\n"));
    expect(edges.format).toBe("edge-list");
    expect(edges.graphs[0].labels).toEqual(["a", "b"]);
    expect(readGraphFile(file("m.txt", "0 1 2\n1 0 3\n2 3 0\n")).graphs[0].n).toBe(3);
    // In a .tsv file the tab is the delimiter even when cells hold commas.
    const tsv = readGraphFile(file("m.tsv", "\tx,1\ty,2\nx,1\t0\t1\ny,2\t1\t0\n"));
    expect(tsv.graphs[0].labels).toEqual(["x,1", "y,2"]);
  });

  it("reads a .npy stack as several graphs", () => {
    const path = join(dir, "stack.npy");
    writeNpyFile(path, [0, 1, 1, 0, 0, 2, 2, 0], [2, 2, 2]);
    const result = readGraphFile(path);
    expect(result.format).toBe("npy");
    expect(result.graphs.map((g) => Array.from(g.weights))).toEqual([
      [1, 1],
      [2, 2],
    ]);
    expect(readNpyFile(path).shape).toEqual([2, 2, 2]);
  });

  it("takes labels as the node list of an edge list", () => {
    const path = file("nodes.csv", "source,target\nc,a\n");
    expect(readGraphFile(path, { labels: ["a", "b", "c"] }).graphs[0].labels).toEqual(["a", "b", "c"]);
    expect(failure(path, { labels: ["a", "b"] }).reason).toBe('unknown node "c": not in the node list');
  });

  it("follows an explicit format over the extension", () => {
    const path = file("graph.dat", "a b 1\nb c 2\n");
    const result = readGraphFile(path, { format: "edge-list", header: false });
    expect(result.format).toBe("edge-list");
    expect(result.graphs[0].labels).toEqual(["a", "b", "c"]);
    expect(
      readGraphFile(file("m.data", encodeNpy([0, 1, 1, 0], [2, 2])), { format: "npy" }).graphs[0].n,
    ).toBe(2);
  });

  it("treats a header naming nodes i and j as an edge list unless labels are placed", () => {
    const path = file("ij.csv", "i,j\n0,1\n1,0\n");
    expect(readGraphFile(path, { directed: true }).format).toBe("edge-list");
    expect(readGraphFile(path, { labelRow: true }).format).toBe("dense-matrix");
    // Placing the label column alone says the same: only a matrix has one (the first row is then its labels).
    const matrix = readGraphFile(path, { labelColumn: false });
    expect(matrix.format).toBe("dense-matrix");
    expect(matrix.graphs[0].labels).toEqual(["i", "j"]);
  });
});

describe("readGraphFile: default size limits (read-options.ts)", () => {
  // Sparse files: the size is checked from the file's metadata before any byte is read.
  it("256 MiB for text files, 2 GiB for .npy", () => {
    const big = (name: string) => {
      const path = join(dir, name);
      writeFileSync(path, "");
      truncateSync(path, 256 * 2 ** 20 + 1);
      return path;
    };
    expect(failure(big("big.csv")).reason).toBe(
      "file is 256 MiB, more than the limit of 256 MiB; raise maxBytes if you have the memory",
    );
    expect(failure(big("big.npy")).problem).not.toBe("too-large");
  });
});

describe("readGraphFile: file-level errors", () => {
  it("unknown extension", () => {
    expect(failure(file("g.xlsx", "")).message).toBe(
      `${join(dir, "g.xlsx")}: cannot tell the format from the extension ".xlsx"; use .csv, .tsv, .txt, .npy, .npz, .mat, .graphml or .gexf, or set the format option`,
    );
  });

  it("missing file", () => {
    const error = failure(join(dir, "nope.csv"));
    expect(error.problem).toBe("unreadable");
    expect(error.reason).toMatch(/^cannot read file: ENOENT/);
  });

  it("a directory", () => {
    const sub = join(dir, "sub.csv");
    mkdirSync(sub);
    expect(failure(sub).message).toBe(`${sub}: not a regular file (a directory)`);
  });

  it("empty files of each kind", () => {
    expect(failure(file("empty.csv", "")).reason).toBe("file is empty");
    expect(failure(file("empty.npy", "")).reason).toBe("file is empty (0 bytes)");
  });

  it("a file over the size limit is refused before it is read", () => {
    const error = failure(file("big.csv", "0,1\n1,0\n"), { maxBytes: 4 });
    expect(error.reason).toBe(
      "file is 8 bytes, more than the limit of 4 bytes; raise maxBytes if you have the memory",
    );
    expect(error.problem).toBe("too-large");
  });

  it("a binary file named .csv", () => {
    const error = failure(file("binary.csv", new Uint8Array([0x93, 0x4e, 0x55, 0xff, 0xfe, 0x00])));
    expect(error.reason).toBe("file is not UTF-8 text (is it a binary file?)");
  });

  it("a .npy file cut short on disk", () => {
    const bytes = encodeNpy([0, 1, 1, 0], [2, 2]);
    const error = failure(file("cut.npy", bytes.subarray(0, 140)));
    expect(error.problem).toBe("truncated");
    expect(error.message).toBe(
      `${join(dir, "cut.npy")}: byte 140: file is truncated: shape (2, 2) of <f8 needs 32 bytes of data after byte 128, but only 12 are there`,
    );
  });

  it("errors inside text files keep their line and column", () => {
    const error = failure(file("bad.csv", "0,1\n1,x\n"));
    expect([error.line, error.column, error.reason]).toEqual([2, 2, '"x" is not a number']);
  });
});
