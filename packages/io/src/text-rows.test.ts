import { describe, expect, it } from "vitest";
import type { InputFileError } from "./input-file-error.js";
import { classifyCell } from "./parse-number.js";
import { detectDelimiter, textRows } from "./text-rows.js";

const rows = (text: string, delimiter: Parameters<typeof textRows>[1]) => [
  ...textRows(text, delimiter, "t.csv"),
];

describe("textRows", () => {
  it("keeps line numbers across comments, blank lines and CRLF endings", () => {
    expect(rows("# c\r\n\r\na,b\r\n\r\nc,d", ",")).toEqual([
      { line: 3, cells: ["a", "b"] },
      { line: 5, cells: ["c", "d"] },
    ]);
  });

  it("reads RFC 4180 quoted fields: delimiters, doubled quotes and line breaks inside (RFC 4180 §2.6, §2.7)", () => {
    expect(rows('"a,1","say ""x""","two\nlines"\nnext,row,3\n', ",")).toEqual([
      { line: 1, cells: ["a,1", 'say "x"', "two\nlines"] },
      { line: 3, cells: ["next", "row", "3"] },
    ]);
  });

  it("a line of tabs in a TSV file is a row of empty cells, not a blank line", () => {
    expect(rows("1\t2\t3\n\t\t\n", "\t")).toEqual([
      { line: 1, cells: ["1", "2", "3"] },
      { line: 2, cells: ["", "", ""] },
    ]);
  });

  it("a # inside a quoted first cell is data, not a comment", () => {
    expect(rows('"#1",2\n', ",")).toEqual([{ line: 1, cells: ["#1", "2"] }]);
  });

  it("reports an unclosed quote where the cell starts", () => {
    try {
      rows('a,b\nc,"d\ne\n', ",");
      expect.unreachable();
    } catch (error) {
      expect((error as InputFileError).message).toBe("t.csv:2:2: quoted cell is never closed");
    }
  });

  it("detects the delimiter from the first data line", () => {
    expect(detectDelimiter("# a,b\n1\t2\n")).toBe("\t");
    expect(detectDelimiter("1,2\n")).toBe(",");
    expect(detectDelimiter("1;2\n")).toBe(";");
    expect(detectDelimiter("1 2\n")).toBe("whitespace");
  });
});

describe("classifyCell", () => {
  it("accepts decimal numbers only; Number() would take '' as 0 and '0x1A' as 26", () => {
    expect(classifyCell("")).toEqual({ kind: "empty" });
    expect(classifyCell("0x1A")).toEqual({ kind: "text" });
    expect(classifyCell("1e")).toEqual({ kind: "text" });
    expect(classifyCell("1,5")).toEqual({ kind: "text" });
    expect(classifyCell("-.5e-3")).toEqual({ kind: "number", value: -0.0005 });
    expect(classifyCell("+3.")).toEqual({ kind: "number", value: 3 });
  });

  it("recognises NaN and infinity as numpy, R and JavaScript write them (common practice)", () => {
    for (const t of ["nan", "NaN", "NA"]) expect(classifyCell(t).kind).toBe("not-finite");
    expect(classifyCell("-inf")).toEqual({ kind: "not-finite", value: Number.NEGATIVE_INFINITY });
    expect(classifyCell("Infinity")).toEqual({ kind: "not-finite", value: Number.POSITIVE_INFINITY });
    expect(classifyCell("na")).toEqual({ kind: "text" });
  });
});

// RFC 4180 (Shafranovich, 2005) §2: fields may be quoted, records end with CRLF; around quoted fields spreadsheets
// and pandas.to_csv write spaces at times (common practice), which we accept. Each case worked by hand.
describe("textRows: quoted records, their edges and their line numbers", () => {
  const error = (text: string, delimiter: Parameters<typeof textRows>[1] = ",") => {
    try {
      rows(text, delimiter);
    } catch (thrown) {
      return (thrown as InputFileError).message;
    }
    return "no error";
  };

  it("spaces around a quoted cell are not part of it; a leading tab in a TSV file is an empty cell", () => {
    expect(rows(' "a" , b\n', ",")).toEqual([{ line: 1, cells: ["a", "b"] }]);
    expect(rows('\t"a"\tb\n', "\t")).toEqual([{ line: 1, cells: ["", "a", "b"] }]);
    expect(rows('"a"\t,b\n', ",")).toEqual([{ line: 1, cells: ["a", "b"] }]);
    // Tabs are blanks too before a quoted cell of a comma-separated record (RFC 4180 has no blanks at all;
    // spreadsheet exports that pad cells use both).
    expect(rows('1,\t"a"\n', ",")).toEqual([{ line: 1, cells: ["1", "a"] }]);
    expect(rows('"a", \t"b"\n', ",")).toEqual([{ line: 1, cells: ["a", "b"] }]);
  });

  it("a quoted record may end the file without a line break, with a quoted or an unquoted last cell", () => {
    expect(rows('1,"b"', ",")).toEqual([{ line: 1, cells: ["1", "b"] }]);
    expect(rows('"a",b', ",")).toEqual([{ line: 1, cells: ["a", "b"] }]);
  });

  it("CRLF after a quoted record: the next record keeps its own line number", () => {
    expect(rows('"a","b"\r\n1,2\r\n', ",")).toEqual([
      { line: 1, cells: ["a", "b"] },
      { line: 2, cells: ["1", "2"] },
    ]);
  });

  it("a blank line right after a quoted record counts as a line", () => {
    expect(rows('"a"\n\n1\n', ",")).toEqual([
      { line: 1, cells: ["a"] },
      { line: 3, cells: ["1"] },
    ]);
  });

  it("a CRLF blank line in a TSV file is blank, as with LF", () => {
    expect(rows("1\t2\r\n\r\n3\t4\r\n", "\t")).toEqual([
      { line: 1, cells: ["1", "2"] },
      { line: 3, cells: ["3", "4"] },
    ]);
  });

  it("a quote inside an unquoted cell, or text after a closing quote, is named at its line and column", () => {
    // The second record starts on line 2; its first cell spans lines 2–3, so the faulty cell is on line 3.
    expect(error('h,h,h\n"x\ny",b"c\n')).toBe(
      "t.csv:3:2: a quote inside an unquoted cell; quote the whole cell",
    );
    expect(error('h,h\n"x\ny"z,1\n')).toBe('t.csv:3:1: unexpected "z" after the closing quote of a cell');
  });

  it("a lone carriage return after a closing quote is text after the quote, not a line break", () => {
    // RFC 4180 ends records with CRLF; a lone CR (old Mac line endings) is not a line break in an unquoted
    // record either (it stays in its cell). It used to end a quoted record and count a line it did not
    // consume, so every later line number was one too high.
    expect(error('h,h\n"a"\rb,c\n')).toBe('t.csv:2:1: unexpected "\\r" after the closing quote of a cell');
    expect(error('h,h\n"a"\r')).toBe('t.csv:2:1: unexpected "\\r" after the closing quote of a cell');
    expect(rows('"a"\r\n"b"\r\n', ",")).toEqual([
      { line: 1, cells: ["a"] },
      { line: 2, cells: ["b"] },
    ]);
  });

  it("a comma between digits with no semicolon on the line is a delimiter", () => {
    expect(detectDelimiter("1,5\n")).toBe(",");
    expect(detectDelimiter("1,5;2,5\n")).toBe(";");
  });
});
