/**
 * The outputs of `extract` in their real clients, Debian's python3-numpy and python3-torch:
 * - features.npz loads with numpy.load (no pickle); X, y, ids, feature_names equal features.csv;
 * - a GNN bundle loads with numpy; its arrays have the promised shapes and dtypes, and its values equal
 *   what numpy computes from the graph's own CSV matrix (edges, weights, in/out degrees and strengths,
 *   and triangles per node as diag(A³)/2 — a standard identity for simple graphs); every bundle of a
 *   dataset with directed graphs has the directed column layout;
 * - torch builds tensors from a bundle and runs one forward pass of a two-layer graph convolution
 *   written in plain torch (T. N. Kipf, M. Welling, "Semi-supervised classification with graph
 *   convolutional networks", ICLR 2017: H' = σ(D^{-1/2}(A+I)D^{-1/2} H W)), checked against the same
 *   formula evaluated in numpy on the matrix read from the CSV.
 */
import { spawnSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON } from "../support/python.js";
import { readFeatureTable, SMALL_DATASET, similarityDataset } from "./extract-fixtures.js";
import { runCli } from "./run-cli.js";

function python(script: string, args: string[]): unknown {
  const run = spawnSync(PYTHON, ["-c", script, ...args], { encoding: "utf8" });
  if (run.status !== 0) throw new Error(`python failed:\n${run.stderr}`);
  return JSON.parse(run.stdout);
}

const numpyMissing = missingPythonModules(["numpy"]);
const torchMissing = missingPythonModules(["numpy", "torch"]);

