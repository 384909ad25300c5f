import { fromGraphology, GraphInputError, type WeightedGraph } from "@cliquescape/core";
import { MultiGraph } from "graphology";
import gexf from "graphology-gexf";
import graphml from "graphology-graphml";
import { InputFileError } from "../input-file-error.js";
import type { GraphsReadResult } from "../npy-graphs.js";
import { classifyCell } from "../parse-number.js";
import { decodeText, readFileBytes } from "../read-file-bytes.js";
import {
  DEFAULT_MAX_TEXT_BYTES,
  type GraphReadOptions,
  nanIsNoEdge,
  negativePolicy,
  zeroIsEdge,
} from "../read-options.js";
import { checkXml } from "./xml-document.js";
import { describeXmlEdge, readXmlEdges, type XmlEdge } from "./xml-edges.js";

type ParsedGraph = ReturnType<typeof graphml.parse>;

export type XmlGraphFormat = "graphml" | "gexf";

export interface XmlGraphReadOptions extends GraphReadOptions {
  /** Edge attribute holding the weight. Default "weight"; edges without it weigh 1. */
  weightAttribute?: string;
}

const ROOTS: Record<XmlGraphFormat, string> = { graphml: "graphml", gexf: "gexf" };

/**
 * Reads a GraphML or GEXF file with graphology's parsers, then builds our graph with fromGraphology: node
 * ids become labels in file order, weights come from `weightAttribute`. Edges are directed or undirected
 * as the file declares. Weights follow the number rules of the text readers (read from the text as written,
 * not as the parsers cast it); as for matrices, a weight of 0 is no edge unless zeros are edges under the
 * options, and NaN is no edge unless `nanIsNoEdge` is false.
 */
export function readXmlGraphFile(
  path: string,
  format: XmlGraphFormat,
  options: XmlGraphReadOptions = {},
): GraphsReadResult {
  const text = decodeText(readFileBytes(path, options.maxBytes ?? DEFAULT_MAX_TEXT_BYTES), path);
  const { root, counts, document } = checkXml(text, path, ["graph"]);
  if (root !== ROOTS[format]) {
    throw new InputFileError(
      path,
      "unknown-format",
      `the root element is <${root}>, not <${ROOTS[format]}>: not a ${format === "gexf" ? "GEXF" : "GraphML"} file`,
    );
  }
  if (counts.graph !== 1) {
    throw new InputFileError(
      path,
      "bad-header",
      `the file holds ${counts.graph} <graph> elements; exactly one is read`,
    );
  }
  const attribute = options.weightAttribute ?? "weight";
  // Raw edges first: undeclared nodes, reused edge ids and an empty graph are refused with the edge's place.
  const written = readXmlEdges(document, format, attribute, path);
  let parsed: ParsedGraph;
  try {
    // A multigraph keeps repeated edges, so that they are reported as duplicates rather than merged.
    parsed = format === "graphml" ? graphml.parse(MultiGraph, text) : gexf.parse(MultiGraph, text);
  } catch (error) {
    const message = (error as Error).message.replace(/^graphology-\w+\/parser: /, "");
    throw new InputFileError(
      path,
      "bad-header",
      `cannot read the ${format === "gexf" ? "GEXF" : "GraphML"} graph: ${message}`,
    );
  }
  const edges = parsed.edges();
  if (edges.length !== written.length) {
    throw new InputFileError(
      path,
      "bad-header",
      `the file has ${written.length} <edge> elements but graphology's parser made ${edges.length} edges of them`,
    );
  }
  const warnings: string[] = [];
  if (options.directed !== undefined && options.directed !== (parsed.type === "directed")) {
    warnings.push(
      `the file declares ${parsed.type} edges; read them as such, not as ${options.directed ? "directed" : "undirected"}`,
    );
  }
  const dropped = setWeights(parsed, edges, written, attribute, options, path);
  if (dropped > 0)
    warnings.push(`${dropped} edge${dropped === 1 ? "" : "s"} of weight 0 or NaN read as no edge`);
  const kept = parsed.edges();
  let graph: WeightedGraph;
  try {
    graph = fromGraphology(parsed, {
      weightAttribute: attribute,
      negative: negativePolicy(options),
      onWarning: (message) => warnings.push(message),
    });
  } catch (error) {
    if (!(error instanceof GraphInputError)) throw error;
    const e = error.location.edge;
    const which = e === undefined ? "" : `edge ${describeEdge(parsed, kept[e])}: `;
    throw new InputFileError(
      path,
      error.problem === "negative-weight"
        ? "negative-weight"
        : error.problem === "duplicate-edge"
          ? "duplicate-edge"
          : "not-finite",
      `${which}${error.message}`,
      e === undefined ? {} : positionOf(written[edges.indexOf(kept[e])]),
    );
  }
  return { graphs: [graph], warnings };
}

/**
 * Gives every edge the weight its raw text says, by the number rules of the text readers (decimal numbers
 * only: no hexadecimal, no empty weight, no infinity), and drops the edges that are no edge: weight 0
 * (unless zeros are edges under the options) and NaN (unless nanIsNoEdge is false).
 */
function setWeights(
  graph: ParsedGraph,
  edges: readonly string[],
  written: readonly XmlEdge[],
  attribute: string,
  options: GraphReadOptions,
  path: string,
): number {
  const keepZero = zeroIsEdge(options);
  let dropped = 0;
  edges.forEach((edge, k) => {
    const raw = written[k].weight;
    if (raw === undefined) return;
    const text = raw.trim();
    const cell = classifyCell(text);
    const fail = (problem: "not-a-number" | "not-finite", reason: string): never => {
      throw new InputFileError(
        path,
        problem,
        `${describeXmlEdge(written[k], graph.isDirected(edge) ? "->" : "--")}: ${reason}`,
        positionOf(written[k]),
      );
    };
    if (cell.kind === "empty") fail("not-a-number", `weight ${attribute} is empty`);
    if (cell.kind === "text") fail("not-a-number", `weight ${JSON.stringify(raw)} is not a number`);
    if (cell.kind === "not-finite") {
      if (!(Number.isNaN(cell.value) && nanIsNoEdge(options))) {
        fail(
          "not-finite",
          `weight ${JSON.stringify(raw)} is not a finite weight${Number.isNaN(cell.value) ? ' (set nanIsNoEdge to read NaN as "no edge")' : ""}`,
        );
      }
      graph.dropEdge(edge);
      dropped++;
      return;
    }
    const w = (cell as { value: number }).value;
    if (w === 0 && !keepZero) {
      graph.dropEdge(edge);
      dropped++;
      return;
    }
    graph.setEdgeAttribute(edge, attribute, w);
  });
  return dropped;
}

function positionOf(edge: XmlEdge): { line?: number; column?: number } {
  return edge.line === undefined ? {} : { line: edge.line, column: edge.column };
}

function describeEdge(graph: ParsedGraph, edge: string): string {
  return `"${edge}" (${graph.source(edge)} ${graph.isDirected(edge) ? "->" : "--"} ${graph.target(edge)})`;
}
