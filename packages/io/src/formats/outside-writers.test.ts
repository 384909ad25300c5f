// Files written by outside writers read back exactly. Sources: numpy.savez / numpy.savez_compressed (a zip
// of .npy members, PKWARE APPNOTE; NumPy NEP 1 for the members), scipy.io.savemat with and without
// do_compression (MATLAB 7 MAT-File Format, MathWorks), networkx.write_graphml and networkx.write_gexf —
// all from Debian's python3-numpy, python3-scipy and python3-networkx, run by this test.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { nodeLabel, type WeightedGraph } from "@cliquescape/core";
import { afterAll, describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON } from "../../../../test/support/python.js";
import { readGraphFile } from "../read-graph-file.js";
import { readMatVariables } from "./read-mat.js";
import { readNpzMembers } from "./read-npz.js";

const missing = missingPythonModules(["numpy", "scipy", "networkx"]);
const dir = mkdtempSync(join(tmpdir(), "cliquescape-outside-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Writes the files and prints, per case, the matrices as numpy sees them: a list of n×n slices in C order
// (json prints Python's float repr, which round-trips float64 exactly) and, for graphs, the edge list.
const WRITER = `
import json, sys, numpy as np, scipy.io as sio, scipy.sparse as sp, networkx as nx
d = sys.argv[1]
rng = np.random.default_rng(20261202)
def sym(n, zero=0.3):
    a = rng.random((n, n)); a = np.triu(a, 1); a[rng.random((n, n)) < zero] = 0; return a + a.T
def directed(n):
    a = rng.random((n, n)); a[rng.random((n, n)) < 0.4] = 0; np.fill_diagonal(a, 0); return a
out = {}
def record(name, slices): out[name] = [s.astype(np.float64).tolist() for s in slices]
m = sym(6); s3 = np.stack([sym(5) for _ in range(4)]); dg = directed(5)
ints = (sym(5) * 100).astype(np.int32)
np.savez(f"{d}/plain.npz", m=m)
record("plain.npz", [m])
np.savez(f"{d}/named.npz", ids=np.array(["a", "b"]), weights=dg, other=sym(3), vec=np.arange(3))
record("named.npz:weights", [dg])
np.savez_compressed(f"{d}/stack.npz", s3)
record("stack.npz", list(s3))
np.savez_compressed(f"{d}/ints.npz", w=ints, f32=ints.astype(np.float32) / 7)
record("ints.npz:w", [ints]); record("ints.npz:f32", [ints.astype(np.float32) / 7])
sio.savemat(f"{d}/plain.mat", {"C": m})
record("plain.mat", [m])
sio.savemat(f"{d}/packed.mat", {"C": dg, "label": "subject 1", "age": 42.0}, do_compression=True)
record("packed.mat:C", [dg])
# a numpy stack (k, n, n) arrives in MATLAB as k×n×n
sio.savemat(f"{d}/stack-numpy.mat", {"S": s3}, do_compression=True)
record("stack-numpy.mat", list(s3))
# MATLAB's own convention n×n×k: A(:,:,k) is graph k
mat_style = np.moveaxis(s3[:, :, :], 0, 2).copy()
sio.savemat(f"{d}/stack-matlab.mat", {"A": np.concatenate([mat_style, mat_style[:, :, :1]], axis=2)[:, :, :4]})
record("stack-matlab.mat", [mat_style[:, :, k] for k in range(4)])
types = {"i8": ints.astype(np.int8) // 2, "u16": ints.astype(np.uint16), "i64": ints.astype(np.int64) * 10**9,
         "single": m.astype(np.float32), "logical": m > 0.5}
for name, a in types.items():
    sio.savemat(f"{d}/type-{name}.mat", {"X": a}, do_compression=(name == "single"))
    record(f"type-{name}.mat", [a])
sio.savemat(f"{d}/complex.mat", {"Z": m + 1j * m})
sio.savemat(f"{d}/sparse.mat", {"P": sp.csc_matrix(m)})
sio.savemat(f"{d}/cell.mat", {"K": np.array([m, 1], dtype=object)})
sio.savemat(f"{d}/struct.mat", {"T": {"w": m}})
sio.savemat(f"{d}/two.mat", {"A": m, "B": m})
G = nx.Graph()
G.add_nodes_from(["n%d" % i for i in range(7)])
for (u, v) in [(0, 1), (1, 2), (2, 3), (3, 4), (4, 0), (0, 5), (5, 2)]:
    G.add_edge("n%d" % u, "n%d" % v, weight=float(rng.random()))
D = nx.DiGraph()
D.add_nodes_from(["a", "b", "c", "d"])
for (u, v) in [("a", "b"), ("b", "a"), ("b", "c"), ("c", "d"), ("d", "a")]:
    D.add_edge(u, v, weight=float(rng.random()), strength=float(rng.random()))
for name, g in [("und", G), ("dir", D)]:
    nx.write_graphml(g, f"{d}/{name}.graphml"); nx.write_gexf(g, f"{d}/{name}.gexf")
    out[name] = {"nodes": list(g.nodes()), "directed": g.is_directed(),
                 "edges": [[u, v, a["weight"], a.get("strength")] for u, v, a in g.edges(data=True)]}
# A compressed variable of 12800 bytes: more than the 4096 read first for its header (issue 14).
big = directed(40)
sio.savemat(f"{d}/big.mat", {"W": big}, do_compression=True)
record("big.mat", [big])
# 80000 bytes of random doubles: more than one 64 KiB step of compressed input, so several inflated pieces.
large = directed(100)
sio.savemat(f"{d}/large.mat", {"W": large}, do_compression=True)
record("large.mat", [large])
# An n×n×n cube: read as MATLAB's convention, with a warning.
sio.savemat(f"{d}/cube.mat", {"A": np.stack([sym(4) for _ in range(4)], axis=2)})
sio.savemat(f"{d}/none.mat", {})
nan = sym(4); nan[1, 2] = np.nan
sio.savemat(f"{d}/nan.mat", {"C": nan})
np.savez(f"{d}/nan.npz", w=nan)
np.savez(f"{d}/vectors.npz", s=np.float64(2.5), v=np.arange(3))
import zipfile
with zipfile.ZipFile(f"{d}/no-arrays.npz", "w") as z:
    z.writestr("notes.txt", "no arrays here")
# A flipped bit, in a stored member's data or in the CRC-32 the central directory keeps for it: Python's
# zipfile (under numpy.load) refuses both with BadZipFile; we must refuse them too.
np.savez(f"{d}/flip-data.npz", w=m)
np.savez(f"{d}/flip-crc.npz", w=m)
for name, where in [("flip-data", "data"), ("flip-crc", "crc")]:
    raw = bytearray(open(f"{d}/{name}.npz", "rb").read())
    if where == "data":
        raw[raw.index(b"\\x93NUMPY") + 128 + 8 * 7] ^= 0x01
    else:
        raw[raw.rindex(b"PK\\x01\\x02") + 16] ^= 0x01
    open(f"{d}/{name}.npz", "wb").write(bytes(raw))
    try:
        np.load(f"{d}/{name}.npz")["w"]
        out[name] = "loaded"
    except Exception as e:
        out[name] = type(e).__name__
print(json.dumps(out))
`;

type Slices = number[][][];

/** Every (i, j, w) of the graph's dense matrix: w = NaN for no edge, the diagonal left out. */
function expectGraphEqualsMatrix(
  graph: WeightedGraph,
  matrix: number[][],
  directed: boolean,
  booleans = false,
) {
  const n = matrix.length;
  expect(graph.n).toBe(n);
  expect(graph.directed).toBe(directed);
  const dense = new Float64Array(n * n).fill(Number.NaN);
  for (let u = 0; u < n; u++) {
    for (let e = graph.offsets[u]; e < graph.offsets[u + 1]; e++)
      dense[u * n + graph.targets[e]] = graph.weights[e];
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (i === j) continue;
      const w = booleans ? (matrix[i][j] ? 1 : 0) : matrix[i][j];
      // Similarity weights (the default): 0 is no edge.
      expect([i, j, dense[i * n + j]]).toEqual([i, j, w === 0 ? Number.NaN : w]);
    }
  }
}

describe.skipIf(missing !== null)(
  `files written by numpy, scipy and networkx${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    const written =
      missing === null ? spawnSync(PYTHON, ["-c", WRITER, dir], { encoding: "utf8" }) : undefined;
    if (written && written.status !== 0) throw new Error(`writer failed: ${written.stderr}`);
    const cases: Record<string, Slices> &
      Record<
        "und" | "dir",
        { nodes: string[]; directed: boolean; edges: [string, string, number, number | null][] }
      > = written ? JSON.parse(written.stdout) : {};

    const matrixCases: [string, string, Record<string, string>, boolean][] = [
      ["plain.npz", "plain.npz", {}, false],
      ["named.npz:weights", "named.npz", { array: "weights" }, true],
      ["stack.npz", "stack.npz", {}, false],
      ["ints.npz:w", "ints.npz", { array: "w" }, false],
      ["ints.npz:f32", "ints.npz", { array: "f32" }, false],
      ["plain.mat", "plain.mat", {}, false],
      ["packed.mat:C", "packed.mat", {}, true],
      ["stack-numpy.mat", "stack-numpy.mat", {}, false],
      ["stack-matlab.mat", "stack-matlab.mat", {}, false],
      ["type-i8.mat", "type-i8.mat", {}, false],
      ["type-u16.mat", "type-u16.mat", {}, false],
      ["type-i64.mat", "type-i64.mat", {}, false],
      ["type-single.mat", "type-single.mat", {}, false],
      ["type-logical.mat", "type-logical.mat", {}, false],
      ["big.mat", "big.mat", {}, true],
      ["large.mat", "large.mat", {}, true],
    ];
    it.each(matrixCases)("%s reads back exactly", (key, file, options, directed) => {
      const expected = cases[key];
      expect(expected.length).toBeGreaterThan(0);
      const { graphs, format } = readGraphFile(join(dir, file), { ...options, directed });
      expect(format).toBe(file.endsWith(".npz") ? "npz" : "mat");
      expect(graphs).toHaveLength(expected.length);
      graphs.forEach((graph, g) => {
        expectGraphEqualsMatrix(graph, expected[g], directed, key.includes("logical"));
      });
    });

    it.each(["flip-data", "flip-crc"])(
      "%s.npz: one flipped bit is refused, as numpy refuses it, by the member's CRC-32",
      (name) => {
        expect((cases as unknown as Record<string, string>)[name]).toBe("BadZipFile");
        expect(() => readGraphFile(join(dir, `${name}.npz`))).toThrow(
          new RegExp(
            `${name}\\.npz: array "w": zip member w\\.npy fails its CRC-32 check \\(the archive says 0x[0-9a-f]{8}, its bytes give 0x[0-9a-f]{8}\\): the file is damaged$`,
          ),
        );
      },
    );

    it("lists every member and variable with its shape and type", () => {
      const members = readNpzMembers(join(dir, "named.npz"));
      expect(members.map((m) => [m.name, m.header?.shape, m.header?.dtype.descr])).toEqual([
        ["ids", undefined, undefined], // a unicode array: not a matrix, not an error until it is asked for
        ["weights", [5, 5], "<f8"],
        ["other", [3, 3], "<f8"],
        ["vec", [3], "<i8"],
      ]);
      const variables = readMatVariables(join(dir, "packed.mat"));
      expect(variables.map((v) => [v.name, v.className, v.dims])).toEqual([
        ["C", "double", [5, 5]],
        ["label", "char", [1, 9]],
        ["age", "double", [1, 1]],
      ]);
    });

    it("names the arrays or variables when the choice is not clear", () => {
      expect(() => readGraphFile(join(dir, "named.npz"))).toThrow(
        /named\.npz: the \.npz has 2 2-D\/3-D arrays; name the one to read \(array option\); its arrays are: ids \(unreadable\), weights \(5×5 <f8\), other \(3×3 <f8\), vec \(3 <i8\)/,
      );
      expect(() => readGraphFile(join(dir, "named.npz"), { array: "nope" })).toThrow(
        /has no array "nope"; its arrays are: ids, weights, other, vec/,
      );
      expect(() => readGraphFile(join(dir, "named.npz"), { array: "nope" })).toThrow(
        expect.objectContaining({ problem: "bad-header" }),
      );
      expect(() => readGraphFile(join(dir, "named.npz"), { array: "ids" })).toThrow(
        /array "ids": unsupported dtype "<U1"/,
      );
      expect(() => readGraphFile(join(dir, "two.mat"))).toThrow(
        /two\.mat: the MAT-file has 2 numeric 2-D\/3-D variables; name the one to read/,
      );
      expect(readGraphFile(join(dir, "two.mat"), { variable: "B" }).graphs).toHaveLength(1);
    });

    it.each([
      ["complex.mat", "Z", /variable "Z" is complex double; only real numeric and logical matrices are read/],
      ["sparse.mat", "P", /variable "P" is sparse;/],
      ["cell.mat", "K", /variable "K" is cell;/],
      ["struct.mat", "T", /variable "T" is struct;/],
    ])("refuses %s with its class named", (file, variable, message) => {
      expect(() => readGraphFile(join(dir, file))).toThrow(/has no real numeric 2-D or 3-D variable/);
      expect(() => readGraphFile(join(dir, file), { variable })).toThrow(message);
    });

    it("says what a MAT-file holds when nothing can be read, and where a refused variable starts", () => {
      const none = join(dir, "none.mat");
      expect(() => readGraphFile(none)).toThrow(
        `${none}: the MAT-file has no real numeric 2-D or 3-D variable; name the one to read (variable option); its variables are: none`,
      );
      expect(() => readGraphFile(none, { variable: "X" })).toThrow(
        `${none}: the MAT-file has no variable "X"; its variables are: none`,
      );
      const complex = join(dir, "complex.mat");
      expect(() => readGraphFile(complex)).toThrow(/its variables are: Z \(6×6 complex double\)$/);
      // scipy writes the first variable right after the 128-byte header.
      expect(() => readGraphFile(complex, { variable: "Z" })).toThrow(
        `${complex}: byte 128: variable "Z" is complex double;`,
      );
    });

    it("an n×n×n MAT variable is read as n graphs A(:,:,k), with a warning; n×n×k without one", () => {
      const cube = readGraphFile(join(dir, "cube.mat"));
      expect(cube.graphs).toHaveLength(4);
      expect(cube.warnings).toEqual(['variable "A" is 4×4×4: read as 4 graphs A(:,:,k)']);
      expect(readGraphFile(join(dir, "stack-matlab.mat")).warnings).toEqual([]);
      expect(readGraphFile(join(dir, "plain.mat")).warnings).toEqual([]);
    });

    it("an error inside a .mat or .npz matrix names the variable or array and the element, not a byte", () => {
      // numpy's (1, 2) is MATLAB's C(2, 3): 0-based (1, 2) either way.
      const mat = join(dir, "nan.mat");
      expect(() => readGraphFile(mat, { nanIsNoEdge: false })).toThrow(
        `${mat}: element (1, 2): variable "C": NaN is not a finite weight`,
      );
      const npz = join(dir, "nan.npz");
      expect(() => readGraphFile(npz, { nanIsNoEdge: false })).toThrow(
        `${npz}: element (1, 2): array "w": NaN is not a finite weight`,
      );
    });

    it("an .npz without a matrix, or without arrays at all, says so", () => {
      const vectors = join(dir, "vectors.npz");
      expect(() => readGraphFile(vectors)).toThrow(
        `${vectors}: the .npz has no 2-D or 3-D numeric array; name the one to read (array option); its arrays are: s (scalar <f8), v (3 <i8)`,
      );
      const empty = join(dir, "no-arrays.npz");
      expect(() => readGraphFile(empty)).toThrow(`${empty}: the .npz archive holds no .npy arrays`);
    });

    it.each(["graphml", "gexf"])(
      "networkx .%s: nodes in file order, weights exact, direction kept",
      (extension) => {
        for (const name of ["und", "dir"] as const) {
          const expected = cases[name];
          const { graphs } = readGraphFile(join(dir, `${name}.${extension}`));
          const graph = graphs[0];
          expect(graph.directed).toBe(expected.directed);
          expect(Array.from({ length: graph.n }, (_, v) => nodeLabel(graph, v))).toEqual(expected.nodes);
          const edges: [string, string, number][] = [];
          for (let u = 0; u < graph.n; u++) {
            for (let e = graph.offsets[u]; e < graph.offsets[u + 1]; e++) {
              const v = graph.targets[e];
              if (graph.directed || u < v)
                edges.push([nodeLabel(graph, u), nodeLabel(graph, v), graph.weights[e]]);
            }
          }
          const key = ([u, v]: readonly string[]) =>
            expected.directed ? `${u}>${v}` : [u, v].sort().join("-");
          const want = new Map(expected.edges.map((e) => [key(e as unknown as string[]), e[2]]));
          expect(new Map(edges.map((e) => [key(e), e[2]]))).toEqual(want);
          if (name === "dir") {
            // Another attribute as the weight.
            const strength = readGraphFile(join(dir, `${name}.${extension}`), { weightAttribute: "strength" })
              .graphs[0];
            expect([...strength.weights].sort()).toEqual(expected.edges.map((e) => e[3] as number).sort());
          }
        }
      },
    );
  },
);
