/** Receives the entries of a coboundary: coface value, coface key, coefficient in 0 .. p-1. */
export interface CofaceSink {
  push(f: number, key: number, coef: number): void;
}