describe.skipIf(numpyMissing !== null)(`extract outputs in numpy ${numpyMissing ?? ""}`, () => {
  let dir: string;
  beforeAll(() => {
    dir = similarityDataset(SMALL_DATASET);
    const run = runCli(["extract", join(dir, "manifest.csv"), "--out", join(dir, "run"), "--node-all-edges"]);
    expect(run.status).toBe(0);
  });

  it("features.npz equals features.csv: shapes, dtypes, values", () => {
    const table = readFeatureTable(join(dir, "run", "features.csv"));
    const loaded = python(
      `
import json, sys, numpy as np
z = np.load(sys.argv[1])
print(json.dumps({
  "keys": sorted(z.files),
  "X_dtype": str(z["X"].dtype), "X_shape": list(z["X"].shape), "X": [[repr(float(v)) for v in row] for row in z["X"]],
  "y_dtype": str(z["y"].dtype), "y": z["y"].tolist(),
  "ids": z["ids"].tolist(), "ids_kind": z["ids"].dtype.kind,
  "feature_names": z["feature_names"].tolist(), "label_names": z["label_names"].tolist(),
  "splits": z["splits"].tolist(), "truncated": z["truncated"].tolist(),
}))`,
      [join(dir, "run", "features.npz")],
    ) as Record<string, never>;
    const rows = table.rows;
    const F = table.header.length - 4;
    expect(loaded.keys).toEqual(["X", "feature_names", "ids", "label_names", "splits", "truncated", "y"]);
    expect(table.header.slice(0, 4)).toEqual(["id", "label", "split", "truncated"]);
    expect(loaded.truncated).toEqual(rows.map((r) => (r[3] === "true" ? 1 : 0)));
    expect(loaded.X_dtype).toBe("float64");
    expect(loaded.X_shape).toEqual([rows.length, F]);
    expect(loaded.y_dtype).toBe("int64");
    expect(loaded.ids_kind).toBe("U");
    expect(loaded.ids).toEqual(rows.map((r) => r[0]));
    expect(loaded.feature_names).toEqual(table.header.slice(4));
    expect(loaded.label_names).toEqual(["alpha", "beta", "gamma"]);
    expect(loaded.y).toEqual(rows.map((r) => ["alpha", "beta", "gamma"].indexOf(r[1])));
    expect(loaded.splits).toEqual(rows.map((r) => r[2]));
    // Exact: the CSV holds the shortest round-trip text of each double; Python's repr is the same kind of text.
    (loaded.X as string[][]).forEach((row, i) => {
      row.forEach((text, j) => {
        expect(Number(text), `${rows[i][0]} ${table.header[4 + j]}`).toBe(Number(rows[i][4 + j]));
      });
    });
  });

  it.each(SMALL_DATASET.map((g) => [g.id, g] as const))(
    "bundle %s: arrays equal numpy's reading of the CSV",
    (id, g) => {
      const report = python(
        `
import json, sys, numpy as np
b = np.load(sys.argv[1])
m = np.genfromtxt(sys.argv[2], delimiter=",")
directed = sys.argv[3] == "true"
n = len(m)
present = ~np.isnan(m) & ~np.eye(n, dtype=bool)
W = np.where(present, m, 0.0)
A = present.astype(np.int64)
x, ei, ea = b["x"], b["edge_index"], b["edge_attr"]
names = b["node_feature_names"].tolist()
out = {"dtypes": [str(x.dtype), str(ei.dtype), str(ea.dtype), str(b["y"].dtype)],
       "x_shape": list(x.shape), "ei_shape": list(ei.shape), "ea_shape": list(ea.shape),
       "y": b["y"].tolist(), "edge_names": b["edge_feature_names"].tolist(), "names": names,
       "labels": b["node_labels"].tolist(), "threshold_is_nan": bool(np.isnan(b["threshold"][0]))}
pairs = sorted(zip(ei[0].tolist(), ei[1].tolist()))
expected_pairs = sorted(zip(*np.nonzero(present)))
out["edges_match"] = pairs == [(int(u), int(v)) for u, v in expected_pairs]
out["weights_match"] = bool(np.allclose(ea[:, 0], W[ei[0], ei[1]].astype(np.float32), rtol=0, atol=0))
out["layout_directed"] = "in_degree" in names
out["directed_flag"] = int(b["directed"][0])
out["degree_match"] = bool(np.array_equal(x[:, names.index("out_degree")], A.sum(1)) and
                          np.array_equal(x[:, names.index("in_degree")], A.sum(0)))
out["strength_match"] = bool(np.allclose(x[:, names.index("out_strength")], W.sum(1), rtol=1e-6) and
                            np.allclose(x[:, names.index("in_strength")], W.sum(0), rtol=1e-6))
if directed:
    out["triangles_match"] = True
    out["unoriented_zero"] = True
else:
    # Triangles through each node of a simple graph: diag(A^3) / 2.
    out["triangles_match"] = bool(np.array_equal(x[:, names.index("simplices_d2")], np.diag(A @ A @ A) // 2))
    # In the directed layout an undirected graph has no source/sink participation.
    out["unoriented_zero"] = bool(all((x[:, i] == 0).all() for i, nm in enumerate(names) if "_as_" in nm))
print(json.dumps(out))`,
        [join(dir, "run", "bundles", `${id}.npz`), join(dir, `${id}.csv`), String(g.directed)],
      ) as Record<string, unknown>;
      expect(report.dtypes).toEqual(["float32", "int64", "float32", "int64"]);
      const F = (report.names as string[]).length;
      expect(report.x_shape).toEqual([g.n, F]);
      const E = (report.ei_shape as number[])[1];
      expect(report.ei_shape).toEqual([2, E]);
      expect(report.ea_shape).toEqual([E, (report.edge_names as string[]).length]);
      expect(report.y).toEqual([["alpha", "beta", "gamma"].indexOf(g.label)]);
      expect(report.labels).toHaveLength(g.n);
      expect(report.threshold_is_nan).toBe(true); // --node-all-edges
      expect(report.edges_match).toBe(true);
      expect(report.weights_match).toBe(true);
      expect(report.degree_match).toBe(true);
      expect(report.strength_match).toBe(true);
      expect(report.triangles_match).toBe(true);
      // The dataset has directed graphs, so every bundle has the directed column layout.
      expect(report.layout_directed).toBe(true);
      expect(report.directed_flag).toBe(g.directed ? 1 : 0);
      expect(report.unoriented_zero).toBe(true);
    },
  );

  it.skipIf(torchMissing !== null)(
    `torch: a two-layer GCN forward pass on a bundle ${torchMissing ?? ""}`,
    () => {
      const g = SMALL_DATASET.find((x) => !x.directed)!;
      const result = python(
        `
import json, sys, numpy as np, torch
b = np.load(sys.argv[1])
x = torch.from_numpy(b["x"])                       # float32 n x F, no glue
edge_index = torch.from_numpy(b["edge_index"])     # int64 2 x E
n, F = x.shape
torch.manual_seed(0)
W1 = torch.randn(F, 8)
W2 = torch.randn(8, 3)

def gcn_layer(H, W, edge_index, n):
    # Kipf & Welling (2017): H' = D^{-1/2} (A + I) D^{-1/2} H W, A from edge_index.
    A = torch.zeros(n, n)
    A[edge_index[0], edge_index[1]] = 1.0
    A_hat = A + torch.eye(n)
    d = A_hat.sum(1).pow(-0.5)
    return (d[:, None] * A_hat * d[None, :]) @ H @ W

Hx = (x - x.mean(0)) / (x.std(0) + 1e-6)
out = gcn_layer(torch.relu(gcn_layer(Hx, W1, edge_index, n)), W2, edge_index, n)

# The same formula in numpy, with A taken from the CSV matrix rather than from the bundle.
m = np.genfromtxt(sys.argv[2], delimiter=",")
A = (~np.isnan(m) & ~np.eye(n, dtype=bool)).astype(np.float64) + np.eye(n)
D = np.diag(A.sum(1) ** -0.5)
S = D @ A @ D
Xn = Hx.double().numpy()
ref = S @ np.maximum(S @ Xn @ W1.double().numpy(), 0) @ W2.double().numpy()
print(json.dumps({"shape": list(out.shape), "finite": bool(torch.isfinite(out).all()),
                  "max_diff": float(np.abs(out.double().numpy() - ref).max()),
                  "scale": float(np.abs(ref).max())}))`,
        [join(dir, "run", "bundles", `${g.id}.npz`), join(dir, `${g.id}.csv`)],
      ) as { shape: number[]; finite: boolean; max_diff: number; scale: number };
      expect(result.shape).toEqual([g.n, 3]);
      expect(result.finite).toBe(true);
      expect(result.scale).toBeGreaterThan(0);
      // float32 forward pass against float64 numpy: agreement to float32 precision.
      expect(result.max_diff).toBeLessThan(1e-4 * Math.max(1, result.scale));
    },
  );
});

