import { fromDenseMatrix, GraphInputError } from "@cliquescape/core";
import { describe, expect, it } from "vitest";
import { InputFileError } from "./input-file-error.js";
import { type DenseMatrixTextOptions, parseDenseMatrixText } from "./parse-dense-matrix.js";

const N = Number.NaN;

function failure(text: string, options: DenseMatrixTextOptions = {}): InputFileError {
  try {
    parseDenseMatrixText(text, "m.csv", options);
  } catch (error) {
    if (error instanceof InputFileError) return error;
    throw error;
  }
  throw new Error("expected an InputFileError");
}

/** Edges as "u-v:w" strings, each once, for readable comparisons. */
function edges(text: string, options: DenseMatrixTextOptions = {}): string[] {
  const { graph } = parseDenseMatrixText(text, "m.csv", options);
  const out: string[] = [];
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      const v = graph.targets[s];
      if (graph.directed || u < v) out.push(`${u}-${v}:${graph.weights[s]}`);
    }
  }
  return out;
}

describe("parseDenseMatrixText: what is an edge", () => {
  it("reads a CSV matrix into the same graph the core builder makes from the numbers", () => {
    const { graph } = parseDenseMatrixText("0,0.5,0.25\n0.5,0,\n0.25,,0\n", "m.csv");
    expect(graph).toEqual(fromDenseMatrix(3, [N, 0.5, 0.25, 0.5, N, N, 0.25, N, N], { directed: false }));
  });

  it("drops zeros for similarity-like weights (the default) and keeps them for distances or zeroIsEdge", () => {
    const text = "0,0,2\n0,0,3\n2,3,0\n";
    expect(edges(text)).toEqual(["0-2:2", "1-2:3"]);
    expect(edges(text, { semantics: "distance" })).toEqual(["0-1:0", "0-2:2", "1-2:3"]);
    expect(edges(text, { zeroIsEdge: true })).toEqual(["0-1:0", "0-2:2", "1-2:3"]);
    expect(edges(text, { semantics: "distance", zeroIsEdge: false })).toEqual(["0-2:2", "1-2:3"]);
  });

  it("ignores the diagonal, even NaN or infinity there", () => {
    expect(edges("nan,1\n1,inf\n")).toEqual(["0-1:1"]);
  });

  it("reads directed matrices row → column", () => {
    expect(edges("0,1,0\n0,0,2\n3,0,0\n", { directed: true })).toEqual(["0-1:1", "1-2:2", "2-0:3"]);
  });

  it("applies symmetrize and negative policies from the core", () => {
    expect(edges("0,1\n3,0\n", { symmetrize: "max" })).toEqual(["0-1:3"]);
    expect(edges("0,-1\n-1,0\n", { negative: "abs" })).toEqual(["0-1:1"]);
  });

  it("reads NaN as no edge by default, saying how many cells, and refuses it when asked", () => {
    const text = "0,NaN,1\nNaN,0,2\n1,2,0\n";
    expect(edges(text)).toEqual(["0-2:1", "1-2:2"]);
    expect(parseDenseMatrixText(text, "m.csv").warnings).toEqual(["read 2 NaN cells as no edge"]);
    expect(() => parseDenseMatrixText(text, "m.csv", { nanIsNoEdge: false })).toThrow(
      'm.csv:1:2: "NaN" is not a finite weight; leave the cell empty for "no edge"',
    );
  });

  it("drops negative similarities by default (as it drops 0) and refuses negative distances", () => {
    const text = "0,-0.5,1\n-0.5,0,2\n1,2,0\n";
    expect(edges(text)).toEqual(["0-2:1", "1-2:2"]);
    expect(parseDenseMatrixText(text, "m.csv").warnings).toEqual(["dropped 1 edge with a negative weight"]);
    expect(() => parseDenseMatrixText(text, "m.csv", { semantics: "distance" })).toThrow(
      /negative weight -0.5/,
    );
    expect(parseDenseMatrixText(text, "m.csv", { negative: "abs" }).warnings).toEqual([
      "took the absolute value of the negative weight of 1 edge",
    ]);
  });

  it("reads a_ij and a_ji differing in the last bits as one weight, their mean", () => {
    // 0.1 + 0.2 and 0.3 differ in the last bit of a float64 (IEEE 754 binary64; common practice).
    const a = 0.1 + 0.2;
    expect(edges(`0,${a}\n0.3,0\n`)).toEqual([`0-1:${(a + 0.3) / 2}`]);
    expect(() => parseDenseMatrixText(`0,${a}\n0.3,0\n`, "m.csv", { symmetryTolerance: 0 })).toThrow(
      /not symmetric: 0.30000000000000004 here but 0.3 at line 2, column 1 \(relative difference 1.9e-16, above the tolerance 0\)/,
    );
  });
});

