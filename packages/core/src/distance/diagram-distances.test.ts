import { describe, expect, it } from "vitest";
import { bottleneckDistance } from "./bottleneck-distance.js";
import { finiteDiagram, type PersistenceDiagram } from "./persistence-diagram.js";
import { wassersteinDistance } from "./wasserstein-distance.js";

const diagram = (points: [number, number][], essential: number[] = []): PersistenceDiagram => ({
  ...finiteDiagram(
    points.map((x) => x[0]),
    points.map((x) => x[1]),
  ),
  essential: Float64Array.from(essential).sort(),
});

// Small cases worked by hand from the definitions (Cohen-Steiner, Edelsbrunner, Harer 2007 for the
// bottleneck distance; the p-Wasserstein distance with L∞ ground distance and the diagonal as a sink).
describe("distances between persistence diagrams, by hand", () => {
  it("a point against nothing costs its distance to the diagonal", () => {
    const a = diagram([[0, 2]]);
    const empty = diagram([]);
    expect(bottleneckDistance(a, empty)).toBe(1);
    expect(wassersteinDistance(a, empty, 1)).toBe(1);
    expect(wassersteinDistance(empty, a, 2)).toBe(1);
    expect(bottleneckDistance(empty, empty)).toBe(0);
  });

  it("two nearby long bars are matched to each other", () => {
    const a = diagram([[0, 4]]);
    const b = diagram([[1, 5]]);
    expect(bottleneckDistance(a, b)).toBe(1);
    expect(wassersteinDistance(a, b, 1)).toBe(1);
  });

  it("when matching costs more than the diagonal, both points go to the diagonal", () => {
    // ‖(0,4) − (3,5)‖∞ = 3; to the diagonal: 2 and 1.
    const a = diagram([[0, 4]]);
    const b = diagram([[3, 5]]);
    expect(bottleneckDistance(a, b)).toBe(2); // max(2, 1) < 3
    expect(wassersteinDistance(a, b, 1)).toBe(3); // 2 + 1 = 3 either way
    expect(wassersteinDistance(a, b, 2)).toBeCloseTo(Math.sqrt(5), 14); // 4 + 1 < 9
  });

  it("picks the cheaper of two crossing assignments", () => {
    const a = diagram([
      [0, 10],
      [20, 30],
    ]);
    const b = diagram([
      [21, 30],
      [0, 11],
    ]);
    expect(wassersteinDistance(a, b, 1)).toBe(2);
    expect(bottleneckDistance(a, b)).toBe(1);
  });

  it("essential classes are matched by birth, and unequal numbers of them are infinitely far", () => {
    const a = diagram([[0, 2]], [0, 5]);
    const b = diagram([[0, 2]], [1, 3]);
    expect(bottleneckDistance(a, b)).toBe(2);
    expect(wassersteinDistance(a, b, 1)).toBe(3);
    expect(bottleneckDistance(a, diagram([[0, 2]], [0]))).toBe(Infinity);
    expect(wassersteinDistance(a, diagram([[0, 2]], [0]), 1)).toBe(Infinity);
  });

  it("refuses p below 1", () => {
    expect(() => wassersteinDistance(diagram([]), diagram([]), 0.5)).toThrow(/p must be/);
  });
});
