import { describe, expect, it } from "vitest";
import { InputFileError } from "./input-file-error.js";
import { type EdgeListTextOptions, parseEdgeListText } from "./parse-edge-list.js";

function failure(text: string, options: EdgeListTextOptions = {}): InputFileError {
  try {
    parseEdgeListText(text, "e.csv", options);
  } catch (error) {
    if (error instanceof InputFileError) return error;
    throw error;
  }
  throw new Error("expected an InputFileError");
}

/** Edges by label as "u-v:w", each once, plus the labels in index order. */
function read(text: string, options: EdgeListTextOptions = {}) {
  const { graph, warnings } = parseEdgeListText(text, "e.csv", options);
  const labels = graph.labels ?? [];
  const edges: string[] = [];
  for (let u = 0; u < graph.n; u++) {
    for (let s = graph.offsets[u]; s < graph.offsets[u + 1]; s++) {
      const v = graph.targets[s];
      if (graph.directed || u < v) edges.push(`${labels[u]}-${labels[v]}:${graph.weights[s]}`);
    }
  }
  return { labels, edges, warnings, directed: graph.directed };
}

describe("parseEdgeListText", () => {
  it("maps node names to indices in order of first appearance and keeps them as labels", () => {
    const { labels, edges } = read("source,target,weight\nV1,MT,0.5\nMT,LGN,0.25\nV1,LGN,1\n");
    expect(labels).toEqual(["V1", "MT", "LGN"]);
    expect(edges).toEqual(["V1-MT:0.5", "V1-LGN:1", "MT-LGN:0.25"]);
  });

  it("accepts common header names in any case and column order", () => {
    expect(read("Weight\tTo\tFrom\n2\tb\ta\n").edges).toEqual(["a-b:2"]);
    expect(read("node1 node2 value\n7 9 3\n").edges).toEqual(["7-9:3"]);
  });

  it("lets the user name the columns", () => {
    const text = "pre,post,syn,extra\na,b,4,x\n";
    expect(read(text, { sourceColumn: "pre", targetColumn: "post", weightColumn: "syn" }).edges).toEqual([
      "a-b:4",
    ]);
  });

  it("gives weight 1 to unweighted lists, and warns when unknown columns might have been weights", () => {
    expect(read("from,to\na,b\nb,c\n")).toMatchObject({ edges: ["a-b:1", "b-c:1"], warnings: [] });
    const { edges, warnings } = read("from,to,corr\na,b,0.3\n");
    expect(edges).toEqual(["a-b:1"]);
    expect(warnings).toEqual([
      'no weight column recognised among "corr"; every edge gets weight 1 (name one with weightColumn)',
    ]);
    expect(read("from,to,weight\na,b,0.3\n", { weightColumn: null }).edges).toEqual(["a-b:1"]);
  });

  it("reads headerless lists by position", () => {
    expect(read("a b 2\nb c 3\n", { header: false }).edges).toEqual(["a-b:2", "b-c:3"]);
    expect(read("a b\n", { header: false }).edges).toEqual(["a-b:1"]);
  });

  it("uses the node list for indices and keeps isolated nodes", () => {
    const { labels, edges } = read("source,target\nc,a\n", { nodes: ["a", "b", "c"] });
    expect(labels).toEqual(["a", "b", "c"]);
    expect(edges).toEqual(["a-c:1"]);
  });

  it("drops zero weights for similarity-like weights with a warning, keeps them for distances", () => {
    const text = "source,target,weight\na,b,0\nb,c,2\n";
    const similarity = read(text);
    expect(similarity.edges).toEqual(["b-c:2"]);
    expect(similarity.warnings[0]).toMatch(/^left out 1 edge of weight 0/);
    expect(read(text, { semantics: "distance" }).edges).toEqual(["a-b:0", "b-c:2"]);
  });

  it("reads directed lists as arcs, so a→b and b→a are two edges", () => {
    const { edges, directed } = read("source,target,weight\na,b,1\nb,a,2\n", { directed: true });
    expect(directed).toBe(true);
    expect(edges).toEqual(["a-b:1", "b-a:2"]);
  });

  it("reads quoted node names holding the delimiter (RFC 4180 §2.6)", () => {
    expect(read('source,target,weight\n"Smith, J.","Doe, A.",2\n').labels).toEqual(["Smith, J.", "Doe, A."]);
  });

  it("skips NaN-weighted rows by default, keeping their nodes, and refuses them when asked", () => {
    expect(read("source,target,weight\na,b,nan\nb,c,1\n")).toMatchObject({
      labels: ["a", "b", "c"],
      edges: ["b-c:1"],
      warnings: ["left out 1 edge whose weight is NaN"],
    });
    expect(failure("source,target,weight\na,b,nan\n", { nanIsNoEdge: false }).message).toBe(
      'e.csv:2:3: "nan" is not a finite weight',
    );
  });

  it("drops self-loops with a warning from the core", () => {
    expect(read("source,target\na,a\na,b\n")).toMatchObject({
      edges: ["a-b:1"],
      warnings: ["dropped 1 self-loop"],
    });
  });
});

