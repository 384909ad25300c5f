import { fromEdgeList, GraphInputError } from "@cliquescape/core";
import { type EdgeColumnNames, type EdgeColumns, findEdgeColumns } from "./edge-list-columns.js";
import { InputFileError } from "./input-file-error.js";
import type { GraphReadResult } from "./parse-dense-matrix.js";
import { classifyCell, notANumberHint } from "./parse-number.js";
import { type GraphReadOptions, nanIsNoEdge, negativePolicy, zeroIsEdge } from "./read-options.js";
import { type Delimiter, detectDelimiter, type TextRow, tableRows } from "./text-rows.js";

export interface EdgeListTextOptions extends Omit<GraphReadOptions, "labels" | "maxCells">, EdgeColumnNames {
  /** Default: detected from the first data line. */
  delimiter?: Delimiter;
  /** Default true. Without a header the columns are source, target and (if present) weight, in that order. */
  header?: boolean;
  /**
   * The nodes, in index order. Without it nodes are numbered in order of first appearance. With it, nodes
   * that no edge mentions are kept (isolated), and an edge naming a node outside the list is an error.
   */
  nodes?: readonly string[];
}

/**
 * Reads an edge list: one edge per row, source and target as node names (any text), an optional weight
 * (weight 1 when the list has no weight column). Node names become the graph's labels.
 */
export function parseEdgeListText(
  text: string,
  file: string,
  options: EdgeListTextOptions = {},
): GraphReadResult {
  const delimiter = options.delimiter ?? detectDelimiter(text);
  const { first: top, rest: rows } = tableRows(text, delimiter, file);
  const warnings: string[] = [];
  let next: IteratorResult<TextRow> = { done: false, value: top };
  let columns: EdgeColumns;
  let width: number;
  let widthLine: number;
  if (options.header ?? true) {
    const found = findEdgeColumns(next.value.cells, options, file, next.value.line);
    if (found.warning) warnings.push(found.warning);
    columns = found.columns;
    width = next.value.cells.length;
    widthLine = next.value.line;
    next = rows.next();
  } else {
    width = next.value.cells.length;
    widthLine = next.value.line;
    if (width < 2) {
      throw new InputFileError(file, "ragged-row", "an edge needs at least a source and a target cell", {
        line: widthLine,
      });
    }
    columns = { source: 0, target: 1, weight: width >= 3 && options.weightColumn !== null ? 2 : undefined };
  }

  const index = new Map<string, number>();
  const names: string[] = [];
  if (options.nodes) {
    options.nodes.forEach((name, i) => {
      if (index.has(name)) {
        throw new InputFileError(
          file,
          "bad-labels",
          `node ${JSON.stringify(name)} is listed twice in the node list`,
        );
      }
      index.set(name, i);
      names.push(name);
    });
  }
  const zeroEdge = zeroIsEdge(options);
  const sources: number[] = [];
  const targets: number[] = [];
  const weights: number[] = [];
  const lines: number[] = [];
  let zeros = 0;
  let nans = 0;

  const nodeOf = (name: string, line: number, column: number): number => {
    if (name === "") throw new InputFileError(file, "unknown-node", "empty node name", { line, column });
    let v = index.get(name);
    if (v === undefined) {
      if (options.nodes) {
        throw new InputFileError(
          file,
          "unknown-node",
          `unknown node ${JSON.stringify(name)}: not in the node list`,
          {
            line,
            column,
          },
        );
      }
      v = names.length;
      index.set(name, v);
      names.push(name);
    }
    return v;
  };

  for (; !next.done; next = rows.next()) {
    const { line, cells } = next.value;
    if (cells.length !== width) {
      throw new InputFileError(
        file,
        "ragged-row",
        `row has ${cells.length} cells but line ${widthLine} has ${width}`,
        {
          line,
        },
      );
    }
    const u = nodeOf(cells[columns.source], line, columns.source + 1);
    const v = nodeOf(cells[columns.target], line, columns.target + 1);
    let w = 1;
    if (columns.weight !== undefined) {
      const raw = cells[columns.weight];
      const at = { line, column: columns.weight + 1 };
      const cell = classifyCell(raw);
      if (cell.kind === "empty") throw new InputFileError(file, "not-a-number", "weight cell is empty", at);
      if (cell.kind === "text") {
        throw new InputFileError(
          file,
          "not-a-number",
          `${JSON.stringify(raw)} is not a number${notANumberHint(raw, delimiter)}`,
          at,
        );
      }
      if (cell.kind === "not-finite") {
        if (Number.isNaN(cell.value) && nanIsNoEdge(options)) {
          nans++;
          continue;
        }
        throw new InputFileError(file, "not-finite", `${JSON.stringify(raw)} is not a finite weight`, at);
      }
      w = cell.value;
      if (w === 0 && !zeroEdge) {
        zeros++;
        continue;
      }
    }
    sources.push(u);
    targets.push(v);
    weights.push(w);
    lines.push(line);
  }
  if (zeros > 0) {
    warnings.push(
      `left out ${zeros} edge${zeros === 1 ? "" : "s"} of weight 0 (0 means "no edge" for similarity-like weights; set zeroIsEdge to keep them)`,
    );
  }

  if (nans > 0) warnings.push(`left out ${nans} edge${nans === 1 ? "" : "s"} whose weight is NaN`);
  if (names.length === 0) {
    // Like an empty matrix file: nothing to compute. With a node list, isolated nodes are a graph.
    throw new InputFileError(
      file,
      "empty-file",
      "the edge list has a header but no edges (and no node list): the graph would have no nodes",
      { line: widthLine },
    );
  }
  const directed = options.directed ?? false;
  try {
    const graph = fromEdgeList({
      n: names.length,
      sources,
      targets,
      weights,
      directed,
      labels: names,
      negative: negativePolicy(options),
      onWarning: (message) => warnings.push(message),
    });
    return { graph, warnings };
  } catch (error) {
    if (!(error instanceof GraphInputError) || error.location.edge === undefined) throw error;
    const e = error.location.edge;
    const at = { line: lines[e], column: columns.source + 1 };
    if (error.problem === "duplicate-edge") {
      const arrow = directed ? "→" : "–";
      const first = lines[error.location.firstEdge ?? e];
      throw new InputFileError(
        file,
        "duplicate-edge",
        `edge ${JSON.stringify(names[sources[e]])} ${arrow} ${JSON.stringify(names[targets[e]])} is listed twice: first on line ${first}, again on line ${lines[e]}`,
        at,
        { cause: error },
      );
    }
    const column = columns.weight === undefined ? undefined : columns.weight + 1;
    throw new InputFileError(
      file,
      "negative-weight",
      error.message,
      { line: lines[e], column },
      { cause: error },
    );
  }
}
