import type { WorkMonitor } from "../../work/work-monitor.js";
import { type PlainCounts, plainBudgetError } from "../bitset-counter.js";
import { writeBreadthFirstOrder } from "../breadth-first-order.js";
import { CHECK_EVERY } from "../count-limits.js";
import type { EnumerationGraph } from "../enumeration-graph.js";
import { countKernel, discardKernel, setKernelCheckpoint } from "./count-kernel.js";

/** Roots per call into the kernel: the clock is checked between calls (and at every checkpoint). */
const ROOTS_PER_CALL = 256;
/** Kernel memory kept for the next count; a count that needed more gets a fresh instance afterwards. */
const KEEP_BYTES = 64 * 2 ** 20;
const PAGE = 65536;

/**
 * Plain simplex counting in the WebAssembly kernel: the same counts, truncation flag, budget errors and
 * time-limit checks as countWithBitsets (the TypeScript counter). Returns null when the kernel is not
 * available or its memory cannot hold this graph's tables, so the caller can run the TypeScript counter.
 */
export function countWithWasm(
  g: EnumerationGraph,
  maxDim: number,
  budget: number,
  work: WorkMonitor,
): PlainCounts | null {
  const kernel = countKernel();
  if (kernel === null) return null;
  const { n, offsets, targets, maxList } = g;
  const dmax = Math.max(maxList, 1);
  const W = (dmax + 63) >>> 6;
  const capDim = Math.min(maxDim, dmax + 1);
  const levels = Math.min(dmax, capDim) + 4;
  // memory layout (byte offsets), 8-byte aligned; the table at 0 tells the kernel where each part is
  const at = { next: 72 };
  const take = (bytes: number) => {
    const start = at.next;
    at.next += Math.ceil(bytes / 8) * 8;
    return start;
  };
  const STATE = take(3 * 8);
  const BINOM = take(65 * 65 * 8);
  const MEMBER = take(64 * 4);
  const FOUR = take(4096 * 4);
  const PACKED = take(64 * 8);
  const CNT = take((capDim + 2) * 8);
  const KIDS = take(levels * 1024);
  const PACKED_INDEX = take(W * 64 * 4);
  const STACK = take(levels * W * 8);
  const LOC = take(dmax * W * 8);
  const REPACKED = take(dmax * W * 8);
  const OFFSETS = take((n + 1) * 4);
  const TARGETS = take(targets.length * 4);
  const MARK = take(n * 4);
  const end = at.next;
  if (end > 2 ** 32 - PAGE) return null;
  const have = kernel.memory.buffer.byteLength;
  if (end > have) {
    try {
      kernel.memory.grow(Math.ceil((end - have) / PAGE));
    } catch {
      discardKernel();
      return null; // no room for another few hundred MiB: the TypeScript counter needs less
    }
  }
  const buf = kernel.memory.buffer;
  const cnt = new Float64Array(buf, CNT, capDim + 2).fill(0);
  const state = new Float64Array(buf, STATE, 3); // simplices so far, next checkpoint, current root
  const kernelOffsets = new Int32Array(buf, OFFSETS, n + 1);
  const kernelTargets = new Int32Array(buf, TARGETS, targets.length);
  if (g.directed) {
    // roots and lists in breadth-first order, for locality (roots then count in that order)
    writeBreadthFirstOrder(n, offsets, targets, kernelOffsets, kernelTargets);
  } else {
    // undirected: the degeneracy numbering must stay (rows hold later members only)
    kernelOffsets.set(offsets.subarray(0, n + 1));
    kernelTargets.set(targets);
  }
  new Int32Array(buf, MARK, n).fill(-1);
  let truncated = false;
  cnt[0] = n;
  if (capDim >= 1) cnt[1] = offsets[n];
  else truncated = offsets[n] > 0;
  state[0] = n + (capDim >= 1 ? offsets[n] : 0);
  state[1] = 0;
  state[2] = -1;
  const passCheckpoint = (depth: number) => {
    if (state[0] > budget)
      throw plainBudgetError(budget, cnt, kernelOffsets, n, state[2], depth === 1, capDim);
    work.check(state[2] + 1);
    state[1] = Math.min(budget, state[0] + CHECK_EVERY);
  };
  const table = new Int32Array(buf, 0, 17);
  table.set([
    OFFSETS,
    TARGETS,
    MARK,
    LOC,
    STACK,
    REPACKED,
    PACKED_INDEX,
    PACKED,
    MEMBER,
    KIDS,
    CNT,
    STATE,
    BINOM,
  ]);
  table[13] = capDim;
  table[14] = g.directed ? 0 : 1;
  table[15] = truncated ? 1 : 0;
  table[16] = FOUR;
  kernel.setup();
  setKernelCheckpoint(passCheckpoint);
  try {
    if (state[0] > state[1]) passCheckpoint(0);
    for (let v = 0; v < n; v += ROOTS_PER_CALL) {
      work.check(v);
      kernel.countRoots(v, Math.min(n, v + ROOTS_PER_CALL));
    }
    truncated = kernel.isTruncated() !== 0;
    let top = cnt.length - 1;
    while (top > 0 && cnt[top] === 0) top--;
    return { counts: cnt.slice(0, n === 0 ? 0 : top + 1), truncated };
  } finally {
    setKernelCheckpoint(() => {});
    if (kernel.memory.buffer.byteLength > KEEP_BYTES) discardKernel();
  }
}
