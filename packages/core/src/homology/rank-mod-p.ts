import { modP, type PrimeField } from "./prime-field.js";

/**
 * Rank over Z/p of a sparse matrix given column by column: column j has rows `rows[start[j] .. start[j+1])`
 * with coefficients `coefs` (any integers). Plain Gaussian elimination on columns, each reduced against
 * earlier columns by its largest row (common practice).
 */
export function rankModP(
  start: Int32Array,
  rows: Int32Array,
  coefs: Int32Array,
  rowCount: number,
  field: PrimeField,
): number {
  const p = field.p;
  const columns = start.length - 1;
  // Reduced columns that own a pivot row, kept dense only while being reduced.
  const owner = new Int32Array(rowCount).fill(-1);
  const keptRows: Int32Array[] = [];
  const keptCoefs: Int32Array[] = [];
  const work = new Int32Array(rowCount);
  const touched = new Int32Array(rowCount);
  const mark = new Uint8Array(rowCount);
  let rank = 0;
  for (let j = 0; j < columns; j++) {
    let count = 0;
    for (let q = start[j]; q < start[j + 1]; q++) {
      const r = rows[q];
      if (!mark[r]) {
        mark[r] = 1;
        touched[count++] = r;
      }
      work[r] = modP(work[r] + coefs[q], p);
    }
    for (;;) {
      let low = -1;
      for (let t = 0; t < count; t++) if (work[touched[t]] !== 0 && touched[t] > low) low = touched[t];
      if (low < 0) break;
      const o = owner[low];
      if (o < 0) {
        // Keep this column as the owner of row `low`.
        let nz = 0;
        for (let t = 0; t < count; t++) if (work[touched[t]] !== 0) nz++;
        const kr = new Int32Array(nz);
        const kc = new Int32Array(nz);
        let m = 0;
        for (let t = 0; t < count; t++) {
          const r = touched[t];
          if (work[r] !== 0) {
            kr[m] = r;
            kc[m] = work[r];
            m++;
          }
        }
        owner[low] = keptRows.length;
        keptRows.push(kr);
        keptCoefs.push(kc);
        rank++;
        break;
      }
      const or = keptRows[o];
      const oc = keptCoefs[o];
      let pivotCoef = 0;
      for (let t = 0; t < or.length; t++) if (or[t] === low) pivotCoef = oc[t];
      const factor = ((p - work[low]) * field.inverse[pivotCoef]) % p;
      for (let t = 0; t < or.length; t++) {
        const r = or[t];
        if (!mark[r]) {
          mark[r] = 1;
          touched[count++] = r;
        }
        work[r] = (work[r] + factor * oc[t]) % p;
      }
    }
    for (let t = 0; t < count; t++) {
      work[touched[t]] = 0;
      mark[touched[t]] = 0;
    }
  }
  return rank;
}
