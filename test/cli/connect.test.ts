/**
 * `cliquescape connect` end to end, on recordings written by numpy (Debian's python3-numpy) as a user's
 * script would write them: the matrices it writes load with numpy.load and equal numpy.corrcoef of each
 * recording (diagonal 0); a recording with a constant channel is left out with its file, line and column
 * in errors.csv, or kept with the channel isolated and named in subjects.csv; the stack does not depend
 * on the number of workers; bad command lines exit 2 with the option to fix.
 */
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { hostname } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { missingPythonModules, PYTHON } from "../support/python.js";
import { runCli, scratchFiles } from "./run-cli.js";

const missing = missingPythonModules(["numpy"]);

// Four recordings of 80 time points × 5 channels as CSV with a header (numpy.savetxt), s2 with a constant
// channel "c"; a (3, 60, 4) stack as .npy with a labels file; one wide recording (6 points, 9 channels).
const WRITER = `
import json, sys, numpy as np
d = sys.argv[1]
rng = np.random.default_rng(7)
out = {"folder": [], "stack": []}
for s in range(4):
    x = rng.standard_normal((80, 5)) @ rng.standard_normal((5, 5))
    if s == 2: x[:, 2] = 4.0
    np.savetxt(f"{d}/rec/s{s}.csv", x, delimiter=",", header="a,b,c,d,e", comments="")
    c = np.corrcoef(x.T) if s != 2 else np.zeros((5, 5))
    np.fill_diagonal(c, 0)
    out["folder"].append(c.tolist())
stack = rng.standard_normal((3, 60, 4)) + np.linspace(0, 1, 4)
np.save(f"{d}/cohort.npy", stack)
for x in stack:
    c = np.corrcoef(x.T); np.fill_diagonal(c, 0); out["stack"].append(c.tolist())
np.savetxt(f"{d}/wide/w.csv", rng.standard_normal((6, 9)), delimiter=",")
print(json.dumps(out))
`;

function loadNpy(file: string): { shape: number[]; values: number[] } {
  const run = spawnSync(
    PYTHON,
    [
      "-c",
      "import json,sys,numpy as np; a=np.load(sys.argv[1]); print(json.dumps({'shape': list(a.shape), 'values': a.ravel().tolist()}))",
      file,
    ],
    { encoding: "utf8" },
  );
  expect(run.stderr).toBe("");
  return JSON.parse(run.stdout);
}

function maxDifference(values: number[], expected: number[][][]): number {
  const flat = expected.flat(2);
  expect(values.length).toBe(flat.length);
  return Math.max(...values.map((v, k) => Math.abs(v - flat[k])));
}