describe("parseDenseMatrixText: delimiters, comments and quoting", () => {
  const expected = ["0-1:1", "0-2:2", "1-2:3"];
  it("detects tab, comma, semicolon and whitespace", () => {
    expect(edges("0\t1\t2\n1\t0\t3\n2\t3\t0\n")).toEqual(expected);
    expect(edges("0;1;2\n1;0;3\n2;3;0\n")).toEqual(expected);
    expect(edges("  0  1 2\n1 0   3\n\t2 3 0  \n")).toEqual(expected);
    expect(edges("0 , 1 , 2\r\n1,0,3\r\n2,3,0\r\n")).toEqual(expected);
  });

  it("skips # comment lines and blank lines, and a UTF-8 byte-order mark", () => {
    expect(edges("\uFEFF# made by hand\n\n0,1,2\n  # halfway\n1,0,3\n2,3,0\n\n")).toEqual(expected);
  });
});

describe("parseDenseMatrixText: labels", () => {
  it("detects a label row with a corner cell and a label column", () => {
    const { graph } = parseDenseMatrixText(",a,b,c\na,0,1,2\nb,1,0,3\nc,2,3,0\n", "m.csv");
    expect(graph.labels).toEqual(["a", "b", "c"]);
    expect(graph.n).toBe(3);
  });

  it("detects a label row without a corner cell (n cells) over a label column", () => {
    const { graph } = parseDenseMatrixText("a b c\na 0 1 2\nb 1 0 3\nc 2 3 0\n", "m.txt");
    expect(graph.labels).toEqual(["a", "b", "c"]);
  });

  it("detects a label row alone and a label column alone", () => {
    expect(parseDenseMatrixText("a,b\n0,1\n1,0\n", "m.csv").graph.labels).toEqual(["a", "b"]);
    expect(parseDenseMatrixText("L_V1,0,1\nR_V1,1,0\n", "m.csv").graph.labels).toEqual(["L_V1", "R_V1"]);
  });

  it("reads quoted labels holding commas and quotes (RFC 4180 §2.6 and §2.7)", () => {
    const { graph } = parseDenseMatrixText(
      '"",  "x, left","say ""hi"""\n"x, left",0,1\n"say ""hi""",1,0\n',
      "m.csv",
    );
    expect(graph.labels).toEqual(["x, left", 'say "hi"']);
  });

  it("an empty corner cell means a label column, even of numbers", () => {
    const text = ",1,2\n1,0,1\n2,1,0\n";
    expect(parseDenseMatrixText(text, "m.csv", { labelRow: true }).graph.labels).toEqual(["1", "2"]);
    // So row names that are numbers are compared with the column names instead of read as weights.
    expect(failure(",a,b\n1,0,1\n2,1,0\n").reason).toBe(
      'row label "1" differs from column label "a" at line 1, column 2; rows and columns must list the nodes in the same order',
    );
  });

  it("forces numeric labels with labelRow and labelColumn", () => {
    const text = ",10,20\n10,0,1\n20,1,0\n";
    expect(parseDenseMatrixText(text, "m.csv", { labelRow: true, labelColumn: true }).graph.labels).toEqual([
      "10",
      "20",
    ]);
  });

  it("uses the labels option when the file has none", () => {
    expect(parseDenseMatrixText("0,1\n1,0\n", "m.csv", { labels: ["p", "q"] }).graph.labels).toEqual([
      "p",
      "q",
    ]);
  });
});

