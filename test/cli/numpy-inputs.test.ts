/**
 * The command line on what numpy writes, read with default options: correlation matrices made by
 * numpy.corrcoef (symmetric only to the last bit, with negative entries, and NaN rows where a signal is
 * constant) and saved by numpy.save, numpy.savetxt, or as a stack. Every expected number is computed by
 * Debian's python3-numpy from the matrix as saved (test/support/python/corrcoef_files.py), or read back
 * from another output of the tool where the test checks that two outputs agree.
 */

import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON, runPythonScript } from "../support/python.js";
import { readFeatureTable } from "./extract-fixtures.js";
import { runCli, scratchFiles } from "./run-cli.js";

interface Facts {
  asymmetric_pairs: number;
  largest_relative_asymmetry: number;
  negative_pairs: number;
  positive_pairs: number;
  nan_cells: number;
  degree: number[];
}

const missing = missingPythonModules(["numpy"]);
const COHORT = ["c01", "c02", "c03", "c04"];

function json(args: string[]): Record<string, never> {
  const run = runCli(args);
  if (run.status !== 0) throw new Error(`cliquescape ${args.join(" ")} exited ${run.status}:\n${run.stderr}`);
  return JSON.parse(run.stdout);
}

describe.skipIf(missing !== null)(`numpy's corrcoef files, default options ${missing ?? ""}`, () => {
  let dir: string;
  let facts: Record<string, Facts> & Record<string, unknown>;
  const file = (name: string) => join(dir, name);
  beforeAll(() => {
    dir = scratchFiles({});
    mkdirSync(join(dir, "cohort"));
    facts = runPythonScript("corrcoef_files.py", {
      dir,
      files: [
        { name: "s01.npy", nodes: 24, samples: 120, seed: 1, constant: [5] },
        { name: "s02.txt", nodes: 18, samples: 90, seed: 2, constant: [0, 9], format: "txt" },
        { name: "bad.npy", nodes: 12, samples: 80, seed: 3, perturb: 0.001 },
        ...COHORT.map((id, i) => ({
          name: `cohort/${id}.npy`,
          nodes: 14 + i,
          samples: 60,
          seed: 10 + i,
          constant: i % 2 === 0 ? [3] : [],
        })),
      ],
      stack: { name: "stack.npy", graphs: 3, nodes: 12, samples: 70, seed: 40 },
    });
    writeFileSync(
      join(dir, "cohort", "manifest.csv"),
      `id,file,label\n${COHORT.map((id, i) => `${id},${id}.npy,${i < 2 ? "a" : "b"}`).join("\n")}\n`,
    );
  });

  describe("§3 defaults accept what numpy writes", () => {
    it.each([["s01.npy"], ["s02.txt"]])(
      "%s: asymmetric in the last bit, negatives and NaN rows: read, NaN and negatives no edge, each counted",
      (name) => {
        const f = facts[name] as Facts;
        // The inputs are what the issue is about, not a tidied copy (numpy says so).
        expect(f.asymmetric_pairs).toBeGreaterThan(0);
        expect(f.largest_relative_asymmetry).toBeLessThan(1e-9);
        expect(f.negative_pairs).toBeGreaterThan(0);
        expect(f.nan_cells).toBeGreaterThan(0);
        const run = runCli(["inspect", file(name), "--format", "json"]);
        expect(run.status).toBe(0);
        const report = JSON.parse(run.stdout);
        expect(report.edges).toBe(f.positive_pairs);
        expect(run.stderr).toContain(`read ${f.nan_cells} NaN cells as no edge`);
        expect(run.stderr).toContain(`dropped ${f.negative_pairs} edges with a negative weight`);
      },
    );

    it("a real asymmetry is refused with its position and both values, naming the options", () => {
      const [i, j, here, there] = facts["bad.npy:perturbed"] as [number, number, string, string];
      const run = runCli(["inspect", file("bad.npy")]);
      expect(run.status).toBe(1);
      // numpy.save writes a 128-byte header before the float64 cells, row by row (NumPy .npy format 1.0).
      expect(run.stderr).toContain(
        `bad.npy: element (${i}, ${j}) at byte ${128 + 8 * (12 * i + j)}: matrix is not symmetric: ${here} here but ${there} at element (${j}, ${i})`,
      );
      expect(run.stderr).toMatch(/--directed, or merge the two values with --symmetrize max\|min\|mean/);
    });

    it("negative weights: abs keeps them as edges, error refuses naming --negatives", () => {
      const f = facts["s01.npy"] as Facts;
      const abs = JSON.parse(
        runCli(["inspect", file("s01.npy"), "--negatives", "abs", "--format", "json"]).stdout,
      );
      expect(abs.edges).toBe(f.positive_pairs + f.negative_pairs);
      const refused = runCli(["inspect", file("s01.npy"), "--negatives", "error"]);
      expect(refused.status).toBe(1);
      expect(refused.stderr).toMatch(/negative weight -0\.\d+; accept it with --negatives abs\|drop\|keep/);
    });

    it("NaN cells: --nan-cells error refuses them, naming the option to accept them", () => {
      const run = runCli(["inspect", file("s01.npy"), "--nan-cells", "error"]);
      expect(run.status).toBe(1);
      expect(run.stderr).toMatch(
        /element \(0, 5\) at byte \d+: NaN is not a finite weight \(pass --nan-cells no-edge/,
      );
    });

    it("extract FOLDER on a folder holding a manifest reads the manifest; the summary says what became of negatives", () => {
      const run = runCli(["extract", file("cohort"), "--out", file("run-folder"), "--workers", "2"]);
      expect(run.status).toBe(0);
      expect(run.stderr).toContain("holds a manifest: reading the dataset from");
      expect(readFeatureTable(file("run-folder/features.csv")).rows.map((r) => [r[0], r[1]])).toEqual(
        COHORT.map((id, i) => [id, i < 2 ? "a" : "b"]),
      );
      expect(run.stdout).toContain(
        "negative weights: dropped (no edge) in 4 of 4 graphs (--negatives auto, for similarity values); NaN cells: no edge",
      );
      const spec = JSON.parse(readFileSync(file("run-folder/spec.json"), "utf8"));
      expect(spec.preparation).toMatchObject({ negatives: "auto", nanCells: "no-edge", symmetrize: "error" });
    });

    it("a dataset refused as a whole says the real reason (here: negatives refused), not 'no edge'", () => {
      const run = runCli(["extract", file("cohort"), "--out", file("run-refused"), "--negatives", "error"]);
      expect(run.status).toBe(1);
      expect(run.stderr).toMatch(
        /no graph of the dataset gave an edge, so the quantile grid cannot be chosen: 4 of 4 graphs could not be read:\n {2}4 graphs, e\.g\. c01: .*c01\.npy: negative weight -0\.\d+; accept it with --negatives abs\|drop\|keep/,
      );
    });

    it("--labels with the user's ids: a participants table (BIDS participants.tsv) names the slices of a stack", () => {
      writeFileSync(
        file("participants.tsv"),
        "participant_id\tage\tgroup\nsub-07\t31\tcontrol\nsub-08\t45\tpatient\nsub-11\t52\tpatient\n",
      );
      const run = runCli([
        "extract",
        file("stack.npy"),
        "--labels",
        file("participants.tsv"),
        "--labels-column",
        "group",
        "--out",
        file("run-stack"),
        "--workers",
        "2",
      ]);
      expect(run.status).toBe(0);
      expect(readFeatureTable(file("run-stack/features.csv")).rows.map((r) => [r[0], r[1]])).toEqual([
        ["sub-07", "control"],
        ["sub-08", "patient"],
        ["sub-11", "patient"],
      ]);
    });
  });

  describe("§4 outputs", () => {
    it("sweep --format csv has the Betti columns of its JSON", () => {
      const args = ["sweep", file("s01.npy"), "--steps", "6"];
      const report = json([...args, "--format", "json"]);
      const [header, ...rows] = runCli([...args, "--format", "csv"])
        .stdout.trimEnd()
        .split("\n")
        .map((l) => l.split(","));
      const betti = report.betti as number[][];
      expect(header.filter((h) => h.startsWith("betti_"))).toEqual(betti[0].map((_, k) => `betti_${k}`));
      rows.forEach((row, t) => {
        expect(betti[t].map((_, k) => Number(row[header.indexOf(`betti_${k}`)]))).toEqual(betti[t]);
      });
    });

    it("--top-dim 0 still reports the edges and density of the graph", () => {
      const f = facts["s01.npy"] as Facts;
      const n = f.degree.length;
      const inspect = json(["inspect", file("s01.npy"), "--top-dim", "0", "--format", "json"]);
      expect(inspect.counts).toEqual([n]);
      expect(inspect.edges).toBe(f.positive_pairs);
      expect(inspect.density).toBe(f.positive_pairs / ((n * (n - 1)) / 2));
      const flat = json(["sweep", file("s01.npy"), "--top-dim", "0", "--steps", "5", "--format", "json"]);
      const full = json(["sweep", file("s01.npy"), "--top-dim", "1", "--steps", "5", "--format", "json"]);
      expect(flat.density).toEqual(full.density);
      expect(flat.density).toEqual((full.counts as number[][]).map((c) => c[1] / ((n * (n - 1)) / 2)));
      expect((flat.density as number[]).at(-1)).toBe(f.positive_pairs / ((n * (n - 1)) / 2));
    });

    it("features.csv/.npz mark graphs whose Euler columns are partial sums, and those columns are Σ_{k≤topDim}", () => {
      const run = runCli([
        "extract",
        file("cohort/manifest.csv"),
        "--out",
        file("run-top2"),
        "--top-dim",
        "2",
      ]);
      expect(run.status).toBe(0);
      const { header, rows } = readFeatureTable(file("run-top2/features.csv"));
      expect(header[3]).toBe("truncated");
      const spec = JSON.parse(readFileSync(file("run-top2/spec.json"), "utf8"));
      const last = spec.resolvedGrid.values.at(-1);
      rows.forEach((row, i) => {
        // Truncated exactly when the graph has a tetrahedron at the grid's end (inspect counts dimension 3).
        const counts = json([
          "inspect",
          file(`cohort/${COHORT[i]}.npy`),
          "--threshold",
          String(last),
          "--format",
          "json",
        ]).counts as number[];
        expect(row[3]).toBe(String(counts.length > 3 && counts[3] > 0));
        const col = (name: string) => Number(row[header.indexOf(name)]);
        const suffixes = header.filter((h) => h.startsWith("euler_w")).map((h) => h.slice("euler_".length));
        const n = (facts[`cohort/${COHORT[i]}.npy`] as Facts).degree.length;
        for (const w of suffixes) {
          expect(col(`euler_${w}`)).toBe(n - col(`simplices_d1_${w}`) + col(`simplices_d2_${w}`));
        }
      });
      expect(rows.some((r) => r[3] === "true")).toBe(true);
    });

    it("undirected bundles have one degree column (no simplices_d1), equal to numpy's positive degree", () => {
      const all = runCli([
        "extract",
        file("cohort/manifest.csv"),
        "--out",
        file("run-all"),
        "--node-all-edges",
      ]);
      expect(all.status).toBe(0);
      const read = spawnSync(
        PYTHON,
        [
          "-c",
          "import json,sys,numpy as np; print(json.dumps([{'names': b['node_feature_names'].tolist(), 'degree': b['x'][:, 0].tolist()} for b in map(np.load, sys.argv[1:])]))",
          ...COHORT.map((id) => file(`run-all/bundles/${id}.npz`)),
        ],
        { encoding: "utf8" },
      );
      const bundles = JSON.parse(read.stdout) as { names: string[]; degree: number[] }[];
      bundles.forEach((bundle, i) => {
        expect(bundle.names.slice(0, 3)).toEqual(["degree", "strength", "simplices_d2"]);
        expect(bundle.names).not.toContain("simplices_d1");
        expect(new Set(bundle.names).size).toBe(bundle.names.length);
        expect(bundle.degree).toEqual((facts[`cohort/${COHORT[i]}.npy`] as Facts).degree);
      });
    });

    it("sweep and barcode --spec RUN/spec.json reproduce a graph's row of features.csv and its barcode file", () => {
      const { header, rows } = readFeatureTable(file("run-folder/features.csv"));
      const spec = JSON.parse(readFileSync(file("run-folder/spec.json"), "utf8"));
      const T = spec.resolvedGrid.values.length;
      const topDim = spec.complex.topDim;
      for (const row of rows) {
        const id = row[0];
        const sweep = json([
          "sweep",
          file(`cohort/${id}.npy`),
          "--spec",
          file("run-folder/spec.json"),
          "--format",
          "json",
        ]);
        const columns = (prefix: string) =>
          header.flatMap((h, j) => (new RegExp(`^${prefix}_w`).test(h) ? [Number(row[j])] : []));
        expect(sweep.thresholds).toEqual(spec.resolvedGrid.values);
        for (let k = 1; k <= topDim; k++) {
          expect(columns(`simplices_d${k}`), `${id} d${k}`).toEqual(
            (sweep.counts as number[][]).map((c) => c[k] ?? 0),
          );
        }
        expect(columns("euler")).toEqual(sweep.euler);
        for (let k = 0; k < topDim; k++) {
          expect(columns(`betti_d${k}`)).toEqual((sweep.betti as number[][]).map((b) => b[k]));
        }
        expect(columns("euler")).toHaveLength(T);
        const barcode = json([
          "barcode",
          file(`cohort/${id}.npy`),
          "--spec",
          file("run-folder/spec.json"),
          "--format",
          "json",
        ]);
        const written = JSON.parse(readFileSync(file(`run-folder/barcodes/${id}.json`), "utf8"));
        expect(barcode.bars).toEqual(written.bars);
        expect(barcode.end).toBe(written.end);
      }
    });

    it("--spec with a stack's slice reproduces that slice's row", () => {
      const { header, rows } = readFeatureTable(file("run-stack/features.csv"));
      rows.forEach((row, k) => {
        const sweep = json([
          "sweep",
          file("stack.npy"),
          "--slice",
          String(k),
          "--spec",
          file("run-stack/spec.json"),
          "--format",
          "json",
        ]);
        const euler = header.flatMap((h, j) => (h.startsWith("euler_w") ? [Number(row[j])] : []));
        expect(euler).toEqual(sweep.euler);
      });
    });
  });
});
