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

  it("refuses a node without an id, or an id declared twice, at the node's line", () => {
    // Both formats require an id on every node, unique in the document (GraphML Primer, "Nodes"; GEXF 1.3
    // schema). Unchecked, a node without one became a node named "" and a second one a parser error
    // without a line.
    const noId = put(
      "no-id.graphml",
      graphml(`<edge source="a" target="b"/>`).replace(`<node id="c"/>`, `\n<node/>`),
    );
    expect(() => readXmlGraphFile(noId, "graphml")).toThrow(`${noId}:6:1: a <node> element without an id`);
    const twice = put(
      "node-twice.gexf",
      gexf(`<edge source="a" target="b"/>`).replace(`<node id="c" label="c"/>`, `\n<node id="a"/>`),
    );
    expect(() => readXmlGraphFile(twice, "gexf")).toThrow(
      `${twice}:5:1: node "a" is declared twice (first on line 4)`,
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

// Issue 14, the survivors of the io-fmt-xml mutation run: GEXF 1.3 edge attributes (<attributes
// class="edge">, <attvalue for=…> or the older id=…, <default>) and GraphML keys (<key for="edge">, <default>),
// each written so that a weight found in the wrong place, or left to graphology's parser (which casts with
// +text), changes what is read; and the messages of the reader's own checks. Documents written by hand from
// the GEXF 1.3 schema (gexf.net) and the GraphML Primer.
describe("weights from GEXF attributes and GraphML keys", () => {
  const gexfOf = (attributes: string, edges: string) => `<?xml version="1.0" encoding="UTF-8"?>
<gexf xmlns="http://gexf.net/1.3" version="1.3">
  <graph defaultedgetype="directed">
    ${attributes}
    <nodes><node id="a"/><node id="b"/><node id="c"/></nodes>
    <edges>
${edges}
    </edges>
  </graph>
</gexf>
`;
  const strength = (fallback: string) =>
    `<attributes class="edge"><attribute id="s" title="strength" type="double"><default>${fallback}</default></attribute></attributes>`;
  const weights = (path: string, format: "gexf" | "graphml", weightAttribute?: string) => {
    const graph = readXmlGraphFile(path, format, weightAttribute ? { weightAttribute } : {}).graphs[0];
    const out: string[] = [];
    for (let u = 0; u < graph.n; u++) {
      for (let e = graph.offsets[u]; e < graph.offsets[u + 1]; e++)
        out.push(`${u}>${graph.targets[e]}:${graph.weights[e]}`);
    }
    return out;
  };

  it("GEXF: an attvalue's text (for= or id=) and the attribute's default follow the number rules", () => {
    for (const [name, attr] of [
      ["for", "for"],
      ["id", "id"],
    ]) {
      const path = put(
        `att-${name}.gexf`,
        gexfOf(
          strength("1"),
          `<edge id="e0" source="a" target="b"><attvalues><attvalue ${attr}="s" value="0x10"/></attvalues></edge>`,
        ),
      );
      expect(() => readXmlGraphFile(path, "gexf", { weightAttribute: "strength" })).toThrow(
        'edge "e0" (a -> b): weight "0x10" is not a number',
      );
    }
    // An attvalue without a value= is an empty weight, not a missing one.
    const blank = put(
      "att-blank.gexf",
      gexfOf(
        strength("1"),
        `<edge id="e2" source="a" target="c"><attvalues><attvalue for="s"/></attvalues></edge>`,
      ),
    );
    expect(() => readXmlGraphFile(blank, "gexf", { weightAttribute: "strength" })).toThrow(
      'edge "e2" (a -> c): weight strength is empty',
    );
    const fallback = put(
      "att-default.gexf",
      gexfOf(strength("0x2"), `<edge id="e1" source="b" target="c"/>`),
    );
    expect(() => readXmlGraphFile(fallback, "gexf", { weightAttribute: "strength" })).toThrow(
      'edge "e1" (b -> c): weight "0x2" is not a number',
    );
  });

  it("GEXF: only edge attributes count, and the weight= XML attribute only for the attribute weight", () => {
    const nodeStrength = `<attributes class="node"><attribute id="ns" title="strength" type="double"><default>0x3</default></attribute></attributes>`;
    const path = put(
      "att-classes.gexf",
      gexfOf(
        `${strength("1.5")}${nodeStrength}`,
        `<edge id="e0" source="a" target="b" weight="7"/>
<edge id="e1" source="b" target="c" weight="8"><attvalues><attvalue for="s" value="2.5"/></attvalues></edge>`,
      ),
    );
    expect(weights(path, "gexf", "strength")).toEqual(["0>1:1.5", "1>2:2.5"]);
    expect(weights(path, "gexf")).toEqual(["0>1:7", "1>2:8"]);
  });

  const graphmlOf = (keys: string, edges: string) => `<?xml version="1.0" encoding="UTF-8"?>
<graphml xmlns="http://graphml.graphdrawing.org/xmlns">
  ${keys}
  <graph id="G" edgedefault="undirected">
    <node id="a"/><node id="b"/><node id="c"/>
${edges}
  </graph>
</graphml>
`;

  it("GraphML: the weight key's default follows the number rules", () => {
    const path = put(
      "key-default.graphml",
      graphmlOf(
        `<key id="w" for="edge" attr.name="weight"><default>0x2</default></key>`,
        `<edge id="e1" source="a" target="b"/>`,
      ),
    );
    expect(() => readXmlGraphFile(path, "graphml")).toThrow(
      'edge "e1" (a -- b): weight "0x2" is not a number',
    );
  });

  it("GraphML: only the edge key named by the attribute gives the default", () => {
    const keys = `<key id="w" for="edge" attr.name="weight"><default>2</default></key>
  <key id="c" for="edge" attr.name="color"><default>red</default></key>
  <key id="nw" for="node" attr.name="weight"><default>0x5</default></key>`;
    const path = put(
      "key-classes.graphml",
      graphmlOf(
        keys,
        `<edge id="e1" source="a" target="b"/><edge id="e2" source="b" target="c"><data key="w">3</data></edge>`,
      ),
    );
    expect(weights(path, "graphml")).toEqual(["0>1:2", "1>0:2", "1>2:3", "2>1:3"]);
  });
});

describe("the XML reader's messages", () => {
  it("an edge without an id, source or target is named as written", () => {
    const noId = put("no-id.graphml", graphml(`<edge source="a" target="b"><data key="w">abc</data></edge>`));
    expect(() => readXmlGraphFile(noId, "graphml")).toThrow(
      `${noId}:6:1: edge (a -- b): weight "abc" is not a number`,
    );
    const noSource = put("no-source.graphml", graphml(`<edge id="e1" target="b"/>`));
    expect(() => readXmlGraphFile(noSource, "graphml")).toThrow(
      `${noSource}:6:1: edge "e1" ( -- b): node "" is not declared by a <node> element`,
    );
    const noTarget = put("no-target.graphml", graphml(`<edge id="e1" source="a"/>`));
    expect(() => readXmlGraphFile(noTarget, "graphml")).toThrow(
      `${noTarget}:6:1: edge "e1" (a -- ): node "" is not declared by a <node> element`,
    );
  });

  it("a GraphML file read as GEXF, and a file of two graphs, are refused", () => {
    const path = put("as-gexf.gexf", graphml(""));
    expect(() => readXmlGraphFile(path, "gexf")).toThrow(
      `${path}: the root element is <graphml>, not <gexf>: not a GEXF file`,
    );
    const two = put(
      "two.graphml",
      `<graphml xmlns="http://graphml.graphdrawing.org/xmlns"><graph edgedefault="undirected"><node id="a"/></graph><graph edgedefault="undirected"><node id="b"/></graph></graphml>`,
    );
    const e = (() => {
      try {
        readXmlGraphFile(two, "graphml");
      } catch (error) {
        return error as { problem: string; message: string };
      }
      throw new Error("no error");
    })();
    expect(e.problem).toBe("bad-header");
    expect(e.message).toBe(`${two}: the file holds 2 <graph> elements; exactly one is read`);
  });

  it("warns only when the options ask for the other direction than the file's", () => {
    const und = put("und.graphml", graphml(`<edge source="a" target="b"/>`));
    expect(readXmlGraphFile(und, "graphml", { directed: true }).warnings).toEqual([
      "the file declares undirected edges; read them as such, not as directed",
    ]);
    expect(readXmlGraphFile(und, "graphml", { directed: false }).warnings).toEqual([]);
    const dir = put("dir2.gexf", gexf(`<edge id="0" source="a" target="b" weight="0.5"/>`));
    expect(readXmlGraphFile(dir, "gexf", { directed: true }).warnings).toEqual([]);
  });

  it("counts the edges dropped as weight 0 or NaN", () => {
    const path = put(
      "two-zeros.gexf",
      gexf(
        `<edge id="0" source="a" target="b" weight="0"/><edge id="1" source="b" target="c" weight="NaN"/>`,
      ),
    );
    expect(readXmlGraphFile(path, "gexf").warnings).toEqual(["2 edges of weight 0 or NaN read as no edge"]);
  });

  it("a negative weight and a repeated edge carry their own problem codes", () => {
    const codeOf = (path: string, format: "gexf" | "graphml", options = {}) => {
      try {
        readXmlGraphFile(path, format, options);
      } catch (error) {
        return [(error as { problem: string }).problem, (error as Error).message];
      }
      return ["none", ""];
    };
    const negative = put(
      "negative.graphml",
      graphml(`<edge id="e1" source="a" target="b"><data key="w">-2</data></edge>`),
    );
    expect(codeOf(negative, "graphml", { negative: "error" })[0]).toBe("negative-weight");
    // By default a negative similarity is dropped, with the core's note passed on.
    expect(readXmlGraphFile(negative, "graphml").warnings).toEqual(["dropped 1 edge with a negative weight"]);
    const twice = put(
      "twice.gexf",
      gexf(
        `<edge id="e1" source="a" target="b" weight="1"/><edge id="e2" source="a" target="b" weight="2"/>`,
      ),
    );
    const [problem, message] = codeOf(twice, "gexf");
    expect(problem).toBe("duplicate-edge");
    expect(message).toMatch(/: edge "e2" \(a -> b\): /);
  });

  it("XML errors stop the reading; XML warnings do not", () => {
    // xmldom reports an undefined entity as an error, a missing space between attributes as a warning.
    const entity = put(
      "entity.graphml",
      graphml(`<edge id="e1" source="a" target="b"><data key="w">&foo;</data></edge>`),
    );
    expect(() => readXmlGraphFile(entity, "graphml")).toThrow(
      /entity\.graphml:6:\d+: not well-formed XML: entity not found:&foo;$/,
    );
    const spaced = put("spaced.graphml", graphml(`<edge id="e1"source="a" target="b"/>`));
    expect(readXmlGraphFile(spaced, "graphml").graphs[0].weights.length).toBe(2);
  });
});