describe("parseDenseMatrixText: errors name the file, line and cell", () => {
  it("empty file and comment-only file", () => {
    expect(failure("").message).toBe("m.csv: file is empty");
    expect(failure("# nothing\n\n").message).toBe("m.csv: file holds no data, only blank or comment lines");
    expect(failure("a,b,c\n").message).toBe("m.csv: file has a label row but no matrix rows");
  });

  it("non-numeric token, counting the comment line and the label column", () => {
    const error = failure("# header comment\nx,0,1,2\ny,1,0,abc\nz,2,3,0\n");
    expect(error.message).toBe('m.csv:3:4: "abc" is not a number');
    expect([error.problem, error.line, error.column, error.reason]).toEqual([
      "not-a-number",
      3,
      4,
      '"abc" is not a number',
    ]);
  });

  it("NaN and infinity off the diagonal", () => {
    expect(failure("0,1\nNaN,0\n", { nanIsNoEdge: false }).message).toBe(
      'm.csv:2:1: "NaN" is not a finite weight; leave the cell empty for "no edge"',
    );
    expect(failure("0,-Infinity\n1,0\n").problem).toBe("not-finite");
    expect(failure("0,-Infinity\n1,0\n").column).toBe(2);
  });

  it("ragged rows", () => {
    expect(failure("0,1,2\n1,0\n2,3,0\n").message).toBe("m.csv:2: row has 2 cells but line 1 has 3");
  });

  it("non-square matrices, both ways", () => {
    expect(failure("0,1,2,4\n1,0,3,4\n").message).toBe("m.csv:2: matrix is not square: 2 rows but 4 columns");
    expect(failure("0,1,1,1\n1,0,1,1\n2,3,0,1\n1,1,1,0\n0,0,0,0\n").message).toBe(
      "m.csv:5: matrix is not square: more than 4 rows for 4 columns",
    );
    // Two or three columns without labels may be an edge list that lost its header: the message says so.
    expect(failure("0,1,2\n1,0,3\n").message).toBe(
      'm.csv:2: matrix is not square: 2 rows but 3 columns; if this file is an edge list (source, target, weight on each line), give it a header line such as "source,target,weight"',
    );
    expect(failure("0,1\n1,0\n2,3\n").message).toBe(
      'm.csv:3: matrix is not square: more than 2 rows for 2 columns; if this file is an edge list (source, target on each line), give it a header line such as "source,target"',
    );
  });

  it("asymmetric matrix read as undirected names both cells", () => {
    const error = failure("# c\n,a,b,c\na,0,1,2\nb,1,0,3\nc,2,5,0\n");
    expect(error.message).toBe(
      "m.csv:4:4: matrix is not symmetric: 3 here but 5 at line 5, column 3 (relative difference 0.4, above the tolerance 1e-9); read it as directed or choose a symmetrize policy (max, min, mean)",
    );
    expect(error.problem).toBe("asymmetric");
  });

  it("asymmetric with a missing side says 'no edge'", () => {
    expect(failure("0,1\n,0\n").reason).toMatch(
      /^matrix is not symmetric: 1 here but no edge at line 2, column 1;/,
    );
  });

  it("negative weight without a policy", () => {
    const error = failure("a,b\n0,-0.5\n-0.5,0\n", { negative: "error" });
    expect(error.message).toBe(
      "m.csv:2:2: negative weight -0.5; choose a negative-weight policy (abs, drop or keep) to accept it",
    );
    expect(error.problem).toBe("negative-weight");
  });

  it("labels that disagree, repeat or miscount", () => {
    expect(failure(",a,b\na,0,1\nc,1,0\n").message).toBe(
      'm.csv:3:1: row label "c" differs from column label "b" at line 1, column 3; rows and columns must list the nodes in the same order',
    );
    expect(failure("a,a\n0,1\n1,0\n").message).toBe(
      'm.csv:1:2: node label "a" appears twice; first at line 1, column 1',
    );
    expect(failure(",a,b,c\na,0,1\nb,1,0\n").message).toBe(
      "m.csv:1: label row has 4 cells but the matrix has 2 columns",
    );
    expect(failure("0,1\n1,0\n", { labels: ["p"] }).message).toBe(
      "m.csv: 1 labels given for a 2-node matrix",
    );
  });

  it("bad quoting", () => {
    expect(failure('0,"1\n1,0\n').message).toBe("m.csv:1:2: quoted cell is never closed");
    expect(failure('0,"1"x\n1,0\n').message).toBe(
      'm.csv:1:2: unexpected "x" after the closing quote of a cell',
    );
  });

  it("refuses a matrix above the cell limit before allocating it", () => {
    expect(failure("0,1,2\n1,0,3\n2,3,0\n", { maxCells: 8 }).message).toBe(
      "m.csv:1: a 3×3 matrix has 9 cells, more than the limit of 8; raise maxCells if you have the memory",
    );
  });
});

