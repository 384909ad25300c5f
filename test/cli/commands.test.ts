import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { matrixCsv, runCli, scratchFiles } from "./run-cli.js";

// The octahedron K_{2,2,2}: every pair of its 6 vertices is joined except the 3 antipodal pairs. Its clique
// complex is the boundary of the octahedron, a 2-sphere: 6 vertices, 12 edges, 8 triangles, χ = 2, Betti
// numbers (1, 0, 1) (A. Hatcher, Algebraic Topology, 2002, §2.1 and Thm 2.44).
const octahedron = matrixCsv(
  Array.from({ length: 6 }, (_, i) =>
    Array.from({ length: 6 }, (_, j) => (i === j || i % 3 === j % 3 ? null : 1)),
  ),
);

// A square a-b-c-d with sides of length 1 and one diagonal a-c of length 2 (distance weights). At W = 1 it is
// a 4-cycle: one component, one loop. At W = 2 the diagonal splits it into two filled triangles and the loop
// dies. Hand-computed from the definitions (common practice): H0 bars [0,1)×3 and [0,∞); H1 bar [1,2).
const square = matrixCsv([
  [null, 1, 2, 1],
  [1, null, 1, null],
  [2, 1, null, 1],
  [1, null, 1, null],
]);

const dir = scratchFiles({
  "octahedron.csv": octahedron,
  "square.csv": square,
  "asymmetric.csv": matrixCsv([
    [null, 1, 1],
    [1, null, 0.5],
    [1, 0.7, null],
  ]),
});
const file = (name: string) => join(dir, name);

describe("cliquescape inspect", () => {
  it("prints the documented JSON object for the octahedron (a 2-sphere)", () => {
    const run = runCli(["inspect", file("octahedron.csv"), "--format", "json"]);
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    expect(report.nodes).toBe(6);
    expect(report.edges).toBe(12);
    expect(report.counts).toEqual([6, 12, 8]);
    expect(report.euler).toBe(2);
    expect(report.betti).toEqual([1, 0, 1]);
  });

  it("keeps only the edges present at the threshold", () => {
    const run = runCli([
      "inspect",
      file("square.csv"),
      "--weights",
      "distance",
      "--threshold",
      "1",
      "--format",
      "json",
    ]);
    const report = JSON.parse(run.stdout);
    expect(report.threshold).toBe(1);
    expect(report.counts).toEqual([4, 4]);
    expect(report.betti.slice(0, 2)).toEqual([1, 1]);
  });
});

describe("cliquescape sweep", () => {
  it("matches inspect at every threshold, and χ = Σ(−1)^k β_k (Euler–Poincaré; Hatcher 2002, Thm 2.44)", () => {
    const sweep = JSON.parse(
      runCli([
        "sweep",
        file("square.csv"),
        "--weights",
        "distance",
        "--threshold",
        "0.5,1,2",
        "--format",
        "json",
      ]).stdout,
    );
    expect(sweep.thresholds).toEqual([0.5, 1, 2]);
    sweep.thresholds.forEach((t: number, i: number) => {
      const one = JSON.parse(
        runCli([
          "inspect",
          file("square.csv"),
          "--weights",
          "distance",
          "--threshold",
          String(t),
          "--format",
          "json",
        ]).stdout,
      );
      const counts = sweep.counts[i].slice(0, one.counts.length);
      expect(counts).toEqual(one.counts);
      expect(sweep.euler[i]).toBe(one.euler);
      const alternating = sweep.betti[i].reduce(
        (s: number, b: number, k: number) => s + (k % 2 === 0 ? b : -b),
        0,
      );
      expect(alternating).toBe(sweep.euler[i]);
    });
    expect(sweep.betti.map((row: number[]) => row.slice(0, 2))).toEqual([
      [4, 0],
      [1, 1],
      [1, 0],
    ]);
  });
});

