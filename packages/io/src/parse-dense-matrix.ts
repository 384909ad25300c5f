import { fromDenseMatrix, GraphInputError, type WeightedGraph } from "@cliquescape/core";
import { asymmetryReason } from "./asymmetry-reason.js";
import { checkMatrixSize } from "./check-matrix-size.js";
import { describePosition, InputFileError, type InputFilePosition } from "./input-file-error.js";
import { nanCellsNote } from "./nan-cells-note.js";
import { classifyCell, isDecimalComma, looksNumeric, notANumberHint } from "./parse-number.js";
import { type GraphReadOptions, nanIsNoEdge, negativePolicy, zeroIsEdge } from "./read-options.js";
import { type Delimiter, detectDelimiter, type TextRow, tableRows } from "./text-rows.js";

export interface DenseMatrixTextOptions extends GraphReadOptions {
  /** Default: detected from the first data line. */
  delimiter?: Delimiter;
  /** First data line holds node names. Default: detected (every cell after the first is non-numeric). */
  labelRow?: boolean;
  /**
   * First cell of each row holds a node name. Default: detected (the label row starts with an empty corner
   * cell, or the first cell of the first matrix row is non-numeric).
   */
  labelColumn?: boolean;
}

/** One graph read from a file, with the notes about what was fixed on the way. */
export interface GraphReadResult {
  graph: WeightedGraph;
  /** Notes for the user, without the file name (the caller knows which file it read). */
  warnings: string[];
}

/**
 * Reads an n×n matrix written as text: CSV, TSV, semicolon- or whitespace-separated. An empty cell means
 * no edge; the diagonal is ignored (it must still be a number or empty); a 0 is an edge only for
 * distance-like weights or with `zeroIsEdge`; NaN is no edge unless `nanIsNoEdge` is false. Node names come from a label row and/or label column.
 */
