import { fromGraphology, GraphInputError, type WeightedGraph } from "@cliquescape/core";
import { MultiGraph } from "graphology";
import gexf from "graphology-gexf";
import graphml from "graphology-graphml";
import { InputFileError } from "../input-file-error.js";
import type { GraphsReadResult } from "../npy-graphs.js";
import { decodeText, readFileBytes } from "../read-file-bytes.js";
import {
  DEFAULT_MAX_TEXT_BYTES,
  type GraphReadOptions,
  negativePolicy,
  zeroIsEdge,
} from "../read-options.js";
import { checkXml, type XmlDocument } from "./xml-document.js";

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
 * as the file declares. As for matrices, a weight of 0 is no edge unless zeros are edges under the
 * options; NaN (which is also what graphology makes of unreadable text) is refused unless `nanIsNoEdge`.
 */
export function readXmlGraphFile(
  path: string,
  format: XmlGraphFormat,
  options: XmlGraphReadOptions = {},
): GraphsReadResult {
  const text = decodeText(readFileBytes(path, options.maxBytes ?? DEFAULT_MAX_TEXT_BYTES), path);
  const { document, root, counts } = checkXml(text, path, ["graph"]);
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
  let parsed: ParsedGraph;
  try {
    // A multigraph keeps repeated edges, so that they are reported as duplicates rather than merged.
    parsed = format === "graphml" ? graphml.parse(MultiGraph, text) : gexf.parse(MultiGraph, text);
  } catch (error) {
    const ghost = edgeToUndeclaredNode(document);
    if (ghost) throw new InputFileError(path, "unknown-node", ghost.reason, ghost.position);
    const message = (error as Error).message.replace(/^graphology-\w+\/parser: /, "");
    throw new InputFileError(
      path,
      "bad-header",
      `cannot read the ${format === "gexf" ? "GEXF" : "GraphML"} graph: ${message}`,
    );
  }
  const warnings: string[] = [];
  const attribute = options.weightAttribute ?? "weight";
  if (options.directed !== undefined && options.directed !== (parsed.type === "directed")) {
    warnings.push(
      `the file declares ${parsed.type} edges; read them as such, not as ${options.directed ? "directed" : "undirected"}`,
    );
  }
  const dropped = dropNonEdges(parsed, attribute, options, path);
  if (dropped > 0)
    warnings.push(`${dropped} edge${dropped === 1 ? "" : "s"} of weight 0 or NaN read as no edge`);
  const edges = parsed.edges();
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
    const which = e === undefined ? "" : `edge ${describeEdge(parsed, edges[e])}: `;
    throw new InputFileError(
      path,
      error.problem === "negative-weight"
        ? "negative-weight"
        : error.problem === "duplicate-edge"
          ? "duplicate-edge"
          : "not-finite",
      `${which}${error.message}`,
    );
  }
  return { graphs: [graph], warnings };
}

/**
 * Zero weights mean what they mean in a matrix: no edge unless zeros are edges under the options. NaN is
 * refused unless `nanIsNoEdge` is set explicitly: graphology's parsers turn any unreadable weight ("heavy")
 * into NaN, so the default of numeric files (NaN is no edge) would hide typing mistakes here.
 */
function dropNonEdges(
  graph: ParsedGraph,
  attribute: string,
  options: GraphReadOptions,
  path: string,
): number {
  const keepZero = zeroIsEdge(options);
  const drop: string[] = [];
  graph.forEachEdge((edge, attributes) => {
    const raw = attributes[attribute];
    if (raw === undefined) return;
    const w = Number(raw);
    if (w === 0 && !keepZero) drop.push(edge);
    else if (Number.isNaN(w)) {
      if (options.nanIsNoEdge !== true) {
        throw new InputFileError(
          path,
          "not-a-number",
          `edge ${describeEdge(graph, edge)}: weight ${typeof raw === "string" ? JSON.stringify(raw) : String(raw)} is not a number (set nanIsNoEdge to read NaN as "no edge")`,
        );
      }
      drop.push(edge);
    }
  });
  for (const edge of drop) graph.dropEdge(edge);
  return drop.length;
}

function describeEdge(graph: ParsedGraph, edge: string): string {
  return `"${edge}" (${graph.source(edge)} ${graph.isDirected(edge) ? "->" : "--"} ${graph.target(edge)})`;
}

/**
 * The first <edge> naming a node that no <node> declares, which graphology's parsers refuse without saying
 * which (their message names an option of theirs instead); null when every edge is fine.
 */
function edgeToUndeclaredNode(
  document: XmlDocument,
): { reason: string; position: { line?: number; column?: number } } | null {
  const declared = new Set<string>();
  const nodes = document.getElementsByTagName("node");
  for (let i = 0; i < nodes.length; i++) declared.add(nodes[i].getAttribute("id") ?? "");
  const edges = document.getElementsByTagName("edge");
  for (let i = 0; i < edges.length; i++) {
    const edge = edges[i];
    for (const end of ["source", "target"]) {
      const node = edge.getAttribute(end) ?? "";
      if (declared.has(node)) continue;
      const at = edge as unknown as { lineNumber?: number; columnNumber?: number };
      const id = edge.getAttribute("id");
      return {
        reason: `edge ${id === null ? "" : `"${id}" `}names ${end} node "${node}", which no <node> element declares`,
        position: at.lineNumber === undefined ? {} : { line: at.lineNumber, column: at.columnNumber },
      };
    }
  }
  return null;
}