describe("cliquescape barcode", () => {
  it("gives the hand-computed bars of the weighted square, with null deaths for essential bars", () => {
    const run = runCli([
      "barcode",
      file("square.csv"),
      "--weights",
      "distance",
      "--top-dim",
      "2",
      "--format",
      "json",
    ]);
    expect(run.status).toBe(0);
    const bars = JSON.parse(run.stdout).bars.map(
      (b: { dim: number; birth: number; death: number | null }) => [b.dim, b.birth, b.death],
    );
    expect(bars).toEqual([
      [0, 0, 1],
      [0, 0, 1],
      [0, 0, 1],
      [0, 0, null],
      [1, 1, 2],
    ]);
  });

  it("adds a representative loop made of edges present at the bar's birth", () => {
    const run = runCli([
      "barcode",
      file("square.csv"),
      "--weights",
      "distance",
      "--cycles",
      "1",
      "--format",
      "json",
    ]);
    const loopBar = JSON.parse(run.stdout).bars.find((b: { dim: number }) => b.dim === 1);
    // The only loop at W = 1 is the square itself: 4 edges, every vertex of even degree (a Z/2 cycle).
    expect(loopBar.cycle).toHaveLength(4);
    const degree = new Map<string, number>();
    for (const [u, v] of loopBar.cycle) for (const x of [u, v]) degree.set(x, (degree.get(x) ?? 0) + 1);
    expect([...degree.values()].every((d) => d === 2)).toBe(true);
    expect(
      loopBar.cycle.some(([u, v]: string[]) => (u === "0" && v === "2") || (u === "2" && v === "0")),
    ).toBe(false);
  });
});

describe("errors and exit codes", () => {
  it("names file, line and column for an asymmetric matrix read as undirected (exit 1)", () => {
    const run = runCli(["inspect", file("asymmetric.csv")]);
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/asymmetric\.csv:\d+:\d+: .*not symmetric/);
  });

  it("accepts the same matrix once a symmetrise policy is chosen", () => {
    const run = runCli(["inspect", file("asymmetric.csv"), "--symmetrize", "max", "--format", "json"]);
    expect(run.status).toBe(0);
    expect(JSON.parse(run.stdout).counts).toEqual([3, 3, 1]);
  });

  it("refuses a composite --prime (exit 2)", () => {
    const run = runCli(["inspect", file("square.csv"), "--prime", "4"]);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/not a prime/);
  });

  it("stops at the simplex budget with a message saying how far it got (exit 3)", () => {
    const run = runCli(["inspect", file("octahedron.csv"), "--budget", "10"]);
    expect(run.status).toBe(3);
    expect(run.stderr).toMatch(/budget of 10 exceeded/);
  });

  it.each([
    ["an unknown option", ["inspect", "square.csv", "--bogus"], /unknown option '--bogus'/],
    ["an invalid choice", ["sweep", "square.csv", "--weights", "strong"], /Allowed choices are/],
    [
      "--threshold with --density",
      ["inspect", "square.csv", "--threshold", "1", "--density", "0.5"],
      /cannot be used with/,
    ],
    ["a missing argument", ["barcode"], /missing required argument 'file'/],
    ["a missing --out", ["extract", "square.csv"], /--out <dir>' not specified/],
    ["an unknown command", ["bogus"], /unknown command 'bogus'/],
  ])("exits with 2 on a bad command line: %s (docs/cli.md, exit codes)", (_, args, message) => {
    const run = runCli(args.map((a) => (a === "square.csv" ? file(a) : a)));
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(message);
  });

  it("exits with 0 for --help and --version", () => {
    expect(runCli(["inspect", "--help"]).status).toBe(0);
    expect(runCli(["--version"]).status).toBe(0);
  });

  it("shows examples in every command's help", () => {
    for (const command of ["inspect", "sweep", "barcode"]) {
      const run = runCli([command, "--help"]);
      expect(run.status).toBe(0);
      expect(run.stdout).toContain("Examples:");
    }
  });
});
