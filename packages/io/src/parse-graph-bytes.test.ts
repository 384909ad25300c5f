import { describe, expect, it } from "vitest";
import { encodeNpy } from "./encode-npy.js";
import { InputFileError } from "./input-file-error.js";
import { fileExtension, parseGraphBytes } from "./parse-graph-bytes.js";

const text = (s: string) => new TextEncoder().encode(s);

function failure(run: () => unknown): InputFileError {
  try {
    run();
  } catch (error) {
    if (error instanceof InputFileError) return error;
    throw error;
  }
  throw new Error("expected an InputFileError");
}

describe("parseGraphBytes", () => {
  it("tells a dense matrix, an edge list and a .npy array apart by name and first line", () => {
    expect(parseGraphBytes(text("0,1\n1,0\n"), "m.csv").format).toBe("dense-matrix");
    const edges = parseGraphBytes(text("source,target,weight\na,b,2\n"), "dropped/e.CSV");
    expect(edges.format).toBe("edge-list");
    expect(edges.graphs[0].labels).toEqual(["a", "b"]);
    const npy = parseGraphBytes(encodeNpy([0, 3, 3, 0], [2, 2]), "m.npy");
    expect(npy.format).toBe("npy");
    expect(Array.from(npy.graphs[0].weights)).toEqual([3, 3]);
  });

  it("names file, line and column of a bad cell, as readGraphFile does", () => {
    const error = failure(() => parseGraphBytes(text("0,1,1\n1,0,oops\n1,1,0\n"), "bad.csv"));
    expect(error.problem).toBe("not-a-number");
    expect(error.message).toBe('bad.csv:2:3: "oops" is not a number');
  });

  it("refuses an extension it cannot parse without a file system, and bytes over the limit", () => {
    expect(failure(() => parseGraphBytes(text("x"), "g.graphml")).problem).toBe("unknown-format");
    expect(failure(() => parseGraphBytes(text("0,1\n1,0\n"), "m.csv", { maxBytes: 4 })).problem).toBe(
      "too-large",
    );
  });

  it("names the extension it cannot read, or the file when there is none", () => {
    expect(failure(() => parseGraphBytes(text("x"), "g.graphml")).reason).toBe(
      'cannot read ".graphml" files here; use .csv, .tsv, .txt (a matrix or an edge list) or .npy',
    );
    expect(failure(() => parseGraphBytes(text("x"), "matrix")).reason).toBe(
      'cannot read "matrix" files here; use .csv, .tsv, .txt (a matrix or an edge list) or .npy',
    );
  });

  it("default limits: 256 MiB for text, 2 GiB for .npy (read-options.ts)", () => {
    const bytes = new Uint8Array(256 * 2 ** 20 + 1);
    const textError = failure(() => parseGraphBytes(bytes, "big.csv"));
    expect(textError.reason).toBe(
      "file is 256 MiB, more than the limit of 256 MiB; raise maxBytes if you have the memory",
    );
    // The same bytes as .npy pass the size check and fail on the header instead.
    expect(failure(() => parseGraphBytes(bytes, "big.npy")).problem).not.toBe("too-large");
  });

  it("a .tsv is split at tabs even when its first line has none", () => {
    // One node whose label holds a comma: split at commas, the label row would have two cells for one column.
    const result = parseGraphBytes(text("x,y\n0\n"), "one.tsv", { labelRow: true });
    expect(result.graphs[0].labels).toEqual(["x,y"]);
  });

  it("a label row makes a matrix of a file whose first line looks like an edge-list header", () => {
    const result = parseGraphBytes(text("source,target,weight\n0,1,2\n1,0,3\n2,3,0\n"), "m.csv", {
      labelRow: true,
    });
    expect(result.format).toBe("dense-matrix");
    expect(result.graphs[0].labels).toEqual(["source", "target", "weight"]);
  });

  it("reads the extension of a name without a path library", () => {
    expect(fileExtension("C:\\data\\s01.TSV")).toBe(".tsv");
    expect(fileExtension("/a.b/matrix")).toBe("");
    expect(fileExtension(".hidden")).toBe("");
  });
});
