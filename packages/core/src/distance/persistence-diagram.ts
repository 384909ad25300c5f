import { toFiltrationValue } from "../filtration/weight-semantics.js";
import type { Barcode } from "../homology/barcode.js";

/**
 * The points of one dimension of a barcode, as distances between diagrams need them: finite points
 * (birth ≤ death, in ascending filtration values so that similarity and distance weights read alike) and,
 * apart, the births of essential classes. Lengths and L∞ distances are the same in filtration values and in
 * weight units (f = ±w).
 */
export interface PersistenceDiagram {
  readonly births: Float64Array;
  readonly deaths: Float64Array;
  /** Births of classes that never die, ascending (empty unless the essential rule is "separate"). */
  readonly essential: Float64Array;
}

/**
 * How bars that never die enter a diagram:
 * - `separate`: kept apart; distances match them among themselves by birth and are infinite when two
 *   diagrams have different numbers of them (the definition of Cohen-Steiner, Edelsbrunner, Harer 2007);
 * - `cut`: they end at the weight `at` (a bar born after `at` is left out);
 * - `drop`: they are left out.
 */
export type EssentialRule =
  | { readonly kind: "separate" }
  | { readonly kind: "drop" }
  | { readonly kind: "cut"; readonly at: number };

/** The bars a diagram is read from: a Barcode, or a barcode file's bars and weight semantics. */
export interface BarsOf {
  readonly semantics: Barcode["semantics"];
  readonly bars: readonly { readonly dim: number; readonly birth: number; readonly death: number | null }[];
}

/** The diagram of the bars of dimension `dim`, essential bars handled by `rule`. */
export function diagramOf(barcode: BarsOf, dim: number, rule: EssentialRule): PersistenceDiagram {
  const { semantics } = barcode;
  const births: number[] = [];
  const deaths: number[] = [];
  const essential: number[] = [];
  const cutF = rule.kind === "cut" ? toFiltrationValue(rule.at, semantics) : 0;
  for (const bar of barcode.bars) {
    if (bar.dim !== dim) continue;
    const b = toFiltrationValue(bar.birth, semantics);
    if (bar.death !== null) {
      births.push(b);
      deaths.push(toFiltrationValue(bar.death, semantics));
    } else if (rule.kind === "separate") essential.push(b);
    else if (rule.kind === "cut" && cutF > b) {
      births.push(b);
      deaths.push(cutF);
    }
  }
  return {
    births: Float64Array.from(births),
    deaths: Float64Array.from(deaths),
    essential: Float64Array.from(essential).sort(),
  };
}

/** A diagram of finite points only (births[i] ≤ deaths[i] expected). */
export function finiteDiagram(births: ArrayLike<number>, deaths: ArrayLike<number>): PersistenceDiagram {
  if (births.length !== deaths.length) throw new RangeError("births and deaths differ in length");
  for (let i = 0; i < births.length; i++) {
    if (!(Number.isFinite(births[i]) && Number.isFinite(deaths[i]) && births[i] <= deaths[i]))
      throw new RangeError(`point ${i} (${births[i]}, ${deaths[i]}) is not a finite birth ≤ death`);
  }
  return {
    births: Float64Array.from(births),
    deaths: Float64Array.from(deaths),
    essential: new Float64Array(0),
  };
}
