/**
 * A manifest of good graphs mixed with a corpus of broken inputs: every broken one is reported in
 * errors.csv with the right reason and position, every good graph is in the tables, and the exit code
 * says that some failed. Positions are those of the files as written here (1-based line and column).
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { encodeNpy } from "@cliquescape/io";
import { beforeAll, describe, expect, it } from "vitest";
import { readFeatureTable, similarityMatrix } from "./extract-fixtures.js";
import { type CliRun, matrixCsv, runCli, scratchFiles } from "./run-cli.js";

const GOOD = ["good1", "good2", "good3"];

describe("extract on a manifest with broken inputs", () => {
  let dir: string;
  let run: CliRun;
  let errors: Map<string, { file: string; line: string; column: string; reason: string }>;
  beforeAll(() => {
    const npy = encodeNpy(new Float64Array(16).fill(0.5), [4, 4]);
    dir = scratchFiles({
      "empty.csv": "",
      "ragged.csv": "0,0.5,0.2\n0.5,0,0.3\n0.2,0.3\n",
      // NaN is no edge by default (numpy's corrcoef writes it for constant signals); infinity is never a weight.
      "inf.csv": "0,0.5,0.2\n0.5,0,inf\n0.2,0.3,0\n",
      "text.csv": "0,0.5,0.2\n0.5,0,abc\n0.2,0.3,0\n",
      "nonsquare.csv": "0,0.5,0.2,0.1\n0.5,0,0.3,0.1\n0.2,0.3,0,0.1\n",
      "zero.npy": "",
    });
    writeFileSync(join(dir, "truncated.npy"), npy.subarray(0, npy.length - 40));
    GOOD.forEach((id, i) => {
      writeFileSync(join(dir, `${id}.csv`), matrixCsv(similarityMatrix(9 + i, false, 7 + i)));
    });
    writeFileSync(
      join(dir, "manifest.csv"),
      [
        "id,file,label",
        "good1,good1.csv,a",
        "empty,empty.csv,a",
        "ragged,ragged.csv,b",
        "inf,inf.csv,b",
        "good2,good2.csv,b",
        "text,text.csv,a",
        "nonsquare,nonsquare.csv,b",
        "zero,zero.npy,a",
        "truncated,truncated.npy,b",
        "missing,missing.csv,a",
        "good1,good3.csv,a", // duplicate id (line 12)
        "good3,good3.csv,b",
        "",
      ].join("\n"),
    );
    run = runCli(["extract", join(dir, "manifest.csv"), "--out", join(dir, "run"), "--workers", "2"]);
    const table = readFeatureTable(join(dir, "run", "errors.csv"));
    expect(table.header).toEqual(["id", "file", "line", "column", "reason"]);
    errors = new Map(
      table.rows.map(([id, file, line, column, reason]) => [id, { file, line, column, reason }]),
    );
  });

  it("exits 1 and says so", () => {
    expect(run.status).toBe(1);
    expect(run.stdout).toContain("done: 3 graphs in the tables, 9 left out");
  });

  it("keeps every good graph, in manifest order", () => {
    const table = readFeatureTable(join(dir, "run", "features.csv"));
    expect(table.rows.map((r) => r[0])).toEqual(GOOD);
  });

  it.each([
    ["empty", "empty.csv", "", "", /^file is empty/],
    ["ragged", "ragged.csv", "3", "", /row has 2 cells but line 1 has 3/],
    ["inf", "inf.csv", "2", "3", /"inf" is not a finite weight/],
    ["text", "text.csv", "2", "3", /"abc" is not a number/],
    ["nonsquare", "nonsquare.csv", "3", "", /not square: 3 rows but 4 columns/],
    ["zero", "zero.npy", "", "", /empty \(0 bytes\)/],
    ["truncated", "truncated.npy", "", "", /truncated: .* needs 128 bytes .* only 88/],
  ])("%s: %s reported with its position and reason", (id, file, line, column, reason) => {
    const e = errors.get(id);
    expect(e, `${id} in errors.csv`).toBeDefined();
    expect(e!.file).toBe(file);
    expect(e!.line).toBe(line);
    expect(e!.column).toBe(column);
    expect(e!.reason).toMatch(reason);
  });

  it("a manifest row naming a missing file is reported at its manifest line", () => {
    const e = errors.get("missing")!;
    expect(e.file).toBe("manifest.csv");
    expect(e.line).toBe("11");
    expect(e.column).toBe("2");
    expect(e.reason).toMatch(/missing\.csv/);
  });

  it("a duplicate id is reported at its second line; the first keeps its graph", () => {
    const e = errors.get("good1")!;
    expect(e.file).toBe("manifest.csv");
    expect(e.line).toBe("12");
    expect(e.reason).toMatch(/duplicate/i);
  });

  it("lists nothing else", () => {
    expect(errors.size).toBe(9);
  });
});
