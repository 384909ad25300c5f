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

  it("reads the extension of a name without a path library", () => {
    expect(fileExtension("C:\\data\\s01.TSV")).toBe(".tsv");
    expect(fileExtension("/a.b/matrix")).toBe("");
    expect(fileExtension(".hidden")).toBe("");
  });
});