describe.skipIf(numpyMissing !== null)(`node coordinates in bundles ${numpyMissing ?? ""}`, () => {
  it("a manifest's coords file becomes pos (float32, n × 2), row v = node v", () => {
    const dir = similarityDataset([{ id: "p1", label: "a", directed: false, n: 5, seed: 3 }]);
    const coords = [
      [0.5, -1],
      [1.25, 2],
      [3, 0.125],
      [-4, 5.5],
      [6, 7],
    ];
    writeFileSync(
      join(dir, "p1-coords.csv"),
      `node,x,y\n${coords.map((c, v) => `${v},${c[0]},${c[1]}`).join("\n")}\n`,
    );
    writeFileSync(join(dir, "manifest.csv"), "id,file,label,coords\np1,p1.csv,a,p1-coords.csv\n");
    const run = runCli([
      "extract",
      join(dir, "manifest.csv"),
      "--out",
      join(dir, "run"),
      "--threshold",
      "0.5",
    ]);
    expect(run.status).toBe(0);
    const pos = python(
      `
import json, sys, numpy as np
b = np.load(sys.argv[1])
print(json.dumps({"dtype": str(b["pos"].dtype), "pos": b["pos"].tolist()}))`,
      [join(dir, "run", "bundles", "p1.npz")],
    ) as { dtype: string; pos: number[][] };
    expect(pos.dtype).toBe("float32");
    expect(pos.pos).toEqual(coords); // these values are exact in float32
  });
});
