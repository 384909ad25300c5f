import { describe, expect, it } from "vitest";
import { errorOf as errorOfKind } from "../../../../test/support/error-of.js";
import { noise, series } from "./connectivity.fixture.js";
import { connectivityMatrix } from "./connectivity-matrix.js";
import { pearsonMatrix } from "./pearson.js";
import { TimeSeriesError } from "./time-series-error.js";

const errorOf = (run: () => unknown) => errorOfKind(run, TimeSeriesError);
const rows = noise(5, 60, 1);
const labels = ["V1", "V2", "MT", "PFC", "ACC"];

describe("connectivityMatrix", () => {
  it("Pearson off the diagonal, 0 on it, symmetric, undirected, never NaN", () => {
    const s = series(rows, labels);
    const c = connectivityMatrix(s, { measure: "pearson" });
    const r = pearsonMatrix(s);
    for (let i = 0; i < 5; i++) {
      for (let j = 0; j < 5; j++) expect(c.values[i * 5 + j]).toBe(i === j ? 0 : r[i * 5 + j]);
    }
    expect([c.directed, c.isolated, c.warnings, c.labels]).toEqual([false, [], [], labels]);
  });

  it("Fisher z is atanh of each correlation; a duplicated channel makes it infinite and is refused", () => {
    const s = series(rows);
    const r = connectivityMatrix(s, { measure: "spearman" }).values;
    const z = connectivityMatrix(s, { measure: "spearman", fisherZ: true }).values;
    expect(Array.from(z)).toEqual(Array.from(r, Math.atanh));
    const e = errorOf(() =>
      connectivityMatrix(series([...rows, rows[1]], [...labels, "copy"]), {
        measure: "pearson",
        fisherZ: true,
      }),
    );
    expect(e.problem).toBe("perfect-correlation");
    expect(e.message).toMatch(/channel 1 \(V2\) and channel 5 \(copy\) correlate perfectly \(1\).*infinite/);
  });

  it("a constant or NaN channel is refused, every one named, with the first one's position", () => {
    const bad = rows.map((row) => row.slice());
    bad[1].fill(2.5);
    bad[3][17] = Number.NaN;
    const e = errorOf(() => connectivityMatrix(series(bad, labels), { measure: "pearson" }));
    expect(e.problem).toBe("constant-channel");
    expect(e.location).toEqual({ channel: 1 });
    expect(e.message).toMatch(
      /^channel 1 \(V2\) is constant \(every value 2\.5\); channel 3 \(PFC\) holds NaN at time point 17; a correlation with such a channel is undefined/,
    );
    bad[1] = rows[1];
    const nan = errorOf(() => connectivityMatrix(series(bad), { measure: "partial" }));
    expect([nan.problem, nan.location]).toEqual(["not-finite", { channel: 3, time: 17 }]);
  });

  it("isolate: the measure of the other channels, bad ones without edges, a warning each", () => {
    const bad = rows.map((row) => row.slice());
    bad[2].fill(0);
    bad[4][0] = Number.POSITIVE_INFINITY;
    const c = connectivityMatrix(series(bad, labels), { measure: "pearson", badChannels: "isolate" });
    const r = pearsonMatrix(series([rows[0], rows[1], rows[3]]));
    const kept = [0, 1, 3];
    for (let i = 0; i < 5; i++) {
      for (let j = 0; j < 5; j++) {
        const a = kept.indexOf(i);
        const b = kept.indexOf(j);
        expect(c.values[i * 5 + j]).toBe(a < 0 || b < 0 || i === j ? 0 : r[a * 3 + b]);
      }
    }
    expect(c.isolated).toEqual([2, 4]);
    expect(c.warnings).toEqual([
      "channel 2 (MT) is constant (every value 0): isolated (no edges)",
      "channel 4 (ACC) holds Infinity at time point 0: isolated (no edges)",
    ]);
  });

  it("fewer time points than channels: a warning that points to the shrinkage measure, which needs none", () => {
    const wide = series(noise(12, 8, 3));
    expect(connectivityMatrix(wide, { measure: "pearson" }).warnings).toEqual([
      '12 channels but only 8 time points: the pearson matrix is rank-deficient (rank at most 7), its entries noisy; the shrinkage partial correlation (measure "partial") is the estimator made for fewer time points than channels',
    ]);
    const partial = connectivityMatrix(wide, { measure: "partial" });
    expect(partial.warnings).toEqual([]);
    expect(partial.shrinkage).toBeGreaterThan(0);
    expect(partial.values.every(Number.isFinite)).toBe(true);
  });

  it("too few time points or channels, and non-count spike data, are refused with what is needed", () => {
    expect(errorOf(() => connectivityMatrix(series(noise(3, 2, 4)), { measure: "pearson" })).message).toBe(
      "only 2 time points; the pearson measure needs at least 3",
    );
    expect(
      errorOf(() => connectivityMatrix(series(noise(3, 6, 4)), { measure: "lagged", maxLag: 4 })).message,
    ).toBe("only 6 time points; lagged correlation up to lag 4 needs at least 7 (3 beyond the longest lag)");
    expect(errorOf(() => connectivityMatrix(series(noise(1, 50, 4)), { measure: "pearson" })).problem).toBe(
      "too-few-channels",
    );
    const spikes = series([
      [0, 1, 0, 2],
      [1, 0, 0.5, 0],
    ]);
    const e = errorOf(() => connectivityMatrix(spikes, { measure: "coactivity", window: 1 }));
    expect([e.problem, e.location]).toEqual(["not-spike-count", { channel: 1, time: 2 }]);
    // A missing value in a spike train is a channel problem, which "isolate" can set aside.
    const gap = series([
      [0, 1, 0, 2, 0, 1],
      [1, 0, Number.NaN, 0, 1, 0],
      [0, 1, 1, 0, 0, 1],
    ]);
    const kept = connectivityMatrix(gap, { measure: "coactivity", window: 1, badChannels: "isolate" });
    expect(kept.isolated).toEqual([1]);
  });

  it("lagged gives a directed matrix with its lags; coactivity a silent channel is named as such", () => {
    const lagged = connectivityMatrix(series(rows), { measure: "lagged", maxLag: 2 });
    expect(lagged.directed).toBe(true);
    expect(lagged.lags?.length).toBe(25);
    const silent = series([
      [0, 1, 0, 0, 1, 0],
      [0, 0, 0, 0, 0, 0],
      [1, 0, 0, 1, 0, 0],
    ]);
    expect(errorOf(() => connectivityMatrix(silent, { measure: "coactivity", window: 1 })).message).toMatch(
      /^channel 1 has no spikes; the tiling coefficient with such a channel is undefined/,
    );
  });

  it("options that do not fit the measure are RangeErrors", () => {
    const s = series(rows);
    expect(() => connectivityMatrix(s, { measure: "lagged" })).toThrow(/needs maxLag: the longest lag/);
    expect(() => connectivityMatrix(s, { measure: "pearson", maxLag: 2 })).toThrow(/goes with the lagged/);
    expect(() => connectivityMatrix(s, { measure: "coactivity", window: 1, fisherZ: true })).toThrow(
      RangeError,
    );
    expect(() => connectivityMatrix(s, { measure: "coactivity", window: -1 })).toThrow(/window/);
    expect(() => connectivityMatrix(s, { measure: "kendall" as "pearson" })).toThrow(/unknown measure/);
  });
});