export function parseDenseMatrixText(
  text: string,
  file: string,
  options: DenseMatrixTextOptions = {},
): GraphReadResult {
  const delimiter = options.delimiter ?? detectDelimiter(text);
  const { first: top, rest: rows } = tableRows(text, delimiter, file);
  let next: IteratorResult<TextRow> = { done: false, value: top };
  const labelRow = options.labelRow ?? isLabelRow(next.value.cells);
  let header: TextRow | undefined;
  if (labelRow) {
    header = next.value;
    next = rows.next();
    if (next.done) throw new InputFileError(file, "empty-file", "file has a label row but no matrix rows");
  }
  const first = next.value;
  // An empty corner cell atop a label row stands above a label column, whatever the labels look like.
  // Otherwise an empty first cell is the diagonal of an unlabelled matrix, not a missing label.
  const labelColumn =
    options.labelColumn ??
    ((header !== undefined && header.cells[0] === "" && header.cells.length === first.cells.length) ||
      (first.cells[0] !== "" && !looksLikeData(first.cells[0])));
  const skip = labelColumn ? 1 : 0;
  const width = first.cells.length;
  const n = width - skip;
  if (n < 1) throw new InputFileError(file, "not-square", "matrix has no columns", { line: first.line });
  checkMatrixSize(n, options, file, { line: first.line });

  const zeroEdge = zeroIsEdge(options);
  const nanNoEdge = nanIsNoEdge(options);
  let nans = 0;
  const values = new Float64Array(n * n);
  const lineOfRow = new Int32Array(n);
  // The cells of a 2×2 or 3×3 table, as written: to tell a headerless edge list from a matrix.
  const firstCells: string[][] = [];
  const rowLabels: string[] = [];
  let rowCount = 0;
  for (; !next.done; next = rows.next()) {
    const { line, cells } = next.value;
    if (cells.length !== width) {
      const mixed =
        delimiter === "\t" && cells.some((cell) => /\S[ ]+\S/.test(cell))
          ? "; it separates cells with spaces where line " +
            `${first.line} uses tabs: use one kind of separator throughout`
          : "";
      throw new InputFileError(
        file,
        "ragged-row",
        `row has ${cells.length} cells but line ${first.line} has ${width}${mixed}`,
        { line },
      );
    }
    if (rowCount === n) {
      throw new InputFileError(
        file,
        "not-square",
        `matrix is not square: more than ${n} rows for ${n} columns${edgeListHint(n, header, labelColumn)}`,
        {
          line,
        },
      );
    }
    const i = rowCount++;
    lineOfRow[i] = line;
    if (n <= 3) firstCells.push(cells.slice(skip));
    if (labelColumn) rowLabels.push(cells[0]);
    for (let j = 0; j < n; j++) {
      const raw = cells[j + skip];
      const cell = classifyCell(raw);
      const at = () => ({ line, column: j + skip + 1 });
      if (cell.kind === "text") {
        throw new InputFileError(
          file,
          "not-a-number",
          `${JSON.stringify(raw)} is not a number${notANumberHint(raw, delimiter)}`,
          at(),
        );
      }
      let w = Number.NaN;
      if (i !== j) {
        if (cell.kind === "number") {
          w = cell.value === 0 && !zeroEdge ? Number.NaN : cell.value;
        } else if (cell.kind === "not-finite") {
          if (!(Number.isNaN(cell.value) && nanNoEdge)) {
            throw new InputFileError(
              file,
              "not-finite",
              `${JSON.stringify(raw)} is not a finite weight; leave the cell empty for "no edge"`,
              at(),
            );
          }
          nans++;
        }
      }
      values[i * n + j] = w;
    }
  }
  if (rowCount < n) {
    throw new InputFileError(
      file,
      "not-square",
      `matrix is not square: ${rowCount} row${rowCount === 1 ? "" : "s"} but ${n} columns${edgeListHint(n, header, labelColumn)}`,
      { line: lineOfRow[rowCount - 1] },
    );
  }
  if (header === undefined && !labelColumn && looksLikeEdgeList(n, firstCells)) {
    throw new InputFileError(
      file,
      "bad-header",
      `this looks like an edge list without a header line, not a ${n}×${n} matrix: its first two columns hold ` +
        `node numbers and its diagonal is not constant. Give it a header line such as "source,target${n === 3 ? ",weight" : ""}"; ` +
        "if it is a matrix, write its diagonal (which is ignored) as 0 or leave it empty",
      { line: first.line },
    );
  }

  const labels = resolveLabels(file, n, header, labelColumn, rowLabels, lineOfRow, options.labels);
  const warnings: string[] = nans > 0 ? [nanCellsNote(nans)] : [];
  const cellAt = (row: number, col: number): InputFilePosition => ({
    line: lineOfRow[row],
    column: col + skip + 1,
  });
  try {
    const graph = fromDenseMatrix(n, values, {
      directed: options.directed ?? false,
      symmetrize: options.symmetrize,
      symmetryTolerance: options.symmetryTolerance,
      negative: negativePolicy(options),
      labels,
      onWarning: (message) => warnings.push(message),
    });
    return { graph, warnings };
  } catch (error) {
    if (!(error instanceof GraphInputError)) throw error;
    const { row, col } = error.location;
    if (row === undefined || col === undefined)
      throw new InputFileError(file, "not-square", error.message, {}, { cause: error });
    if (error.problem === "asymmetric") {
      throw new InputFileError(
        file,
        "asymmetric",
        asymmetryReason(
          values[row * n + col],
          values[col * n + row],
          describePosition(cellAt(col, row)),
          options.symmetryTolerance,
        ),
        cellAt(row, col),
        { cause: error },
      );
    }
    const problem = error.problem === "negative-weight" ? "negative-weight" : "not-finite";
    throw new InputFileError(file, problem, error.message, cellAt(row, col), { cause: error });
  }
}

/** The hint that a 2- or 3-column table without labels may be an edge list missing its header line. */
function edgeListHint(n: number, header: TextRow | undefined, labelColumn: boolean): string {
  return n <= 3 && header === undefined && !labelColumn
    ? `; if this file is an edge list (source, target${n === 3 ? ", weight" : ""} on each line), give it a header line such as "source,target${n === 3 ? ",weight" : ""}"`
    : "";
}

/**
 * A 2×2 or 3×3 table read as a matrix that is far likelier an edge list without its header: every row starts
 * with two whole numbers ≥ 0 (node numbers) and the diagonal is not one value repeated, as a matrix's is
 * in practice (0, 1 or empty). Refused rather than read as a matrix of node numbers.
 */