describe.skipIf(missing !== null)(
  `connect on numpy-written recordings${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    let dir: string;
    let expected: { folder: number[][][]; stack: number[][][] };
    beforeAll(() => {
      dir = scratchFiles({ "groups.txt": "ctrl\nctrl\nstim\n" });
      for (const sub of ["rec", "wide"]) mkdirSync(join(dir, sub));
      const run = spawnSync(PYTHON, ["-c", WRITER, dir], { encoding: "utf8" });
      expect(run.stderr).toBe("");
      expected = JSON.parse(run.stdout);
    });

    it("a folder: the stack equals numpy.corrcoef per recording; the constant channel's recording is in errors.csv", () => {
      const out = join(dir, "out1");
      const run = runCli([
        "connect",
        join(dir, "rec"),
        "--out",
        out,
        "--measure",
        "pearson",
        "--workers",
        "2",
      ]);
      expect(run.status).toBe(1);
      expect(run.stdout).toMatch(
        /^connect: 3 of 4 recordings → .*matrices\.npy \(ids\.txt\), pearson; 1 left out: see errors\.csv/,
      );
      const stack = loadNpy(join(out, "matrices.npy"));
      expect(stack.shape).toEqual([3, 5, 5]);
      const kept = [0, 1, 3].map((s) => expected.folder[s]);
      expect(maxDifference(stack.values, kept)).toBeLessThan(1e-12);
      expect(readFileSync(join(out, "ids.txt"), "utf8")).toBe("s0\ns1\ns3\n");
      expect(readFileSync(join(out, "channels.txt"), "utf8")).toBe("a\nb\nc\nd\ne\n");
      const errors = readFileSync(join(out, "errors.csv"), "utf8").split("\n");
      expect(errors[0]).toBe("id,file,line,column,reason");
      expect(errors[1]).toMatch(
        /^s2,s2\.csv,2,3,"channel 2 \(c\) is constant \(every value 4\); a correlation with such a channel is undefined/,
      );
    });

    it("--bad-channels isolate keeps it: no edges for the channel, named in subjects.csv", () => {
      const out = join(dir, "out2");
      const run = runCli([
        "connect",
        join(dir, "rec"),
        "--out",
        out,
        "--measure",
        "pearson",
        "--bad-channels",
        "isolate",
      ]);
      expect(run.status).toBe(0);
      const stack = loadNpy(join(out, "matrices.npy"));
      expect(stack.shape).toEqual([4, 5, 5]);
      const s2 = stack.values.slice(2 * 25, 3 * 25);
      for (let k = 0; k < 5; k++) expect([s2[2 * 5 + k], s2[k * 5 + 2]]).toEqual([0, 0]);
      const subjects = readFileSync(join(out, "subjects.csv"), "utf8").split("\n");
      expect(subjects[0]).toBe("id,file,status,channels,time_points,isolated_channels,shrinkage,warnings");
      expect(subjects[3]).toBe(
        "s2,s2.csv,ok,5,80,2,,channel 2 (c) is constant (every value 4): isolated (no edges)",
      );
    });

    it("a numpy stack with labels: partial correlations, the same bytes with 1 and 2 workers", () => {
      const args = (out: string, workers: string) => [
        "connect",
        join(dir, "cohort.npy"),
        "--out",
        join(dir, out),
        "--measure",
        "partial",
        "--labels",
        join(dir, "groups.txt"),
        "--workers",
        workers,
      ];
      expect(runCli(args("p1", "1")).status).toBe(0);
      expect(runCli(args("p2", "2")).status).toBe(0);
      const one = readFileSync(join(dir, "p1", "matrices.npy"));
      expect(one.equals(readFileSync(join(dir, "p2", "matrices.npy")))).toBe(true);
      expect(loadNpy(join(dir, "p1", "matrices.npy")).shape).toEqual([3, 4, 4]);
      expect(readFileSync(join(dir, "p1", "ids.txt"), "utf8")).toBe("cohort-0\ncohort-1\ncohort-2\n");
      expect(readFileSync(join(dir, "p1", "labels.txt"), "utf8")).toBe("ctrl\nctrl\nstim\n");
      const spec = JSON.parse(readFileSync(join(dir, "p1", "connect.json"), "utf8"));
      expect(spec.connectivity).toEqual({
        measure: "partial",
        fisherZ: false,
        channelsFirst: false,
        channels: null,
        badChannels: "error",
      });
      expect(spec.inputs).toHaveLength(3);
    });

    it("--layout files: one .npy per recording and a manifest extract can read", () => {
      const out = join(dir, "out3");
      const run = runCli([
        "connect",
        join(dir, "cohort.npy"),
        "--out",
        out,
        "--measure",
        "pearson",
        "--layout",
        "files",
      ]);
      expect(run.status).toBe(0);
      expect(readFileSync(join(out, "manifest.csv"), "utf8")).toBe(
        "id,file,label,split,directed\ncohort-0,matrices/cohort-0.npy,,,false\ncohort-1,matrices/cohort-1.npy,,,false\ncohort-2,matrices/cohort-2.npy,,,false\n",
      );
      const one = loadNpy(join(out, "matrices", "cohort-1.npy"));
      expect(one.shape).toEqual([4, 4]);
      expect(maxDifference(one.values, [expected.stack[1]])).toBeLessThan(1e-12);
    });

    it("fewer time points than channels: the note in subjects.csv points to the shrinkage measure", () => {
      const out = join(dir, "out4");
      expect(runCli(["connect", join(dir, "wide"), "--out", out, "--measure", "spearman"]).status).toBe(0);
      const row = readFileSync(join(out, "subjects.csv"), "utf8").split("\n")[1];
      expect(row).toMatch(
        /^w,w\.csv,ok,9,6,,,"9 columns \(channels\) but 6 lines \(time points\): if the lines are channels, read the file channels-first \| 9 channels but only 6 time points: the spearman matrix is rank-deficient .*the shrinkage partial correlation \(measure ""partial""\)/,
      );
    });
  },
);

describe("connect: bad command lines", () => {
  const dir = scratchFiles({ "r.csv": "1,2\n3,5\n4,4\n" });
  it("exit 2 with the option to fix", () => {
    const cases: [string[], RegExp][] = [
      [[], /--measure is required/],
      [["--measure", "lagged"], /lagged correlation needs --max-lag: the longest lag/],
      [["--measure", "pearson", "--window", "2"], /--window goes with the coactivity measure, not pearson/],
      [["--measure", "coactivity", "--window", "1", "--fisher-z"], /--fisher-z applies to correlations/],
    ];
    for (const [extra, message] of cases) {
      const run = runCli(["connect", join(dir, "r.csv"), "--out", join(dir, "o"), ...extra]);
      expect(run.status).toBe(2);
      expect(run.stderr).toMatch(message);
    }
  });
});

// Common practice for tools that write into a folder: never remove or overwrite files they did not write.
describe("connect: --out is checked before anything is written", () => {
  const dir = scratchFiles({ "r.csv": "1,2\n3,5\n4,4\n2,1\n" });
  const connect = (out: string) =>
    runCli(["connect", join(dir, "r.csv"), "--out", out, "--measure", "pearson"]);

  it("refuses a folder of the user's own files and leaves them as they were", () => {
    const out = join(dir, "mine");
    mkdirSync(out);
    writeFileSync(join(out, "matrices.npy"), "the user's own array");
    writeFileSync(join(out, "ids.txt"), "kept\n");
    const run = connect(out);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(
      /is not a cliquescape connectivity folder \(it has no cliquescape-connect\.json\)/,
    );
    expect(readdirSync(out).sort()).toEqual(["ids.txt", "matrices.npy"]);
    expect(readFileSync(join(out, "matrices.npy"), "utf8")).toBe("the user's own array");
  });

  it("refuses the recordings' own folder", () => {
    const recordings = join(dir, "recs");
    mkdirSync(recordings);
    writeFileSync(join(recordings, "a.csv"), "1,2\n3,5\n4,4\n2,1\n");
    const run = runCli(["connect", recordings, "--out", recordings, "--measure", "pearson"]);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/is the dataset's folder/);
    expect(readdirSync(recordings)).toEqual(["a.csv"]);
  });

  it("writes a new folder, marks it, and writes it again on a second run", () => {
    const out = join(dir, "conn");
    expect(connect(out).status).toBe(0);
    const first = readFileSync(join(out, "matrices.npy"));
    expect(readFileSync(join(out, "cliquescape-connect.json"), "utf8")).toBe(
      '{"kind":"cliquescape connectivity folder","version":1}\n',
    );
    expect(existsSync(join(out, "run.lock"))).toBe(false);
    expect(connect(out).status).toBe(0);
    expect(readFileSync(join(out, "matrices.npy"))).toEqual(first);
  });

  it("exit 75 while another live process holds the folder, naming it", () => {
    const out = join(dir, "busy");
    mkdirSync(out);
    writeFileSync(
      join(out, "cliquescape-connect.json"),
      '{"kind":"cliquescape connectivity folder","version":1}\n',
    );
    const boot = existsSync("/proc/sys/kernel/random/boot_id")
      ? readFileSync("/proc/sys/kernel/random/boot_id", "utf8").trim()
      : null;
    const holder = { pid: process.pid, host: hostname(), started: new Date().toISOString(), boot };
    writeFileSync(join(out, "run.lock"), `${JSON.stringify(holder)}\n`);
    const run = connect(out);
    expect(run.status).toBe(75);
    expect(run.stderr).toContain(String(process.pid));
    expect(existsSync(join(out, "matrices.npy"))).toBe(false);
  });
});
