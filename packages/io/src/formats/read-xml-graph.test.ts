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
      `${nan}:6:1: edge "e0" (a -> b): weight "heavy" is not a number`,
    );
    const nanWeight = put("nan-weight.gexf", gexf(`<edge id="e0" source="a" target="b" weight="NaN"/>`));
    // NaN written as such is no edge, as in the text readers, unless nanIsNoEdge is false.
    expect(readXmlGraphFile(nanWeight, "gexf").graphs[0].targets.length).toBe(0);
    expect(() => readXmlGraphFile(nanWeight, "gexf", { nanIsNoEdge: false })).toThrow(
      `${nanWeight}:6:1: edge "e0" (a -> b): weight "NaN" is not a finite weight (set nanIsNoEdge to read NaN as "no edge")`,
    );
    const twice = put(
      "twice.graphml",
      graphml(
        `<edge id="e1" source="a" target="b"/><edge id="e2" source="c" target="a"/><edge id="e3" source="b" target="a"/>`,
      ),
    );
    expect(() => readXmlGraphFile(twice, "graphml")).toThrow(
      `${twice}:6:75: edge "e3" (b -- a): edge 0-1 is given more than once`,
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
    const unknownNode = put("ghost.graphml", graphml(`<edge id="e7" source="a" target="z"/>`));
    expect(() => readXmlGraphFile(unknownNode, "graphml")).toThrow(
      `${unknownNode}:6:1: edge "e7" (a -- z): node "z" is not declared by a <node> element`,
    );
  });

  it("keeps the file's direction and warns when the options ask for the other", () => {
    const path = put("dir.gexf", gexf(`<edge id="0" source="a" target="b" weight="0.5"/>`));
    const { graphs, warnings } = readXmlGraphFile(path, "gexf", { directed: false });
    expect(graphs[0].directed).toBe(true);
    expect(warnings).toEqual(["the file declares directed edges; read them as such, not as undirected"]);
  });
});

// The corpus of weights and edges graphology's parsers would read silently (they cast with +text: "0x10" is
// 16, "" is 0, "INF" is NaN), each with the message and the edge's line and column. The number rules are
// those of the text readers (docs/formats.md).
describe("GraphML and GEXF weights follow the text readers' number rules", () => {
  const one = (weight: string) => `<edge id="e1" source="a" target="b"><data key="w">${weight}</data></edge>`;
  it.each([
    ["hexadecimal", one("0x10"), "not-a-number", 'edge "e1" (a -- b): weight "0x10" is not a number'],
    ["empty", one(""), "not-a-number", 'edge "e1" (a -- b): weight weight is empty'],
    ["blank", one("  "), "not-a-number", 'edge "e1" (a -- b): weight weight is empty'],
    ["text", one("abc"), "not-a-number", 'edge "e1" (a -- b): weight "abc" is not a number'],
    ["trailing text", one("1.5kg"), "not-a-number", 'edge "e1" (a -- b): weight "1.5kg" is not a number'],
    ["decimal comma", one("0,5"), "not-a-number", 'edge "e1" (a -- b): weight "0,5" is not a number'],
    ["infinity", one("INF"), "not-finite", 'edge "e1" (a -- b): weight "INF" is not a finite weight'],
    [
      "-Infinity",
      one("-Infinity"),
      "not-finite",
      'edge "e1" (a -- b): weight "-Infinity" is not a finite weight',
    ],
  ])("GraphML, %s weight", (_, edges, problem, reason) => {
    const path = put(`w-${problem}-${reason.length}.graphml`, graphml(edges));
    try {
      readXmlGraphFile(path, "graphml");
      expect.unreachable();
    } catch (error) {
      expect((error as { problem: string }).problem).toBe(problem);
      expect((error as Error).message).toBe(`${path}:6:1: ${reason}`);
    }
  });

  it.each([
    ["hexadecimal", 'weight="0x10"', 'weight "0x10" is not a number'],
    ["empty", 'weight=""', "weight weight is empty"],
    ["text", 'weight="abc"', 'weight "abc" is not a number'],
    ["infinity", 'weight="INF"', 'weight "INF" is not a finite weight'],
  ])("GEXF, %s weight", (_, weight, reason) => {
    const path = put(`g-${reason.length}.gexf`, gexf(`<edge id="e0" source="a" target="b" ${weight}/>`));
    expect(() => readXmlGraphFile(path, "gexf")).toThrow(`${path}:6:1: edge "e0" (a -> b): ${reason}`);
  });

  it("reads decimal weights written with spaces, exponents and signs as the text readers do", () => {
    const path = put(
      "decimals.graphml",
      graphml(`${one(" 2.5e-1 ")}<edge id="e2" source="b" target="c"><data key="w">+.5</data></edge>`),
    );
    expect([...readXmlGraphFile(path, "graphml").graphs[0].weights]).toEqual([0.25, 0.25, 0.5, 0.5]);
  });

  it("refuses an edge to an undeclared node and an edge id used twice, naming the edge", () => {
    const ghost = put("ghost.gexf", gexf(`<edge id="x" source="q" target="a" weight="1"/>`));
    expect(() => readXmlGraphFile(ghost, "gexf")).toThrow(
      `${ghost}:6:1: edge "x" (q -- a): node "q" is not declared by a <node> element`,
    );
    const twice = put(
      "same-id.graphml",
      graphml(`<edge id="e1" source="a" target="b"/>\n<edge id="e1" source="b" target="c"/>`),
    );
    expect(() => readXmlGraphFile(twice, "graphml")).toThrow(
      `${twice}:7:1: edge "e1" (b -- c): the edge id is used twice (first on line 6)`,
    );
  });

  it("refuses a graph without nodes like an empty matrix file", () => {
    const empty = put(
      "empty.graphml",
      `<?xml version="1.0"?><graphml xmlns="http://graphml.graphdrawing.org/xmlns"><graph edgedefault="undirected"/></graphml>`,
    );
    try {
      readXmlGraphFile(empty, "graphml");
      expect.unreachable();
    } catch (error) {
      expect((error as { problem: string }).problem).toBe("empty-file");
      expect((error as Error).message).toBe(
        `${empty}: the graph has no nodes: an empty graph, like an empty matrix file, has nothing to compute`,
      );
    }
  });
});
