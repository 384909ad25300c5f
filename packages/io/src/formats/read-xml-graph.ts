import { fromGraphology, GraphInputError, type WeightedGraph } from "@cliquescape/core";
import { MultiGraph } from "graphology";
import gexf from "graphology-gexf";
import graphml from "graphology-graphml";
import { InputFileError } from "../input-file-error.js";
import type { GraphsReadResult } from "../npy-graphs.js";
import { decodeText, readFileBytes } from "../read-file-bytes.js";
import { DEFAULT_MAX_TEXT_BYTES, type GraphReadOptions, zeroIsEdge } from "../read-options.js";
import { checkXml } from "./xml-document.js";

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
 * options, and NaN is an error unless `nanIsNoEdge`.
 */
export function readXmlGraphFile(
  path: string,
  format: XmlGraphFormat,
  options: XmlGraphReadOptions = {},
): GraphsReadResult {
  const text = decodeText(readFileBytes(path, options.maxBytes ?? DEFAULT_MAX_TEXT_BYTES), path);
  const { root, counts } = checkXml(text, path, ["graph"]);
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
      negative: options.negative,
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

// Zero and NaN weights mean what they mean in a matrix: no edge (unless the options say otherwise).
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
      if (!options.nanIsNoEdge) {
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
