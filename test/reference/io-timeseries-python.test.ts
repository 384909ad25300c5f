/**
 * Recordings written by numpy and scipy with their defaults (Debian's python3-numpy, python3-scipy), read
 * back by the time-series readers: every value equals what numpy holds (Python's float repr round-trips
 * float64 exactly), in every layout and container, and the Pearson matrix of what was read equals
 * numpy.corrcoef of the array numpy wrote. Bad recordings get messages with the file and position.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { TimeSeries } from "@cliquescape/core";
import {
  InputFileError,
  openTimeSeriesDataset,
  readDatasetConnectivity,
  readDatasetTimeSeries,
  readTimeSeriesFile,
} from "@cliquescape/io";
import { afterAll, describe, expect, it } from "vitest";
import { errorOf as errorOfKind } from "../support/error-of.js";
import { missingPythonModules, PYTHON } from "../support/python.js";

const errorOf = (run: () => unknown) => errorOfKind(run, InputFileError);
const missing = missingPythonModules(["numpy", "scipy"]);
const dir = mkdtempSync(join(tmpdir(), "cliquescape-ts-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// numpy writes a (T, N) recording x and a (S, T, N) stack in every container; prints x, the stack and
// numpy.corrcoef(x.T) as JSON.
const WRITER = `
import json, sys, numpy as np, scipy.io as sio
d = sys.argv[1]
rng = np.random.default_rng(20261203)
x = rng.standard_normal((50, 4)) @ rng.standard_normal((4, 4)) + 10
stack = rng.standard_normal((3, 40, 4))
np.savetxt(f"{d}/plain.csv", x, delimiter=",")
np.savetxt(f"{d}/named.csv", x, delimiter=",", header="V1,V2,MT,PFC", comments="")
np.savetxt(f"{d}/spaces.txt", x)
np.savetxt(f"{d}/first.tsv", x.T, delimiter="\\t")
np.save(f"{d}/x.npy", x)
np.save(f"{d}/x32.npy", x.astype(np.float32))
np.save(f"{d}/xf.npy", np.asfortranarray(x))
np.save(f"{d}/xT.npy", x.T)
np.save(f"{d}/spikes.npy", rng.random((60, 3)) < 0.2)
np.save(f"{d}/stack.npy", stack)
np.savez_compressed(f"{d}/stack.npz", ts=stack, ages=np.arange(3))
sio.savemat(f"{d}/x.mat", {"ts": x})
sio.savemat(f"{d}/native.mat", {"ts": np.moveaxis(stack, 0, 2)})
sio.savemat(f"{d}/numpystyle.mat", {"ts": stack})
print(json.dumps({"x": x.tolist(), "x32": x.astype(np.float32).astype(float).tolist(),
  "stack": stack.tolist(), "corr": np.corrcoef(x.T).tolist()}))
`;

interface Written {
  x: number[][];
  x32: number[][];
  stack: number[][][];
  corr: number[][];
}

/** The recording as numpy's (T, N) rows. */
function rows(series: TimeSeries): number[][] {
  const T = series.timePoints;
  return Array.from({ length: T }, (_, t) =>
    Array.from({ length: series.channels }, (_, c) => series.values[c * T + t]),
  );
}

