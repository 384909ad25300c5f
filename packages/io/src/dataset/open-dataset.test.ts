import { execFileSync, spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { nodeLabel, type WeightedGraph } from "@cliquescape/core";
import { afterAll, describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON } from "../../../../test/support/python.js";
import { encodeNpy } from "../encode-npy.js";
import { InputFileError } from "../input-file-error.js";
import { readGraphFile } from "../read-graph-file.js";
import { encodeNpz } from "../write/encode-npz.js";
import { formatDatasetProblem } from "./dataset-types.js";
import { hashFile } from "./hash-file.js";
import { openDataset } from "./open-dataset.js";
import { readDatasetGraph } from "./read-dataset-graph.js";

const root = mkdtempSync(join(tmpdir(), "cliquescape-dataset-"));
afterAll(() => rmSync(root, { recursive: true, force: true }));
const put = (path: string, content: string | Uint8Array) => {
  const full = join(root, path);
  mkdirSync(join(full, ".."), { recursive: true });
  writeFileSync(full, content);
  return full;
};

const TRIANGLE = ",a,b,c\na,0,1,2\nb,1,0,3\nc,2,3,0\n";
const PATH = "0 0.5 0\n0.5 0 0.25\n0 0.25 0\n";

function edges(graph: WeightedGraph): string[] {
  const out: string[] = [];
  for (let u = 0; u < graph.n; u++) {
    for (let e = graph.offsets[u]; e < graph.offsets[u + 1]; e++) {
      out.push(`${nodeLabel(graph, u)}>${nodeLabel(graph, graph.targets[e])}:${graph.weights[e]}`);
    }
  }
  return out;
}

function errorOf(run: () => unknown): InputFileError {
  try {
    run();
  } catch (error) {
    if (error instanceof InputFileError) return error;
    throw error;
  }
  throw new Error("no error was thrown");
}

describe("a folder", () => {
  put("folder/b.txt", PATH);
  put("folder/a.csv", TRIANGLE);
  put("folder/a.npy", encodeNpy([0, 1, 1, 0], [2, 2]));
  put("folder/notes.md", "not a graph");
  put("folder/.hidden.csv", TRIANGLE);
  put("folder/sub/c.csv", TRIANGLE);
  symlinkSync(join(root, "folder/b.txt"), join(root, "folder/linked.txt"));
  symlinkSync(join(root, "folder/missing.txt"), join(root, "folder/dangling.txt"));

  it("lists graph files and links to them, sorted by name, not recursively, ids without extension; a repeated id is a problem", () => {
    const dataset = openDataset(join(root, "folder"));
    expect(dataset.kind).toBe("folder");
    expect(dataset.entries.map((e) => [e.id, e.file])).toEqual([
      ["a", join(root, "folder/a.csv")],
      ["b", join(root, "folder/b.txt")],
      ["linked", join(root, "folder/linked.txt")],
    ]);
    expect(dataset.problems).toEqual([
      {
        id: "a",
        file: join(root, "folder/a.npy"),
        reason: 'duplicate id "a": a.csv has the same name; skipped',
      },
    ]);
    expect(edges(readDatasetGraph(dataset.entries[0], {}).graph)).toEqual(
      edges(readGraphFile(join(root, "folder/a.csv")).graphs[0]),
    );
  });

  it("a folder with no graph files, and a path that does not exist, are errors", () => {
    mkdirSync(join(root, "nothing"), { recursive: true });
    expect(() => openDataset(join(root, "nothing"))).toThrow(/nothing: the folder holds no graph files/);
    const missing = errorOf(() => openDataset(join(root, "no-such-place")));
    expect(missing.message).toBe(`${join(root, "no-such-place")}: no such file or folder`);
  });
});

describe("a folder holding a manifest", () => {
  it("is read through its manifest (the layout of demo-data/), not as a folder of graphs", () => {
    put("with-manifest/graphs/g1.csv", TRIANGLE);
    put("with-manifest/manifest.csv", "id,file,label\ng1,graphs/g1.csv,x\n");
    put("with-manifest/edges.csv", "source,target,weight\na,b,1\n");
    const dataset = openDataset(join(root, "with-manifest"));
    expect(dataset.kind).toBe("manifest");
    expect(dataset.root).toBe(join(root, "with-manifest", "manifest.csv"));
    expect(dataset.entries.map((e) => [e.id, e.label])).toEqual([["g1", "x"]]);
  });

  it("with several manifests, asks which one", () => {
    put("two-manifests/train.csv", "ID,File\n");
    put("two-manifests/test.tsv", "id\tfile\tlabel\n");
    expect(errorOf(() => openDataset(join(root, "two-manifests"))).message).toBe(
      `${join(root, "two-manifests")}: the folder holds 2 manifests (test.tsv, train.csv); pass the one to use`,
    );
  });
});

describe("a manifest", () => {
  put("m/graphs/g1.csv", TRIANGLE);
  put("m/graphs/g2.txt", PATH);
  put("m/coords/g1.csv", "node,x,y\nc,3,3.5\na,1,1.5\nb,2,2.5\n");
  const manifest = put(
    "m/manifest.csv",
    [
      "id,file,label,split,directed,coords,site,age",
      "g1,graphs/g1.csv,ring,train,false,coords/g1.csv,A,31",
      "g2,graphs/g2.txt,islands,test,TRUE,,B,40",
      "g3,graphs/missing.csv,ring,train,,,A,22",
      "g1,graphs/g2.txt,ring,train,,,A,22",
      ",graphs/g2.txt,ring,train,,,A,22",
      "g6,graphs/g2.txt,ring,train,maybe,,A,22",
      "g7,graphs/g2.txt,ring,train",
      "# a comment line",
      '"g,8",graphs/g2.txt,"ring, big",,,,"x ""quoted""",1',
      "g9,graphs/g1.csv,ring,train,,coords/none.csv,A,1",
    ].join("\n"),
  );

  it("keeps good rows with label, split, directed, coordinates and metadata", () => {
    const dataset = openDataset(manifest);
    expect(dataset.kind).toBe("manifest");
    expect(dataset.root).toBe(manifest);
    expect(dataset.entries).toEqual([
      {
        id: "g1",
        file: join(root, "m/graphs/g1.csv"),
        label: "ring",
        split: "train",
        metadata: { site: "A", age: "31" },
        directed: false,
        coordinatesFile: join(root, "m/coords/g1.csv"),
        declaredAt: { file: manifest, line: 2 },
      },
      {
        id: "g2",
        file: join(root, "m/graphs/g2.txt"),
        label: "islands",
        split: "test",
        metadata: { site: "B", age: "40" },
        directed: true,
        declaredAt: { file: manifest, line: 3 },
      },
      {
        id: "g,8",
        file: join(root, "m/graphs/g2.txt"),
        label: "ring, big",
        split: null,
        metadata: { site: 'x "quoted"', age: "1" },
        declaredAt: { file: manifest, line: 10 },
      },
    ]);
  });

  it("reports each bad row with its line, column and reason, and goes on", () => {
    const { problems } = openDataset(manifest);
    expect(problems.map(formatDatasetProblem)).toEqual([
      `${manifest}:4:2: g3: file not found: graphs/missing.csv (looked for ${join(root, "m/graphs/missing.csv")})`,
      `${manifest}:5:1: g1: duplicate id "g1" (first on line 2); this row is skipped`,
      `${manifest}:6:1: empty id`,
      `${manifest}:7:5: g6: directed is "maybe"; write true or false (or leave it empty)`,
      `${manifest}:8:5: g7: the row has 4 cells but the header has 8`,
      `${manifest}:11:6: g9: coordinates file not found: coords/none.csv (looked for ${join(root, "m/coords/none.csv")})`,
    ]);
  });

  it("reads each entry's graph with the manifest's direction, and its coordinates by node label", () => {
    const [g1, g2] = openDataset(manifest).entries;
    const first = readDatasetGraph(g1, { directed: true });
    expect(first.graph.directed).toBe(false);
    expect(first.coordinates).toEqual({ dims: 2, values: new Float64Array([1, 1.5, 2, 2.5, 3, 3.5]) });
    const second = readDatasetGraph(g2, {});
    expect(second.graph.directed).toBe(true);
    expect(edges(second.graph)).toEqual(["0>1:0.5", "1>0:0.5", "1>2:0.25", "2>1:0.25"]);
    expect(second.coordinates).toBeUndefined();
  });

  it("a manifest without id or file columns is an error at its header", () => {
    const noFile = put("m/no-file.csv", "id,path,label\ng1,graphs/g1.csv,ring\n");
    const e = errorOf(() => openDataset(noFile));
    expect(e.problem).toBe("bad-header");
    expect(e.message).toBe(
      `${noFile}:1: the manifest has no "file" column; its header is id,path,label (needed: id, file; optional: label, split, directed, coords)`,
    );
    const noId = put("m/no-id.csv", "file\ngraphs/g1.csv\n");
    expect(() => openDataset(noId)).toThrow(/no-id\.csv:1: the manifest has no "id" column/);
    expect(() => openDataset(put("m/empty.csv", ""))).toThrow(/empty\.csv: the manifest has no header line/);
  });

  it("matches known column names without regard to case and keeps metadata names as written", () => {
    const upper = put("m/upper.csv", "ID,File,Label,Site\ng1,graphs/g1.csv,ring,A\n");
    const [entry] = openDataset(upper).entries;
    expect([entry.id, entry.label, entry.metadata]).toEqual(["g1", "ring", { Site: "A" }]);
  });

  it("a dataset-wide coordinates file fills in for entries without their own", () => {
    const wide = put("m/wide.csv", "node,x,y,z\n0,1,2,3\n1,4,5,6\n2,7,8,9\n");
    const dataset = openDataset(manifest, { coordinatesFile: wide });
    expect(dataset.entries.map((e) => e.coordinatesFile)).toEqual([
      join(root, "m/coords/g1.csv"),
      wide,
      wide,
    ]);
    // g2 has no labels: nodes are matched by 0-based index.
    expect(readDatasetGraph(dataset.entries[1], {}).coordinates).toEqual({
      dims: 3,
      values: new Float64Array([1, 2, 3, 4, 5, 6, 7, 8, 9]),
    });
  });
});

describe("node coordinates", () => {
  const g1 = put("c/g.csv", TRIANGLE);
  const entry = (coords: string) => ({
    id: "g",
    file: g1,
    label: null,
    split: null,
    metadata: {},
    coordinatesFile: put(`c/${coords.length}.csv`, coords),
    declaredAt: { file: g1 },
  });
  it.each([
    ["node,x\na,1\n", /:1: the header is node,x; expected node,x,y or node,x,y,z/],
    ["node,x,y\na,1,2\nq,1,2\n", /:3:1: unknown node "q": no node has this label/],
    ["node,x,y\na,1,2\na,1,2\n", /:3:1: node "a" already has coordinates on line 2/],
    ["node,x,y\na,1,east\n", /:2:3: coordinate "east" is not a finite number/],
    ["node,x,y\na,1\n", /:2:3: the row has 2 cells, the header 3/],
    ["node,x,y\na,1,2\n", /: 2 of 3 nodes have no coordinates \(b, c\)/],
  ])("%j is refused with its position", (coords, message) => {
    expect(() => readDatasetGraph(entry(coords), {})).toThrow(message);
  });
});

describe("a stack", () => {
  // Three 3×3 graphs; graph k has edge 0-1 of weight k+1 and, for k = 2, an extra edge 1-2.
  const values: number[] = [];
  for (let k = 0; k < 3; k++) {
    const m = [0, k + 1, 0, k + 1, 0, k === 2 ? 9 : 0, 0, k === 2 ? 9 : 0, 0];
    values.push(...m);
  }
  const npy = put("s/subjects.npy", encodeNpy(values, [3, 3, 3]));
  const npz = put(
    "s/subjects.npz",
    encodeNpz([{ name: "conn", values: new Float64Array(values), shape: [3, 3, 3] }], { compress: true }),
  );

  it("one entry per slice, ids zero-padded, each slice read alone equals readGraphFile's graph k", () => {
    for (const file of [npy, npz]) {
      const dataset = openDataset(file);
      expect(dataset.kind).toBe("stack");
      expect(dataset.entries.map((e) => [e.id, e.slice])).toEqual([
        ["subjects-0", 0],
        ["subjects-1", 1],
        ["subjects-2", 2],
      ]);
      const all = readGraphFile(file).graphs;
      dataset.entries.forEach((entry, k) => {
        expect(edges(readDatasetGraph(entry, {}).graph)).toEqual(edges(all[k]));
      });
    }
    expect(openDataset(npz).entries[0].variable).toBe("conn");
  });

  it("pads ids to the width of the last index", () => {
    const many = put("s/many.npy", encodeNpy(new Array(11 * 4).fill(0), [11, 2, 2]));
    const ids = openDataset(many).entries.map((e) => e.id);
    expect([ids[0], ids[9], ids[10]]).toEqual(["many-00", "many-09", "many-10"]);
  });

  it("labels one per line, or by id from a CSV; mismatches are reported", () => {
    const byLine = put("s/labels.txt", "ring\n\nislands\n");
    expect(openDataset(npy, { labelsFile: byLine }).entries.map((e) => e.label)).toEqual([
      "ring",
      null,
      "islands",
    ]);
    const byId = put("s/labels.csv", "id,label\nsubjects-2,islands\nsubjects-0,ring\nsubjects-7,ring\n");
    const dataset = openDataset(npy, { labelsFile: byId });
    expect(dataset.entries.map((e) => e.label)).toEqual(["ring", null, "islands"]);
    expect(dataset.problems.map(formatDatasetProblem)).toEqual([
      `${byId}:4:1: subjects-7: no graph "subjects-7" in the stack (ids run subjects-0 … subjects-2)`,
    ]);
    const short = put("s/short.txt", "ring\nislands\n");
    expect(() => openDataset(npy, { labelsFile: short })).toThrow(
      /short\.txt: 2 labels for a stack of 3 graphs/,
    );
  });

  it("a table of the user's own ids names the slices in order: ids, labels, split and metadata", () => {
    const own = put("s/own.csv", "id,label,split\nsub-01,ring,train\nsub-02,,test\nsub-03,islands,train\n");
    const dataset = openDataset(npy, { labelsFile: own });
    expect(dataset.entries.map((e) => [e.id, e.slice, e.label, e.split])).toEqual([
      ["sub-01", 0, "ring", "train"],
      ["sub-02", 1, null, "test"],
      ["sub-03", 2, "islands", "train"],
    ]);
    expect(dataset.problems).toEqual([]);
    const tooFew = put("s/own-short.csv", "id,label\nsub-01,ring\nsub-02,ring\n");
    expect(errorOf(() => openDataset(npy, { labelsFile: tooFew })).reason).toBe(
      '2 rows for a stack of 3 graphs: ids such as "sub-01" are not the stack\'s (subjects-0 … subjects-2), so the rows must name the slices in order, one row per slice',
    );
  });

  it("a participants table (BIDS participants.tsv: participant_id, then any columns) with the labels column named", () => {
    const tsv = put(
      "s/participants.tsv",
      "participant_id\tage\tgroup\nsub-01\t34\tcontrol\nsub-02\t51\tpatient\nsub-03\t29\tcontrol\n",
    );
    const dataset = openDataset(npy, { labelsFile: tsv, labelsColumn: "group" });
    expect(dataset.entries.map((e) => [e.id, e.label, e.metadata])).toEqual([
      ["sub-01", "control", { age: "34" }],
      ["sub-02", "patient", { age: "51" }],
      ["sub-03", "control", { age: "29" }],
    ]);
    expect(errorOf(() => openDataset(npy, { labelsFile: tsv })).message).toBe(
      `${tsv}:1: the header has no "label" column (it has participant_id, age, group); name the column of labels with the labelsColumn option`,
    );
  });

  it("an error in one slice names the slice and its element", () => {
    const bad = values.slice();
    bad[2 * 9 + 1] = Number.NaN;
    const file = put("s/bad.npy", encodeNpy(bad, [3, 3, 3]));
    const dataset = openDataset(file);
    expect(readDatasetGraph(dataset.entries[0], {}).graph.n).toBe(3);
    const e = errorOf(() => readDatasetGraph(dataset.entries[2], { nanIsNoEdge: false }));
    expect(e.position.element).toEqual([2, 0, 1]);
    expect(e.message).toMatch(
      /bad\.npy: element \(2, 0, 1\) at byte \d+: graph 2 of the stack: NaN is not a finite weight/,
    );
  });

  it("a stack file that disappears after opening is an InputFileError, not a crash", () => {
    const file = put("s/gone.npy", encodeNpy(values, [3, 3, 3]));
    const dataset = openDataset(file);
    rmSync(file);
    const e = errorOf(() => readDatasetGraph(dataset.entries[1], {}));
    expect(e.problem).toBe("unreadable");
    expect(e.message).toMatch(/gone\.npy: cannot read file: ENOENT/);
  });

  it("a stack file in a folder dataset is refused when read as one graph", () => {
    put("sf/stack.npy", encodeNpy(values, [3, 3, 3]));
    const [entry] = openDataset(join(root, "sf")).entries;
    expect(() => readDatasetGraph(entry, {})).toThrow(
      /stack\.npy: the file holds 3 graphs; open it as a stack dataset/,
    );
  });
});

const scipyMissing = missingPythonModules(["numpy", "scipy"]);
describe.skipIf(scipyMissing !== null)(
  `a MATLAB stack from scipy.io.savemat${scipyMissing ? ` (skipped: ${scipyMissing})` : ""}`,
  () => {
    it("n×n×k: graph k is A(:,:,k), as scipy wrote it", () => {
      const file = join(root, "s/matlab.mat");
      const script = `
import json, sys, numpy as np, scipy.io as sio
rng = np.random.default_rng(7)
a = rng.random((4, 4, 5)); a = a + a.transpose(1, 0, 2)
for k in range(5): np.fill_diagonal(a[:, :, k], 0)
sio.savemat(sys.argv[1], {"conn": a}, do_compression=True)
print(json.dumps([a[:, :, k].tolist() for k in range(5)]))
`;
      const run = spawnSync(PYTHON, ["-c", script, file], { encoding: "utf8" });
      expect(run.stderr).toBe("");
      const slices = JSON.parse(run.stdout) as number[][][];
      const dataset = openDataset(file);
      expect(dataset.entries.map((e) => e.id)).toEqual([
        "matlab-0",
        "matlab-1",
        "matlab-2",
        "matlab-3",
        "matlab-4",
      ]);
      dataset.entries.forEach((entry, k) => {
        const { graph } = readDatasetGraph(entry, {});
        for (let u = 0; u < 4; u++) {
          for (let e = graph.offsets[u]; e < graph.offsets[u + 1]; e++) {
            expect(graph.weights[e]).toBe(slices[k][u][graph.targets[e]]);
          }
          expect(graph.offsets[u + 1] - graph.offsets[u]).toBe(3);
        }
      });
    });
  },
);

describe("hashFile", () => {
  it("equals coreutils sha256sum, across the 1 MiB read chunks", () => {
    const bytes = new Uint8Array(3 * 2 ** 20 + 17);
    for (let k = 0; k < bytes.length; k++) bytes[k] = (k * 2654435761) >>> 24;
    const file = put("h/big.bin", bytes);
    const empty = put("h/empty.bin", "");
    for (const f of [file, empty]) {
      // Source: GNU coreutils sha256sum (FIPS 180-4 SHA-256).
      expect(hashFile(f)).toBe(execFileSync("sha256sum", [f], { encoding: "utf8" }).split(" ")[0]);
    }
    expect(hashFile(empty)).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
    expect(() => hashFile(join(root, "h/none.bin"))).toThrow(/h\/none\.bin: cannot read file: ENOENT/);
    expect(() => hashFile(join(root, "h"))).toThrow(/h: cannot read file: EISDIR/);
  });
});

// Manifests that say one thing and mean another (audit of issue 8): each problem names what is wrong.
describe("manifests: unclear cases", () => {
  it("a row naming a directory, a FIFO or a device is 'not a regular file', not 'file not found'", () => {
    mkdirSync(join(root, "odd/folder.csv"), { recursive: true });
    execFileSync("mkfifo", [join(root, "odd/pipe.csv")]);
    const manifest = put(
      "odd/manifest.csv",
      "id,file\nd,folder.csv\np,pipe.csv\nn,/dev/null.csv\nz,/dev/zero\n",
    );
    expect(openDataset(manifest).problems.map(formatDatasetProblem)).toEqual([
      `${manifest}:2:2: d: not a regular file (a directory): folder.csv (looked for ${join(root, "odd/folder.csv")})`,
      `${manifest}:3:2: p: not a regular file (a FIFO (named pipe)): pipe.csv (looked for ${join(root, "odd/pipe.csv")})`,
      `${manifest}:4:2: n: file not found: /dev/null.csv (looked for /dev/null.csv)`,
      `${manifest}:5:2: z: cannot tell the format of "/dev/zero" from its extension`,
    ]);
    // Read directly, a device is named for what it is.
    expect(errorOf(() => readGraphFile("/dev/null", { format: "dense-matrix" })).message).toBe(
      "/dev/null: not a regular file (a character device)",
    );
  });

  it("a tab-separated manifest named .csv is told to be renamed, not missing its id column", () => {
    const manifest = put("tabbed/manifest.csv", "id\tfile\tlabel\ng1\tg1.csv\ta\n");
    expect(errorOf(() => openDataset(manifest)).message).toBe(
      `${manifest}:1: the header line is tab-separated, but a .csv manifest is read as comma-separated; name the file .tsv, or separate its columns with commas`,
    );
  });
});
