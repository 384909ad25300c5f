// Probe for issue 11 (see merge-probe.mjs): the cursor merge of the working column, k sorted runs of
// (f64 value, f64 key, i32 coefficient) merged by a binary heap of cursors, equal keys summed mod p.
// Memory: entries at fPtr/keyPtr/coefPtr, run bounds at startPtr/endPtr (i32), the heap after them.
export function merge(
  k: i32,
  fPtr: usize,
  keyPtr: usize,
  coefPtr: usize,
  startPtr: usize,
  endPtr: usize,
  heapPtr: usize,
  hfPtr: usize,
  hkPtr: usize,
  posPtr: usize,
  p: i32,
): f64 {
  // build heap
  let count: i32 = 0;
  for (let r: i32 = 0; r < k; r++) {
    const s = load<i32>(startPtr + ((<usize>r) << 2));
    store<i32>(posPtr + ((<usize>r) << 2), s);
    const f = load<f64>(fPtr + ((<usize>s) << 3));
    const key = load<f64>(keyPtr + ((<usize>s) << 3));
    let i = count++;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      const pf = load<f64>(hfPtr + ((<usize>parent) << 3));
      if (pf < f || (pf === f && load<f64>(hkPtr + ((<usize>parent) << 3)) <= key)) break;
      store<i32>(heapPtr + ((<usize>i) << 2), load<i32>(heapPtr + ((<usize>parent) << 2)));
      store<f64>(hfPtr + ((<usize>i) << 3), pf);
      store<f64>(hkPtr + ((<usize>i) << 3), load<f64>(hkPtr + ((<usize>parent) << 3)));
      i = parent;
    }
    store<i32>(heapPtr + ((<usize>i) << 2), r);
    store<f64>(hfPtr + ((<usize>i) << 3), f);
    store<f64>(hkPtr + ((<usize>i) << 3), key);
  }
  let nonzero: f64 = 0;
  let checksum: f64 = 0;
  while (count > 0) {
    const key = load<f64>(hkPtr);
    const fv = load<f64>(hfPtr);
    let sum: i32 = 0;
    while (count > 0 && load<f64>(hkPtr) === key) {
      let top = load<i32>(heapPtr);
      const pos = load<i32>(posPtr + ((<usize>top) << 2));
      sum += load<i32>(coefPtr + ((<usize>pos) << 2));
      const next = pos + 1;
      store<i32>(posPtr + ((<usize>top) << 2), next);
      let f: f64;
      let k2: f64;
      if (next < load<i32>(endPtr + ((<usize>top) << 2))) {
        f = load<f64>(fPtr + ((<usize>next) << 3));
        k2 = load<f64>(keyPtr + ((<usize>next) << 3));
      } else {
        const last = --count;
        if (last === 0) break;
        top = load<i32>(heapPtr + ((<usize>last) << 2));
        f = load<f64>(hfPtr + ((<usize>last) << 3));
        k2 = load<f64>(hkPtr + ((<usize>last) << 3));
      }
      let i: i32 = 0;
      for (;;) {
        let child = 2 * i + 1;
        if (child >= count) break;
        const right = child + 1;
        const cf = load<f64>(hfPtr + ((<usize>child) << 3));
        if (right < count) {
          const rf = load<f64>(hfPtr + ((<usize>right) << 3));
          if (
            rf < cf ||
            (rf === cf && load<f64>(hkPtr + ((<usize>right) << 3)) < load<f64>(hkPtr + ((<usize>child) << 3)))
          )
            child = right;
        }
        const chf = load<f64>(hfPtr + ((<usize>child) << 3));
        const chk = load<f64>(hkPtr + ((<usize>child) << 3));
        if (f < chf || (f === chf && k2 <= chk)) break;
        store<i32>(heapPtr + ((<usize>i) << 2), load<i32>(heapPtr + ((<usize>child) << 2)));
        store<f64>(hfPtr + ((<usize>i) << 3), chf);
        store<f64>(hkPtr + ((<usize>i) << 3), chk);
        i = child;
      }
      store<i32>(heapPtr + ((<usize>i) << 2), top);
      store<f64>(hfPtr + ((<usize>i) << 3), f);
      store<f64>(hkPtr + ((<usize>i) << 3), k2);
    }
    if (sum % p !== 0) {
      nonzero++;
      checksum += key * <f64>(sum % p) + fv;
    }
  }
  return nonzero * 1e12 + (checksum % 1e9);
}