// Unclear cases of the audit of issue 8, each with the message and position a user sees.
describe("parseDenseMatrixText: files that are not what they seem", () => {
  it("a headerless 3-column edge list is refused, not read as a 3×3 matrix, directed or not", () => {
    const list = "0 1 0.5\n1 2 0.7\n0 2 0.3\n";
    const expected =
      'm.csv:1: this looks like an edge list without a header line, not a 3×3 matrix: its first two columns hold node numbers and its diagonal is not constant. Give it a header line such as "source,target,weight"; if it is a matrix, write its diagonal (which is ignored) as 0 or leave it empty';
    expect(failure(list).message).toBe(expected);
    expect(failure(list).problem).toBe("bad-header");
    // Before, the undirected read said "read it as directed", and the directed read took node numbers as weights.
    expect(failure(list, { directed: true }).message).toBe(expected);
    expect(failure("1,2\n2,3\n").message).toMatch(
      /^m\.csv:1: this looks like an edge list .*"source,target"; /,
    );
    // A real matrix with node-number-like entries has a constant diagonal, and reads as before.
    expect(edges("0,1,1\n1,0,2\n1,2,0\n")).toEqual(["0-1:1", "0-2:1", "1-2:2"]);
    expect(edges("1,3,0.5\n3,1,0.7\n0.5,0.7,1\n")).toEqual(["0-1:3", "0-2:0.5", "1-2:0.7"]);
  });

  it("mixed tabs and spaces: the message says the separators are mixed", () => {
    expect(failure("0\t1\t2\n1\t0 3\n2\t3\t0\n").message).toBe(
      "m.csv:2: row has 2 cells but line 1 has 3; it separates cells with spaces where line 1 uses tabs: use one kind of separator throughout",
    );
    expect(failure("0\t1 2\t3\n1\t0\t3\n").message).toBe(
      'm.csv:1:2: "1 2" is not a number; the line separates cells with spaces but the file with tabs: use one kind of separator throughout',
    );
  });

  it("semicolon-separated with decimal commas: each cell is named, not half of it", () => {
    const error = failure("0;0,5;0,25\n0,5;0;1\n0,25;1;0\n");
    expect(error.message).toBe(
      'm.csv:1:2: "0,5" is not a number; decimal commas are not read: write a decimal point (0.5)',
    );
  });
});

describe("parseDenseMatrixText: mistakes found by mutation testing to be untested", () => {
  it("a column of labels and nothing else has no matrix", () => {
    const error = failure("a\nb\n");
    expect(error.problem).toBe("not-square");
    expect(error.reason).toBe("matrix has no columns");
  });

  it("one row short: the count in the singular", () => {
    expect(failure("0,1,1\n").reason).toMatch(/^matrix is not square: 1 row but 3 columns/);
  });

  it("spaces inside a tab-separated line are named, however many", () => {
    const error = failure("0\t1\n1  0\n");
    expect(error.problem).toBe("ragged-row");
    expect(error.reason).toMatch(/it separates cells with spaces where line 1 uses tabs/);
  });

  it("a headerless edge list with multi-digit node numbers is refused as one", () => {
    // Read as a 3×3 matrix its diagonal would be 10, 12, 3: not constant, so it is an edge list.
    expect(failure("10,11,1\n11,12,2\n12,10,3\n").problem).toBe("bad-header");
  });

  it("an empty first cell with no label row is an empty diagonal, not a missing label", () => {
    expect(edges(",0.5,1\n0.5,,2\n1,2,\n")).toEqual(["0-1:0.5", "0-2:1", "1-2:2"]);
  });

  it("a decimal too large for a double (1e999) is a non-finite weight at its cell", () => {
    const error = failure("0,1e999\n1e999,0\n");
    expect(error.problem).toBe("not-finite");
    expect(error.position).toMatchObject({ line: 1, column: 2 });
  });

  it("a labels option that differs from the file's labels", () => {
    const error = failure("a,b\n0,1\n1,0\n", { labels: ["x", "y"] });
    expect(error.problem).toBe("bad-labels");
    expect(error.reason).toBe("the labels option differs from the labels in the file");
    expect(edges("a,b\n0,1\n1,0\n", { labels: ["a", "b"] })).toHaveLength(1);
  });
});

