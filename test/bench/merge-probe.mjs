// Probe for issue 11: the working column's cursor merge (a binary heap of cursors over sorted runs of
// (value, key, coefficient), equal keys summed mod p) timed in JavaScript and in WebAssembly on the same
// seeded runs, to see what moving the reduction's pivot search to WebAssembly could gain before doing it.
// The WebAssembly side is merge-probe.as.ts, compiled here with the project's AssemblyScript.
//   node test/bench/merge-probe.mjs [RUNS] [ENTRIES_PER_RUN]
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { seededRandom } from "./random.mjs";

const asc = (await import("assemblyscript/asc")).default;
const temp = mkdtempSync(join(tmpdir(), "cliquescape-merge-probe-"));
const wasmFile = join(temp, "merge.wasm");
const source = fileURLToPath(new URL("./merge-probe.as.ts", import.meta.url));
const compiled = await asc.main([
  source,
  "-O3",
  "--noAssert",
  "--runtime",
  "stub",
  "--importMemory",
  "--outFile",
  wasmFile,
]);
if (compiled.error) throw compiled.error;
const bytes = readFileSync(wasmFile);
rmSync(temp, { recursive: true, force: true });
const k = Number(process.argv[2] ?? 300),
  per = Number(process.argv[3] ?? 3000),
  p = 2;
const rnd = seededRandom(12345);
// a pool of entries; each run draws from it so keys repeat across runs (about 5.7 copies on average)
const poolSize = Math.round((k * per) / 5.7);
const poolF = new Float64Array(poolSize),
  poolK = new Float64Array(poolSize);
for (let i = 0; i < poolSize; i++) {
  poolF[i] = Math.floor(rnd() * 20000) / 20000;
  poolK[i] = Math.floor(rnd() * 6.4e7);
}
const M = k * per;
const f = new Float64Array(M),
  key = new Float64Array(M),
  coef = new Int32Array(M),
  start = new Int32Array(k),
  end = new Int32Array(k);
for (let r = 0; r < k; r++) {
  start[r] = r * per;
  end[r] = (r + 1) * per;
  const idx = Array.from({ length: per }, () => Math.floor(rnd() * poolSize));
  idx.sort((a, b) => poolF[a] - poolF[b] || poolK[a] - poolK[b]);
  for (let j = 0; j < per; j++) {
    f[r * per + j] = poolF[idx[j]];
    key[r * per + j] = poolK[idx[j]];
    coef[r * per + j] = 1;
  }
}
function mergeJs() {
  const heap = new Int32Array(k),
    hf = new Float64Array(k),
    hk = new Float64Array(k),
    pos = new Int32Array(k);
  let count = 0;
  for (let r = 0; r < k; r++) {
    const s = start[r];
    pos[r] = s;
    const fv = f[s],
      kv = key[s];
    let i = count++;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      const pf = hf[parent];
      if (pf < fv || (pf === fv && hk[parent] <= kv)) break;
      heap[i] = heap[parent];
      hf[i] = pf;
      hk[i] = hk[parent];
      i = parent;
    }
    heap[i] = r;
    hf[i] = fv;
    hk[i] = kv;
  }
  let nonzero = 0,
    checksum = 0;
  while (count > 0) {
    const kk = hk[0],
      fv0 = hf[0];
    let sum = 0;
    while (count > 0 && hk[0] === kk) {
      let top = heap[0];
      const ps = pos[top];
      sum += coef[ps];
      const next = ps + 1;
      pos[top] = next;
      let fv, kv;
      if (next < end[top]) {
        fv = f[next];
        kv = key[next];
      } else {
        const last = --count;
        if (last === 0) break;
        top = heap[last];
        fv = hf[last];
        kv = hk[last];
      }
      let i = 0;
      for (;;) {
        let child = 2 * i + 1;
        if (child >= count) break;
        const right = child + 1;
        if (right < count && (hf[right] < hf[child] || (hf[right] === hf[child] && hk[right] < hk[child])))
          child = right;
        const cf = hf[child];
        if (fv < cf || (fv === cf && kv <= hk[child])) break;
        heap[i] = heap[child];
        hf[i] = cf;
        hk[i] = hk[child];
        i = child;
      }
      heap[i] = top;
      hf[i] = fv;
      hk[i] = kv;
    }
    if (sum % p !== 0) {
      nonzero++;
      checksum += kk * (sum % p) + fv0;
    }
  }
  return nonzero * 1e12 + (checksum % 1e9);
}
const need = M * 20 + k * 36 + 1024;
const memory = new WebAssembly.Memory({ initial: Math.ceil(need / 65536) + 1 });
const { instance } = await WebAssembly.instantiate(bytes, {
  env: {
    memory,
    abort() {
      throw new Error("abort");
    },
  },
});
const buf = memory.buffer;
let at = 1024;
const take = (b) => {
  const s = at;
  at += Math.ceil(b / 8) * 8;
  return s;
};
const fP = take(M * 8),
  kP = take(M * 8),
  cP = take(M * 4),
  sP = take(k * 4),
  eP = take(k * 4),
  hP = take(k * 4),
  hfP = take(k * 8),
  hkP = take(k * 8),
  pP = take(k * 4);
new Float64Array(buf, fP, M).set(f);
new Float64Array(buf, kP, M).set(key);
new Int32Array(buf, cP, M).set(coef);
new Int32Array(buf, sP, k).set(start);
new Int32Array(buf, eP, k).set(end);
const mergeWasm = () => instance.exports.merge(k, fP, kP, cP, sP, eP, hP, hfP, hkP, pP, p);
const time = (fn) => {
  const t = process.cpuUsage();
  const r = fn();
  const u = process.cpuUsage(t);
  return [r, (u.user + u.system) / 1000];
};
for (let round = 0; round < 5; round++) {
  const [a, ta] = time(mergeJs);
  const [b, tb] = time(mergeWasm);
  console.log(
    `k=${k} entries=${M} js ${ta.toFixed(0)} ms, wasm ${tb.toFixed(0)} ms, ratio ${(ta / tb).toFixed(2)}, same ${a === b}`,
  );
}