describe.skipIf(missing !== null)(
  `recordings written by numpy and scipy${missing ? ` (skipped: ${missing})` : ""}`,
  () => {
    let written: Written;
    const file = (name: string) => join(dir, name);

    it("numpy writes them", () => {
      const run = spawnSync(PYTHON, ["-c", WRITER, dir], { encoding: "utf8" });
      expect(run.stderr).toBe("");
      written = JSON.parse(run.stdout) as Written;
    });

    it("text from numpy.savetxt (comma, whitespace, a header, channels first) equals numpy's array", () => {
      for (const name of ["plain.csv", "named.csv", "spaces.txt"]) {
        const { series } = readTimeSeriesFile(file(name));
        expect(rows(series)).toEqual(written.x);
      }
      expect(readTimeSeriesFile(file("named.csv")).series.labels).toEqual(["V1", "V2", "MT", "PFC"]);
      expect(rows(readTimeSeriesFile(file("first.tsv"), { channelsFirst: true }).series)).toEqual(written.x);
    });

    it(".npy (float64, float32, Fortran order, channels first, bool) and a .mat variable equal numpy's array", () => {
      for (const name of ["x.npy", "xf.npy", "x.mat"])
        expect(rows(readTimeSeriesFile(file(name)).series)).toEqual(written.x);
      expect(rows(readTimeSeriesFile(file("x32.npy")).series)).toEqual(written.x32);
      expect(rows(readTimeSeriesFile(file("xT.npy"), { channelsFirst: true }).series)).toEqual(written.x);
      const spikes = readTimeSeriesFile(file("spikes.npy")).series;
      expect(spikes.values.every((v) => v === 0 || v === 1)).toBe(true);
    });

    it("stacks: .npy and .npz (S, T, N); .mat as MATLAB's T × N × S, or numpy's S × T × N with the channel count stated", () => {
      const cases: [string, object][] = [
        ["stack.npy", {}],
        ["stack.npz", {}],
        ["native.mat", {}],
        ["numpystyle.mat", { channels: 4 }],
      ];
      for (const [name, options] of cases) {
        const dataset = openTimeSeriesDataset(file(name), options);
        expect(dataset.entries.length).toBe(3);
        dataset.entries.forEach((entry, s) => {
          expect(rows(readDatasetTimeSeries(entry, options).series)).toEqual(written.stack[s]);
        });
      }
      // Without a channel count, a .mat stack is read by MATLAB's convention, and the reader says so.
      const [entry] = openTimeSeriesDataset(file("native.mat")).entries;
      expect(readDatasetTimeSeries(entry, {}).warnings[0]).toMatch(
        /^variable of size 40×4×3 read as 3 recordings X\(:,:,s\)/,
      );
      expect(() => openTimeSeriesDataset(file("numpystyle.mat"), { channels: 5 })).toThrow(
        /5 channels were stated but the variable's size is 3×40×4/,
      );
      expect(() => readTimeSeriesFile(file("stack.npy"))).toThrow(/holds 3 recordings; open it as a dataset/);
    });

    it("the Pearson matrix of each file equals numpy.corrcoef of the array numpy wrote, to 1e-12", () => {
      for (const name of ["plain.csv", "x.npy", "x.mat"]) {
        const [entry] = openTimeSeriesDataset(file(name)).entries;
        const { connectivity } = readDatasetConnectivity(entry, {}, { measure: "pearson" });
        const n = connectivity.n;
        for (let i = 0; i < n; i++) {
          for (let j = 0; j < n; j++) {
            const expected = i === j ? 0 : written.corr[i][j];
            expect(Math.abs(connectivity.values[i * n + j] - expected)).toBeLessThan(1e-12);
          }
        }
      }
    });
  },
);

describe("bad recordings: the message names the file and the place", () => {
  const put = (name: string, text: string) => {
    writeFileSync(join(dir, name), text);
    return join(dir, name);
  };
  const entry = (path: string) => openTimeSeriesDataset(path).entries[0];

  it("a constant channel: its column on the first data line; a NaN: its line and column", () => {
    const flat = put("flat.csv", "a,b,c\n1,5,2\n2,5,1\n3,5,7\n4,5,1\n");
    expect(errorOf(() => readDatasetConnectivity(entry(flat), {}, { measure: "pearson" })).message).toBe(
      `${flat}:2:2: channel 1 (b) is constant (every value 5); a correlation with such a channel is undefined. Fix or leave out the channel, or isolate it (bad-channel policy "isolate": the node stays, without edges)`,
    );
    const hole = put("hole.csv", "a,b,c\n1,5,2\n2,6,\n3,5,7\n4,5,1\n");
    const e = errorOf(() => readDatasetConnectivity(entry(hole), {}, { measure: "spearman" }));
    expect([e.problem, e.line, e.column]).toEqual(["not-finite", 3, 3]);
    expect(e.message).toMatch(/hole\.csv:3:3: channel 2 \(c\) holds NaN at time point 1;/);
  });

  it("too few time points, and a wrong channel count, say what is needed", () => {
    const short = put("short.csv", "1,2,3\n4,5,7\n");
    expect(errorOf(() => readDatasetConnectivity(entry(short), {}, { measure: "partial" })).message).toBe(
      `${short}: only 2 time points; the partial measure needs at least 3`,
    );
    const five = put("five.csv", "1,2,3,4,5\n4,5,7,1,0\n1,1,2,3,3\n");
    expect(
      errorOf(() => readDatasetConnectivity(entry(five), { channels: 3 }, { measure: "pearson" })).message,
    ).toBe(
      `${five}:1: 3 channels were stated but lines hold 5 values, i.e. 5 channels (time × channels: columns are channels; if rows are channels, read it channels-first)`,
    );
    // One column more than stated is an index column (time stamps), not a fourth channel.
    const stamped = readDatasetConnectivity(entry(five), { channels: 4 }, { measure: "pearson" });
    expect(stamped.connectivity.n).toBe(4);
  });
});