function looksLikeEdgeList(n: number, cells: readonly string[][]): boolean {
  if (n < 2 || n > 3 || cells.length !== n) return false;
  const nodeNumber = (cell: string) => /^\d+$/.test(cell);
  if (!cells.every((row) => nodeNumber(row[0]) && nodeNumber(row[1]))) return false;
  const diagonal = cells.map((row, i) => classifyCell(row[i]));
  const same = (a: (typeof diagonal)[number], b: (typeof diagonal)[number]) =>
    a.kind === b.kind && (!("value" in a) || !("value" in b) || Object.is(a.value, b.value));
  return !diagonal.every((cell) => same(cell, diagonal[0]));
}

/** A label row names nodes: every cell after the first (which may be a corner cell) is non-numeric text. */
function isLabelRow(cells: readonly string[]): boolean {
  const named = cells.length === 1 ? cells : cells.slice(1);
  return named.every((cell) => cell !== "" && !looksLikeData(cell));
}

/**
 * A cell that is meant as a number: one that reads as one, or a number written with a decimal comma
 * ("0,5", refused later with a hint). Such cells are data, never labels: a semicolon file with decimal
 * commas would otherwise pass for a labelled matrix one row and column smaller.
 */
function looksLikeData(cell: string): boolean {
  return looksNumeric(cell) || isDecimalComma(cell);
}

/**
 * Node names from the label row and/or column, or from the options. A label row may carry a corner
 * cell above the label column (n + 1 cells) or not (n cells, as R's write.table does).
 */
function resolveLabels(
  file: string,
  n: number,
  header: TextRow | undefined,
  labelColumn: boolean,
  rowLabels: readonly string[],
  lineOfRow: Int32Array,
  given: readonly string[] | undefined,
): string[] | undefined {
  let columnLabels: string[] | undefined;
  let firstLabelColumn = 1;
  if (header) {
    if (header.cells.length === n) {
      columnLabels = header.cells;
    } else if (header.cells.length === n + 1 && labelColumn) {
      columnLabels = header.cells.slice(1);
      firstLabelColumn = 2;
    } else {
      throw new InputFileError(
        file,
        "bad-labels",
        `label row has ${header.cells.length} cells but the matrix has ${n} columns`,
        { line: header.line },
      );
    }
  }
  if (columnLabels && labelColumn) {
    for (let i = 0; i < n; i++) {
      if (rowLabels[i] !== columnLabels[i]) {
        throw new InputFileError(
          file,
          "bad-labels",
          `row label ${JSON.stringify(rowLabels[i])} differs from column label ${JSON.stringify(columnLabels[i])} ` +
            `at line ${header!.line}, column ${i + firstLabelColumn}; rows and columns must list the nodes in the same order`,
          { line: lineOfRow[i], column: 1 },
        );
      }
    }
  }
  const labels = columnLabels ?? (labelColumn ? [...rowLabels] : undefined);
  if (labels) {
    const seen = new Map<string, number>();
    labels.forEach((label, i) => {
      const before = seen.get(label);
      const position = columnLabels
        ? { line: header!.line, column: i + firstLabelColumn }
        : { line: lineOfRow[i], column: 1 };
      if (label === "") throw new InputFileError(file, "bad-labels", "empty node label", position);
      if (before !== undefined) {
        const first = columnLabels
          ? { line: header!.line, column: before + firstLabelColumn }
          : { line: lineOfRow[before], column: 1 };
        throw new InputFileError(
          file,
          "bad-labels",
          `node label ${JSON.stringify(label)} appears twice; first at ${describePosition(first)}`,
          position,
        );
      }
      seen.set(label, i);
    });
    if (given && given.join("\u0000") !== labels.join("\u0000")) {
      throw new InputFileError(file, "bad-labels", "the labels option differs from the labels in the file");
    }
    return labels;
  }
  if (given && given.length !== n) {
    throw new InputFileError(file, "bad-labels", `${given.length} labels given for a ${n}-node matrix`);
  }
  return given ? [...given] : undefined;
}
