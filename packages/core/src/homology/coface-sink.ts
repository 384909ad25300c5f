/** Receives the entries of a coboundary: coface value, coface key, coefficient in 0 .. p-1. */
export interface CofaceSink {
  push(f: number, key: number, coef: number): void;
  /** When set, entries with f > horizon or f ≤ bandLow are dropped by push; producers may skip them early. */
  readonly horizon?: number;
  readonly bandLow?: number;
  /** When set, entries with f < floor are dropped by push (entries at f = floor may still be kept). */
  readonly floor?: number;
}