// Third round of the readers' mutation run: each case fails with one surviving mutant applied by hand.
describe("parseDenseMatrixText: mistakes found by mutation testing to be untested (third round)", () => {
  it("a label row with a corner cell over rows without labels is a miscount, not a label column", () => {
    expect(failure(",a,b\n0,1\n1,0\n").message).toBe(
      "m.csv:1: label row has 3 cells but the matrix has 2 columns",
    );
  });

  it("a label column and nothing else names the first matrix row", () => {
    // "a" alone is a label row; "b" is then a row holding only its label.
    expect(failure("a\nb\n").message).toBe("m.csv:2: matrix has no columns");
  });

  it("a ragged row in a comma file with a space inside a cell gets no tabs-and-spaces hint", () => {
    expect(failure("0,1,2\n1 0,3\n2,3,0\n").message).toBe("m.csv:2: row has 2 cells but line 1 has 3");
  });

  it("a file with a label row is a matrix even when it looks like an edge list", () => {
    // Read as a headerless table, rows 1,2 and 2,3 start with node numbers and the diagonal 1, 3 varies.
    const { graph } = parseDenseMatrixText("a,b\n1,2\n2,3\n", "m.csv");
    expect(graph.labels).toEqual(["a", "b"]);
    expect(edges("a,b\n1,2\n2,3\n")).toEqual(["0-1:2"]);
  });

  it("a labelled matrix one row short gets no edge-list hint", () => {
    expect(failure("a,b,c\n0,1,2\n1,0,3\n").message).toBe(
      "m.csv:3: matrix is not square: 2 rows but 3 columns",
    );
  });

  it("an empty diagonal cell is not the same diagonal value as a 0", () => {
    // Diagonal 0, 0, empty: not one value repeated, so the node-number table is refused as an edge list.
    const error = failure("0,1,2\n1,0,3\n2,3,\n");
    expect(error.problem).toBe("bad-header");
    expect(error.message).toMatch(
      /^m\.csv:1: this looks like an edge list without a header line, not a 3×3 matrix/,
    );
    // With the diagonal written alike it is a matrix.
    expect(edges("0,1,2\n1,0,3\n2,3,0\n")).toEqual(["0-1:1", "0-2:2", "1-2:3"]);
  });

  it("a one-cell file is a 1×1 matrix, not a label row", () => {
    const { graph } = parseDenseMatrixText("0\n", "m.csv");
    expect(graph.n).toBe(1);
    expect(graph.labels).toBeUndefined();
  });

  it("a labelled first node without edges: its empty cells are no edges, not an empty label row", () => {
    const text = "a,,,\nb,,,2\nc,,2,\n";
    expect(parseDenseMatrixText(text, "m.csv").graph.labels).toEqual(["a", "b", "c"]);
    expect(edges(text)).toEqual(["1-2:2"]);
  });

  it("an empty or repeated name in a label column names its line and the first one's", () => {
    expect(failure("a,0,1\n,1,0\n").message).toBe("m.csv:2:1: empty node label");
    expect(failure("a,0,1\na,1,0\n").message).toBe(
      'm.csv:2:1: node label "a" appears twice; first at line 1, column 1',
    );
  });

  it("errors restated from the core keep the core's error as their cause", () => {
    const asymmetric = failure("0,1\n2,0\n");
    expect(asymmetric.cause).toBeInstanceOf(GraphInputError);
    expect((asymmetric.cause as GraphInputError).problem).toBe("asymmetric");
    expect((asymmetric.cause as GraphInputError).location).toEqual({ row: 0, col: 1 });
    const negative = failure("0,-1\n-1,0\n", { negative: "error" });
    expect((negative.cause as GraphInputError).problem).toBe("negative-weight");
    const infinite = failure("0,1e999\n1e999,0\n");
    expect((infinite.cause as GraphInputError).problem).toBe("not-finite");
  });
});
