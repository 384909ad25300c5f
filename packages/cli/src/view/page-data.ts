import type { GraphJson } from "@cliquescape/io";

/** Element id and attribute the page reads embedded data from (packages/viewer/src/session/page-session.ts). */
const SESSION_ELEMENT_ID = "cliquescape-session";
const GRAPH_ATTRIBUTE = "data-graph-id";
/** Where the page's HTML leaves room for embedded data. */
const DATA_PLACEHOLDER = "<!--cliquescape:data-->";

/** JSON that is safe inside a <script> element: no "</script>", no "<!--". */
export function scriptJson(value: unknown): string {
  return JSON.stringify(value).replace(/</g, "\\u003c");
}

const attribute = (text: string) =>
  text.replace(/&/g, "&amp;").replace(/"/g, "&quot;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

/**
 * The page with a session embedded, and optionally the graphs of a run, each in its own script element so
 * the page parses a graph only when it is opened.
 */
export function embedData(
  html: string,
  session: unknown,
  graphs: Iterable<readonly [string, GraphJson]> = [],
): string {
  if (!html.includes(DATA_PLACEHOLDER)) throw new Error("the viewer page has no place for data; rebuild it");
  const parts = [
    `<script type="application/json" id="${SESSION_ELEMENT_ID}">${scriptJson(session)}</script>`,
  ];
  for (const [id, graph] of graphs)
    parts.push(
      `<script type="application/json" ${GRAPH_ATTRIBUTE}="${attribute(id)}">${scriptJson(graph)}</script>`,
    );
  // A function as replacement: "$" in the data must not be read as a replacement pattern.
  return html.replace(DATA_PLACEHOLDER, () => parts.join("\n"));
}
