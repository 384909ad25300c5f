import { InputFileError } from "../input-file-error.js";
import { classifyCell, looksNumeric } from "../parse-number.js";
import { DEFAULT_MAX_CELLS } from "../read-options.js";
import { detectDelimiter, type TextRow, tableRows } from "../text-rows.js";
import { checkChannelCount, givenLabels, timeSeriesOf } from "./time-series-layout.js";
import type { TimeSeriesReadOptions, TimeSeriesReadResult } from "./time-series-read-options.js";

/**
 * Reads a recording written as text (CSV, TSV, semicolon- or whitespace-separated): one time point per line
 * and one channel per column, or the other way round with `channelsFirst`. A header line of names (channel
 * names, or time-point names when channels come first) is detected; so is an index column of time stamps
 * (an empty corner cell above it, or one column more than `channels`). Empty cells, NaN and NA are missing
 * values, kept as NaN so the quality check can name the channel and time point; text is an error here.
 */
export function parseTimeSeriesText(
  text: string,
  file: string,
  options: TimeSeriesReadOptions = {},
): TimeSeriesReadResult {
  const { first: top, rest: rows } = tableRows(text, options.delimiter ?? detectDelimiter(text), file);
  let next: IteratorResult<TextRow> = { done: false, value: top };
  const hasHeader = options.header ?? isHeaderRow(next.value.cells);
  let header: TextRow | undefined;
  if (hasHeader) {
    header = next.value;
    next = rows.next();
    if (next.done) throw new InputFileError(file, "empty-file", "file has a header line but no data lines");
  }
  const first = next.value;
  const width = first.cells.length;
  const channelsFirst = options.channelsFirst ?? false;
  const skip = leadingColumn(first, header, width, options) ? 1 : 0;
  const perRow = width - skip;
  if (perRow < 1) throw new InputFileError(file, "ragged-row", "lines hold no values", { line: first.line });
  if (!channelsFirst)
    checkChannelCount(perRow, options, file, `lines hold ${describeColumns(perRow, skip)}`, {
      line: first.line,
    });

  const maxCells = options.maxCells ?? DEFAULT_MAX_CELLS;
  let values = new Float64Array(Math.min(maxCells, perRow * 1024));
  const lines: number[] = [];
  const rowNames: string[] = [];
  let count = 0;
  for (; !next.done; next = rows.next()) {
    const { line, cells } = next.value;
    if (cells.length !== width) {
      throw new InputFileError(
        file,
        "ragged-row",
        `line has ${cells.length} cells but line ${first.line} has ${width}`,
        {
          line,
        },
      );
    }
    if (count + perRow > maxCells) {
      throw new InputFileError(
        file,
        "too-large",
        `more than the limit of ${maxCells} values; raise maxCells if you have the memory`,
        { line },
      );
    }
    if (count + perRow > values.length) {
      const grown = new Float64Array(Math.min(maxCells, 2 * values.length + perRow));
      grown.set(values);
      values = grown;
    }
    lines.push(line);
    if (skip) rowNames.push(cells[0]);
    for (let k = 0; k < perRow; k++) {
      const raw = cells[k + skip];
      const cell = classifyCell(raw);
      if (cell.kind === "text") {
        throw new InputFileError(file, "not-a-number", `${JSON.stringify(raw)} is not a number`, {
          line,
          column: k + skip + 1,
        });
      }
      values[count++] = cell.kind === "empty" ? Number.NaN : cell.value;
    }
  }
  const rowCount = lines.length;
  if (channelsFirst) {
    checkChannelCount(
      rowCount,
      options,
      file,
      `the file has ${rowCount} data line${rowCount === 1 ? "" : "s"} (channels first: one per channel)`,
      {},
    );
  }
  const labels = channelLabels(file, channelsFirst, header, skip, perRow, rowNames, lines, options.labels);
  const [timePoints, channels] = channelsFirst ? [perRow, rowCount] : [rowCount, perRow];
  const series = timeSeriesOf(values.subarray(0, count), rowCount, perRow, channelsFirst, labels);
  const warnings: string[] = [];
  if (!channelsFirst && options.channels === undefined && timePoints < channels) {
    warnings.push(
      `${channels} columns (channels) but ${timePoints} lines (time points): if the lines are channels, read the file channels-first`,
    );
  }
  const place = channelsFirst
    ? (time: number, channel: number) => ({ line: lines[channel], column: time + skip + 1 })
    : (time: number, channel: number) => ({ line: lines[time], column: channel + skip + 1 });
  return { series, warnings, place };
}

/** A header names things: every cell after a possible empty corner cell is non-numeric text. */
function isHeaderRow(cells: readonly string[]): boolean {
  const named = cells[0] === "" && cells.length > 1 ? cells.slice(1) : cells;
  return named.every((cell) => cell !== "" && !looksNumeric(cell));
}

/**
 * Whether the first column is not data: time × channels, an index column (time stamps); channels first, a
 * column of channel names.
 */
function leadingColumn(
  first: TextRow,
  header: TextRow | undefined,
  width: number,
  options: TimeSeriesReadOptions,
): boolean {
  if (options.channelsFirst) return first.cells[0] !== "" && !looksNumeric(first.cells[0]);
  if (options.indexColumn !== undefined) return options.indexColumn;
  if (header && header.cells[0] === "" && header.cells.length === width) return true;
  return options.channels !== undefined && width === options.channels + 1;
}

function describeColumns(perRow: number, skip: number): string {
  return `${perRow} value${perRow === 1 ? "" : "s"}${skip ? " after an index column" : ""}`;
}

/** Channel names: the header (time × channels), the name column (channels first), or the options. */
function channelLabels(
  file: string,
  channelsFirst: boolean,
  header: TextRow | undefined,
  skip: number,
  perRow: number,
  rowNames: readonly string[],
  lines: readonly number[],
  given: readonly string[] | undefined,
): readonly string[] | undefined {
  let names: readonly string[] | undefined;
  let at: (k: number) => { line: number; column: number };
  if (channelsFirst) {
    if (skip) names = rowNames;
    at = (k) => ({ line: lines[k], column: 1 });
  } else {
    if (header) {
      const cells = header.cells.length === perRow + skip ? header.cells.slice(skip) : header.cells;
      if (cells.length !== perRow) {
        throw new InputFileError(
          file,
          "bad-labels",
          `the header names ${header.cells.length} columns but lines hold ${perRow + skip}`,
          { line: header.line },
        );
      }
      names = cells;
    }
    const offset = header && header.cells.length === perRow ? 1 : skip + 1;
    at = (k) => ({ line: header?.line ?? 0, column: k + offset });
  }
  if (!names) return givenLabels(given, channelsFirst ? lines.length : perRow, file);
  const seen = new Map<string, number>();
  names.forEach((name, k) => {
    const before = seen.get(name);
    if (before !== undefined) {
      throw new InputFileError(
        file,
        "bad-labels",
        `channel name ${JSON.stringify(name)} appears twice (channels ${before} and ${k})`,
        at(k),
      );
    }
    seen.set(name, k);
  });
  return names;
}
