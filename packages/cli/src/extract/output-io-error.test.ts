import { describe, expect, it } from "vitest";
import { exitCodeFor } from "../exit-codes.js";
import { isOutputIOError, OutputIOError } from "./output-io-error.js";

const errno = (code: string, path?: string, dest?: string) =>
  Object.assign(new Error(`${code}: raw text`), {
    code,
    ...(path ? { path } : {}),
    ...(dest ? { dest } : {}),
  });

describe("OutputIOError", () => {
  it("restates a refused write as one line naming --out, the path, the reason and the errno code", () => {
    const error = new OutputIOError(errno("ENOSPC", "/scratch/run/graphs/a.json"), "/scratch/run", "kept");
    expect(error.message).toBe(
      "--out /scratch/run: cannot write /scratch/run/graphs/a.json: no space left on the device (ENOSPC); kept",
    );
    expect(exitCodeFor(error)).toBe(74);
    // The folder itself: its path is not repeated.
    expect(new OutputIOError(errno("EROFS", "/ro/run"), "/ro/run").message).toBe(
      "--out /ro/run: cannot write: the file system is read-only (EROFS)",
    );
  });

  it("is only about the run folder: the same codes elsewhere (an input, a temp dir) are left alone", () => {
    expect(isOutputIOError(errno("EACCES", "/runs/a/spec.json"), "/runs/a")).toBe(true);
    expect(isOutputIOError(errno("EROFS", "/runs"), "/runs/a")).toBe(true); // making a parent folder
    expect(isOutputIOError(errno("EXDEV", "/x", "/runs/a/b"), "/runs/a")).toBe(false); // not a listed code
    expect(isOutputIOError(errno("EACCES", "/data/scan.npy"), "/runs/a")).toBe(false);
    expect(isOutputIOError(errno("EACCES", "/runs/ab/x"), "/runs/a")).toBe(false); // a sibling, not inside
    expect(isOutputIOError(errno("ENOSPC"), "/runs/a")).toBe(true); // write(2) names no file
    expect(isOutputIOError(new Error("plain"), "/runs/a")).toBe(false);
  });
});
