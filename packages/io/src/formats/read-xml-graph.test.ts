// Hand-written GraphML (GraphML Primer, graphml.graphdrawing.org) and GEXF 1.3 documents: the rules this
// package adds on top of graphology's parsers.
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { readXmlGraphFile } from "./read-xml-graph.js";

const dir = mkdtempSync(join(tmpdir(), "cliquescape-xml-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const put = (name: string, text: string) => {
  const path = join(dir, name);
  writeFileSync(path, text);
  return path;
};

const graphml = (edges: string, edgedefault = "undirected") => `<?xml version="1.0" encoding="UTF-8"?>
<graphml xmlns="http://graphml.graphdrawing.org/xmlns">
  <key id="w" for="edge" attr.name="weight" attr.type="double"/>
  <graph id="G" edgedefault="${edgedefault}">
    <node id="a"/><node id="b"/><node id="c"/>
${edges}
  </graph>
</graphml>
`;
const gexf = (edges: string) => `<?xml version="1.0" encoding="UTF-8"?>
<gexf xmlns="http://gexf.net/1.3" version="1.3">
  <graph defaultedgetype="directed">
    <nodes><node id="a" label="a"/><node id="b" label="b"/><node id="c" label="c"/></nodes>
    <edges>
${edges}
    </edges>
  </graph>
</gexf>
`;

describe("readXmlGraphFile", () => {
  it("drops weight-0 edges under similarity semantics and keeps them for distances", () => {
    const path = put(
      "zero.graphml",
      graphml(`<edge source="a" target="b"><data key="w">0</data></edge>
<edge source="b" target="c"><data key="w">2.5</data></edge>
<edge source="a" target="c"/>`),
    );
    const similarity = readXmlGraphFile(path, "graphml");
    expect([...similarity.graphs[0].weights]).toEqual([1, 2.5, 1, 2.5]);
    expect(similarity.warnings).toEqual(["1 edge of weight 0 or NaN read as no edge"]);
    const distance = readXmlGraphFile(path, "graphml", { semantics: "distance" });
    expect([...distance.graphs[0].weights].sort()).toEqual([0, 0, 1, 1, 2.5, 2.5]);
  });

  it("names the edge whose weight is not a number, or that is given twice", () => {
    const nan = put("nan.gexf", gexf(`<edge id="e0" source="a" target="b" weight="heavy"/>`));
    expect(() => readXmlGraphFile(nan, "gexf")).toThrow(
      `${nan}: edge "e0" (a -> b): weight NaN is not a number (set nanIsNoEdge to read NaN as "no edge")`,
    );
    expect(readXmlGraphFile(nan, "gexf", { nanIsNoEdge: true }).graphs[0].targets.length).toBe(0);
    const twice = put(
      "twice.graphml",
      graphml(
        `<edge id="e1" source="a" target="b"/><edge id="e2" source="c" target="a"/><edge id="e3" source="b" target="a"/>`,
      ),
    );
    expect(() => readXmlGraphFile(twice, "graphml")).toThrow(
      `${twice}: edge "e3" (b -- a): edge 0-1 is given more than once`,
    );
  });

  it("says where XML is malformed, and refuses the wrong kind of document", () => {
    const broken = put("broken.graphml", graphml(`<edge source="a" target="b">`));
    expect(() => readXmlGraphFile(broken, "graphml")).toThrow(
      /broken\.graphml:[67]:\d+: not well-formed XML: Opening and ending tag mismatch: "edge" != "graph"$/,
    );
    const other = put("other.graphml", gexf(""));
    expect(() => readXmlGraphFile(other, "graphml")).toThrow(
      "the root element is <gexf>, not <graphml>: not a GraphML file",
    );
    const unknownNode = put("ghost.graphml", graphml(`<edge source="a" target="z"/>`));
    // graphology's message names an option of its parser; ours names the edge, the node and the line.
    expect(() => readXmlGraphFile(unknownNode, "graphml")).toThrow(
      /ghost\.graphml:\d+:\d+: edge names target node "z", which no <node> element declares$/,
    );
  });

  it("keeps the file's direction and warns when the options ask for the other", () => {
    const path = put("dir.gexf", gexf(`<edge id="0" source="a" target="b" weight="0.5"/>`));
    const { graphs, warnings } = readXmlGraphFile(path, "gexf", { directed: false });
    expect(graphs[0].directed).toBe(true);
    expect(warnings).toEqual(["the file declares directed edges; read them as such, not as undirected"]);
  });
});
