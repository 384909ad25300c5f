import { describe, expect, it } from "vitest";
import { handBar as bar, handBarcode } from "../../../../test/support/hand-barcode.js";
import { windowedDiagram } from "./windowed-diagram.js";

// windowedDiagram's own definition, worked by hand: a bar [b, d) becomes [max(b, 0), min(d, span)], left
// out when that is empty; `open` marks bars that go on past the window's end (d > span), essential bars
// included. Positions are the weights themselves here; the window is [0, 6].
describe("windowedDiagram clips bars to the window", () => {
  const barcode = handBarcode(
    [
      bar(0, 0, 3), // another dimension
      bar(1, -2, -1), // wholly before the window
      bar(1, -2, 0), // ends where the window starts: empty
      bar(1, -1, 2), // cut at the start
      bar(1, 1, 6), // dies at the window's end: not open
      bar(1, 2, 8), // goes on past the end
      bar(1, 6, 8), // born at the end: empty
      bar(1, 7, 9), // wholly after the window
      bar(1, 3, null), // essential
    ],
    "distance",
  );
  const identity = (w: number) => w;

  it("keeps the non-empty clipped bars, and marks as open those that go on past the end", () => {
    const cut = windowedDiagram(barcode, 1, identity, 6, "cut");
    expect(Array.from(cut.births)).toEqual([0, 1, 2, 3]);
    expect(Array.from(cut.deaths)).toEqual([2, 6, 6, 6]);
    expect(Array.from(cut.open)).toEqual([0, 0, 1, 1]);
    expect(cut.span).toBe(6);
  });

  it('"drop" leaves the essential bar out, and only it', () => {
    const drop = windowedDiagram(barcode, 1, identity, 6, "drop");
    expect(Array.from(drop.births)).toEqual([0, 1, 2]);
    expect(Array.from(drop.deaths)).toEqual([2, 6, 6]);
    expect(Array.from(drop.open)).toEqual([0, 0, 1]);
  });
});
