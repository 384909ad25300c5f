import { nodeLabel, type WeightedGraph } from "@cliquescape/core";
import { InputFileError } from "../input-file-error.js";
import { decodeText, readFileBytes } from "../read-file-bytes.js";
import { DEFAULT_MAX_TEXT_BYTES } from "../read-options.js";
import { detectDelimiter, textRows } from "../text-rows.js";

/** Node positions: `values[v * dims + d]` is coordinate d of node v. */
export interface NodeCoordinates {
  dims: number;
  values: Float64Array;
}

/**
 * Reads a node-coordinates CSV with header `node,x,y` or `node,x,y,z` and matches its rows to the graph's
 * nodes: `node` is a node label, or, for a graph without labels, a 0-based node index. Every node needs
 * exactly one row; errors name the line and column.
 */
export function readCoordinates(path: string, graph: WeightedGraph): NodeCoordinates {
  const text = decodeText(readFileBytes(path, DEFAULT_MAX_TEXT_BYTES), path);
  const delimiter = detectDelimiter(text);
  const rows = textRows(text, delimiter, path);
  const first = rows.next();
  if (first.done) throw new InputFileError(path, "empty-file", "the coordinates file is empty");
  const header = first.value.cells.map((c) => c.toLowerCase());
  const dims = header.length - 1;
  const expected = ["node", "x", "y", "z"].slice(0, header.length);
  if ((dims !== 2 && dims !== 3) || header.some((name, k) => name !== expected[k])) {
    throw new InputFileError(
      path,
      "bad-header",
      `the header is ${first.value.cells.join(",")}; expected node,x,y or node,x,y,z`,
      {
        line: first.value.line,
      },
    );
  }
  const index = new Map<string, number>();
  for (let v = 0; v < graph.n; v++) index.set(nodeLabel(graph, v), v);
  const values = new Float64Array(graph.n * dims).fill(Number.NaN);
  const lineOf = new Int32Array(graph.n);
  for (const row of rows) {
    if (row.cells.length !== header.length) {
      throw new InputFileError(
        path,
        "ragged-row",
        `the row has ${row.cells.length} cells, the header ${header.length}`,
        {
          line: row.line,
          column: Math.min(row.cells.length, header.length) + 1,
        },
      );
    }
    const v = index.get(row.cells[0]);
    if (v === undefined) {
      const what = graph.labels ? "no node has this label" : `nodes are numbered 0 … ${graph.n - 1}`;
      throw new InputFileError(path, "unknown-node", `unknown node "${row.cells[0]}": ${what}`, {
        line: row.line,
        column: 1,
      });
    }
    if (lineOf[v] !== 0) {
      throw new InputFileError(
        path,
        "bad-labels",
        `node "${row.cells[0]}" already has coordinates on line ${lineOf[v]}`,
        {
          line: row.line,
          column: 1,
        },
      );
    }
    lineOf[v] = row.line;
    for (let d = 0; d < dims; d++) {
      const cell = row.cells[d + 1];
      const x = cell === "" ? Number.NaN : Number(cell);
      if (!Number.isFinite(x)) {
        throw new InputFileError(
          path,
          "not-a-number",
          `coordinate ${JSON.stringify(cell)} is not a finite number`,
          {
            line: row.line,
            column: d + 2,
          },
        );
      }
      values[v * dims + d] = x;
    }
  }
  const missing: string[] = [];
  for (let v = 0; v < graph.n; v++) if (lineOf[v] === 0) missing.push(nodeLabel(graph, v));
  if (missing.length > 0) {
    const shown = missing.slice(0, 5).join(", ");
    throw new InputFileError(
      path,
      "unknown-node",
      `${missing.length} of ${graph.n} nodes have no coordinates (${shown}${missing.length > 5 ? ", …" : ""})`,
    );
  }
  return { dims, values };
}