describe("parseEdgeListText: errors", () => {
  it("empty file", () => {
    expect(failure("").message).toBe("e.csv: file is empty");
    expect(failure("\n# only a comment\n").problem).toBe("empty-file");
  });

  it("header without source or target", () => {
    expect(failure("a,b,c\n1,2,3\n").message).toBe(
      'e.csv:1: no source column in the header ("a", "b", "c"); name it with the sourceColumn option',
    );
    expect(failure("from,to\n", { weightColumn: "w8" }).message).toBe(
      'e.csv:1: no column named "w8" in the header ("from", "to"); name it with the weightColumn option',
    );
  });

  it("non-numeric, empty and non-finite weights", () => {
    expect(failure("# c\nsource,target,weight\na,b,1\nb,c,heavy\n").message).toBe(
      'e.csv:4:3: "heavy" is not a number',
    );
    expect(failure("source,target,weight\na,b,\n").message).toBe("e.csv:2:3: weight cell is empty");
    expect(failure("source,target,weight\na,b,inf\n").message).toBe(
      'e.csv:2:3: "inf" is not a finite weight',
    );
  });

  it("ragged rows", () => {
    expect(failure("source,target,weight\na,b,1\nb,c\n").message).toBe(
      "e.csv:3: row has 2 cells but line 1 has 3",
    );
  });

  it("unknown node when a node list is given", () => {
    const error = failure("source,target\na,b\nb,zz\n", { nodes: ["a", "b"] });
    expect(error.message).toBe('e.csv:3:2: unknown node "zz": not in the node list');
    expect(error.problem).toBe("unknown-node");
  });

  it("duplicate edges name both lines, in either direction when undirected", () => {
    const text = "source,target,weight\na,b,1\nb,c,1\n\nb,a,2\n";
    const error = failure(text);
    expect(error.message).toBe('e.csv:5:1: edge "b" – "a" is listed twice: first on line 2, again on line 5');
    expect(error.problem).toBe("duplicate-edge");
    // The core's error stays as the cause, as for negative weights below.
    expect(error.cause).toMatchObject({ problem: "duplicate-edge", location: { edge: 2, firstEdge: 0 } });
    expect(failure("source,target\na,b\na,b\n", { directed: true }).reason).toBe(
      'edge "a" → "b" is listed twice: first on line 2, again on line 3',
    );
  });

  it("negative weight without a policy, keeping the core's error as the cause", () => {
    expect(failure("source,target,weight\na,b,1\nb,c,-2\n", { negative: "error" }).cause).toMatchObject({
      problem: "negative-weight",
    });
    expect(failure("source,target,weight\na,b,1\nb,c,-2\n", { negative: "error" }).message).toBe(
      "e.csv:3:3: negative weight -2; choose a negative-weight policy (abs, drop or keep) to accept it",
    );
  });
});

describe("parseEdgeListText: empty graphs and unclear weights", () => {
  it("a header without edges is refused like an empty matrix file, unless a node list gives the nodes", () => {
    const error = failure("# exported\nsource,target,weight\n");
    expect(error.problem).toBe("empty-file");
    expect(error.message).toBe(
      "e.csv:2: the edge list has a header but no edges (and no node list): the graph would have no nodes",
    );
    expect(read("source,target,weight\n", { nodes: ["a", "b"] }).labels).toEqual(["a", "b"]);
  });

  it("semicolon-separated with decimal commas names the cell, and tabs mixed with spaces say so", () => {
    expect(failure("source;target;weight\na;b;0,5\n").message).toBe(
      'e.csv:2:3: "0,5" is not a number; decimal commas are not read: write a decimal point (0.5)',
    );
    expect(failure("source\ttarget\tweight\na\tb\t0.5 1\n").message).toBe(
      'e.csv:2:3: "0.5 1" is not a number; the line separates cells with spaces but the file with tabs: use one kind of separator throughout',
    );
  });
});

describe("parseEdgeListText: mistakes found by mutation testing to be untested", () => {
  it("a one-column file is not an edge list", () => {
    const error = failure("a\nb\n", { header: false });
    expect(error.problem).toBe("ragged-row");
    expect(error.reason).toBe("an edge needs at least a source and a target cell");
    expect(error.position.line).toBe(1);
  });

  it("a node listed twice in the node list", () => {
    const error = failure("source,target\na,b\n", { nodes: ["a", "b", "a"] });
    expect(error.problem).toBe("bad-labels");
    expect(error.reason).toBe('node "a" is listed twice in the node list');
  });

  it("an empty node name, with the column it is in", () => {
    const source = failure("source,target,weight\na,b,1\n,b,1\n");
    expect(source.problem).toBe("unknown-node");
    expect(source.reason).toBe("empty node name");
    expect(source.position).toMatchObject({ line: 3, column: 1 });
    expect(failure("source,target,weight\na,,1\n").position).toMatchObject({ line: 2, column: 2 });
  });

  it("weightColumn: null ignores the third column of a headerless list too", () => {
    expect(read("a b 5\nb c 7\n", { header: false, weightColumn: null }).edges).toEqual(["a-b:1", "b-c:1"]);
  });

  it("counts the dropped edges in the warnings, singular and plural", () => {
    expect(read("a,b,0\nb,c,0\nc,d,1\n", { header: false }).warnings[0]).toMatch(
      /^left out 2 edges of weight 0 /,
    );
    expect(read("a,b,0\nc,d,1\n", { header: false }).warnings[0]).toMatch(/^left out 1 edge of weight 0 /);
    expect(read("a,b,nan\nb,c,NaN\nc,d,1\n", { header: false }).warnings).toEqual([
      "left out 2 edges whose weight is NaN",
    ]);
  });
});
