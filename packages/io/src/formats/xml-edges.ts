import { InputFileError } from "../input-file-error.js";

/** The DOM types the XML reader works on (@xmldom/xmldom's, which follow the W3C DOM). */
interface XmlElement {
  getAttribute(name: string): string | null;
  hasAttribute(name: string): boolean;
  getElementsByTagName(name: string): ArrayLike<XmlElement>;
  textContent: string | null;
  lineNumber?: number;
  columnNumber?: number;
}
interface XmlDocument {
  getElementsByTagName(name: string): ArrayLike<XmlElement>;
}

/** One edge as the file writes it, before any parser casts its weight. */
export interface XmlEdge {
  id: string | null;
  source: string;
  target: string;
  /** The weight attribute's text as written; undefined when the edge has none (it then weighs 1). */
  weight: string | undefined;
  line?: number;
  column?: number;
}

/**
 * The edges of a GraphML or GEXF document in file order, with the weight attribute's raw text, found the
 * way graphology's parsers find it (GraphML: `<data>` under a `<key for="edge">` named `attribute`, or under
 * a key id equal to it, else the key's `<default>`; GEXF: an `<attvalue>` of an edge attribute titled
 * `attribute`, else the `weight` XML attribute for "weight", else the attribute's `<default>`). Those
 * parsers cast with `+text`, which reads "0x10" as 16 and "" as 0; the raw text lets the weights follow the
 * number rules of the text readers. Nodes must be declared, each with an id of its own: an edge to an
 * undeclared node, an edge id used twice, a node without an id or declared twice and a graph without nodes
 * are errors naming the edge or node (or the file) at its line and column.
 */
export function readXmlEdges(
  document: XmlDocument,
  format: "graphml" | "gexf",
  attribute: string,
  file: string,
): XmlEdge[] {
  // Both formats require every node to have an id, unique in the document (GraphML Primer, "Nodes"; the
  // GEXF 1.3 schema): said here at the node's line instead of as graphology's message without one.
  const nodes = new Map<string, number | undefined>();
  const nodeElements = document.getElementsByTagName("node");
  for (let k = 0; k < nodeElements.length; k++) {
    const node = nodeElements[k];
    const id = node.getAttribute("id");
    const at = { line: node.lineNumber, column: node.columnNumber };
    if (id === null) throw new InputFileError(file, "bad-labels", "a <node> element without an id", at);
    if (nodes.has(id)) {
      throw new InputFileError(
        file,
        "bad-labels",
        `node ${JSON.stringify(id)} is declared twice (first on line ${nodes.get(id) ?? "?"})`,
        at,
      );
    }
    nodes.set(id, node.lineNumber);
  }
  if (nodes.size === 0) {
    throw new InputFileError(
      file,
      "empty-file",
      `the graph has no nodes: an empty graph, like an empty matrix file, has nothing to compute`,
    );
  }
  const weightOf =
    format === "graphml" ? graphmlWeight(document, attribute) : gexfWeight(document, attribute);
  const edges: XmlEdge[] = [];
  const firstUse = new Map<string, XmlEdge>();
  const elements = document.getElementsByTagName("edge");
  for (let k = 0; k < elements.length; k++) {
    const element = elements[k];
    const edge: XmlEdge = {
      id: element.getAttribute("id") || null,
      source: element.getAttribute("source") ?? "",
      target: element.getAttribute("target") ?? "",
      weight: weightOf(element),
      line: element.lineNumber,
      column: element.columnNumber,
    };
    const at = { line: edge.line, column: edge.column };
    for (const end of [edge.source, edge.target]) {
      if (!nodes.has(end)) {
        throw new InputFileError(
          file,
          "unknown-node",
          `${describeXmlEdge(edge)}: node ${JSON.stringify(end)} is not declared by a <node> element`,
          at,
        );
      }
    }
    if (edge.id !== null) {
      const first = firstUse.get(edge.id);
      if (first) {
        throw new InputFileError(
          file,
          "duplicate-edge",
          `${describeXmlEdge(edge)}: the edge id is used twice (first on line ${first.line ?? "?"})`,
          at,
        );
      }
      firstUse.set(edge.id, edge);
    }
    edges.push(edge);
  }
  return edges;
}

/** 'edge "e3" (a -- b)', as messages name an edge. */
export function describeXmlEdge(edge: Pick<XmlEdge, "id" | "source" | "target">, arrow = "--"): string {
  return `edge${edge.id === null ? "" : ` ${JSON.stringify(edge.id)}`} (${edge.source} ${arrow} ${edge.target})`;
}

function graphmlWeight(document: XmlDocument, attribute: string): (edge: XmlElement) => string | undefined {
  // graphology-graphml: keys default to for="node"; a <data> whose key is not an edge key is named by its key id.
  const names = new Map<string, string>();
  let fallback: string | undefined;
  const keys = document.getElementsByTagName("key");
  for (let k = 0; k < keys.length; k++) {
    const key = keys[k];
    if ((key.getAttribute("for") || "node") !== "edge") continue;
    const name = key.getAttribute("attr.name") ?? "";
    names.set(key.getAttribute("id") ?? "", name);
    const defaults = key.getElementsByTagName("default");
    if (name === attribute && defaults.length > 0) fallback = defaults[0].textContent ?? "";
  }
  return (edge) => {
    let text: string | undefined;
    const data = edge.getElementsByTagName("data");
    for (let k = 0; k < data.length; k++) {
      const key = data[k].getAttribute("key") ?? "";
      if ((names.get(key) ?? key) === attribute) text = data[k].textContent ?? "";
    }
    return text ?? fallback;
  };
}

function gexfWeight(document: XmlDocument, attribute: string): (edge: XmlElement) => string | undefined {
  const ids = new Set<string>();
  let fallback: string | undefined;
  const groups = document.getElementsByTagName("attributes");
  for (let g = 0; g < groups.length; g++) {
    if (groups[g].getAttribute("class") !== "edge") continue;
    const declared = groups[g].getElementsByTagName("attribute");
    for (let k = 0; k < declared.length; k++) {
      if (declared[k].getAttribute("title") !== attribute) continue;
      ids.add(declared[k].getAttribute("id") ?? "");
      const defaults = declared[k].getElementsByTagName("default");
      if (defaults.length > 0) fallback = defaults[0].textContent ?? "";
    }
  }
  return (edge) => {
    let text: string | undefined;
    if (attribute === "weight" && edge.hasAttribute("weight")) text = edge.getAttribute("weight") ?? "";
    const values = edge.getElementsByTagName("attvalue");
    for (let k = 0; k < values.length; k++) {
      const id = values[k].getAttribute("id") || values[k].getAttribute("for") || "";
      if (ids.has(id)) text = values[k].getAttribute("value") ?? "";
    }
    return text ?? fallback;
  };
}
