import { describe, expect, it } from "vitest";
import { errorOf as errorOfKind } from "../../../../test/support/error-of.js";
import { InputFileError } from "../input-file-error.js";
import { parseTimeSeriesText } from "./parse-time-series-text.js";

const errorOf = (run: () => unknown) => errorOfKind(run, InputFileError);
const channel = (s: { values: Float64Array; timePoints: number }, c: number) =>
  Array.from(s.values.subarray(c * s.timePoints, (c + 1) * s.timePoints));

describe("parseTimeSeriesText", () => {
  it("time × channels with a header of channel names (the default layout)", () => {
    const { series, warnings, place } = parseTimeSeriesText(
      "V1,V2,MT\n1,2,3\n4,5,6.5\n7,8,9\n-1,0,1e-3\n",
      "r.csv",
    );
    expect([series.channels, series.timePoints, series.labels]).toEqual([3, 4, ["V1", "V2", "MT"]]);
    expect(channel(series, 2)).toEqual([3, 6.5, 9, 0.001]);
    expect(warnings).toEqual([]);
    expect(place(1, 2)).toEqual({ line: 3, column: 3 });
  });

  it("an index column under an empty corner cell (numpy/pandas style) is skipped", () => {
    const { series, place } = parseTimeSeriesText(",a,b\n0.0,1,2\n0.5,3,5\n1.0,4,4\n", "r.csv");
    expect([series.channels, series.labels, channel(series, 1)]).toEqual([2, ["a", "b"], [2, 5, 4]]);
    expect(place(2, 0)).toEqual({ line: 4, column: 2 });
  });

  it("a stated channel count tells a named time column apart, and checks the count", () => {
    const text = "time,a,b\n0,1,2\n1,3,5\n2,4,4\n";
    expect(parseTimeSeriesText(text, "r.csv", { channels: 2 }).series.labels).toEqual(["a", "b"]);
    expect(parseTimeSeriesText(text, "r.csv").series.labels).toEqual(["time", "a", "b"]);
    const e = errorOf(() => parseTimeSeriesText("1 2 3\n4 5 6\n", "r.txt", { channels: 4 }));
    expect([e.problem, e.message]).toEqual([
      "channel-count",
      "r.txt:1: 4 channels were stated but lines hold 3 values, i.e. 3 channels (time × channels: columns are channels; if rows are channels, read it channels-first)",
    ]);
  });

  it("channels first: one line per channel, an optional name column and time header", () => {
    const text = "#comment\n,t0,t1,t2,t3\nV1,1,2,3,4\nV2,0,1,0,1\n";
    const { series, place } = parseTimeSeriesText(text, "r.csv", { channelsFirst: true });
    expect([series.channels, series.timePoints, series.labels]).toEqual([2, 4, ["V1", "V2"]]);
    expect(channel(series, 1)).toEqual([0, 1, 0, 1]);
    expect(place(3, 1)).toEqual({ line: 4, column: 5 });
    const e = errorOf(() => parseTimeSeriesText(text, "r.csv", { channelsFirst: true, channels: 3 }));
    expect(e.message).toBe(
      "r.csv: 3 channels were stated but the file has 2 data lines (channels first: one per channel), i.e. 2 channels (channels first: rows are channels)",
    );
  });

  it("missing values (empty, NaN, NA) are kept as NaN for the quality check; text and ragged lines are errors", () => {
    const { series } = parseTimeSeriesText("a\tb\n1\t\n2\tNaN\nNA\t3\n", "r.tsv");
    expect(channel(series, 0)).toEqual([1, 2, Number.NaN]);
    expect(channel(series, 1)).toEqual([Number.NaN, Number.NaN, 3]);
    expect(errorOf(() => parseTimeSeriesText("1,2\n3,x\n", "r.csv")).message).toBe(
      'r.csv:2:2: "x" is not a number',
    );
    expect(errorOf(() => parseTimeSeriesText("1,2\n3\n", "r.csv")).message).toBe(
      "r.csv:2: line has 1 cells but line 1 has 2",
    );
  });

  it("more channels than time points: a hint that the file may be channels-first", () => {
    expect(parseTimeSeriesText("1,2,3\n4,5,7\n", "r.csv").warnings).toEqual([
      "3 columns (channels) but 2 lines (time points): if the lines are channels, read the file channels-first",
    ]);
  });

  it("refuses repeated channel names, a header without data, an empty file and too many values", () => {
    expect(errorOf(() => parseTimeSeriesText("a,b,a\n1,2,3\n", "r.csv")).message).toBe(
      'r.csv:1:3: channel name "a" appears twice (channels 0 and 2)',
    );
    expect(errorOf(() => parseTimeSeriesText("a,b\n", "r.csv")).problem).toBe("empty-file");
    expect(errorOf(() => parseTimeSeriesText("", "r.csv")).message).toBe("r.csv: file is empty");
    expect(errorOf(() => parseTimeSeriesText("1,2\n3,4\n5,6\n", "r.csv", { maxCells: 5 })).message).toBe(
      "r.csv:3: more than the limit of 5 values; raise maxCells if you have the memory",
    );
  });
});
