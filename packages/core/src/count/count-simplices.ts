import { edgeFiltration } from "../filtration/edge-filtration.js";
import { toFiltrationValue, type WeightSemantics } from "../filtration/weight-semantics.js";
import type { WeightedGraph } from "../graph/weighted-graph.js";
import { WorkMonitor } from "../work/work-monitor.js";
import { enumerateAnnotated } from "./annotated-enumerator.js";
import { countWithBitsets } from "./bitset-counter.js";
import { resolveLimits } from "./count-limits.js";
import { buildEnumerationGraph, reverseSlots } from "./enumeration-graph.js";
import { eulerCharacteristic } from "./euler.js";
import type { CountOptions, SimplexCounts } from "./types.js";
import { countWithWasm } from "./wasm/wasm-counter.js";

export interface CountSimplicesOptions extends CountOptions {
  /** Keep only edges present at this threshold (user units); no threshold = all edges. */
  threshold?: number;
  /** How to read `threshold`; required with it. */
  semantics?: WeightSemantics;
  /** Per-node counts per dimension (directed graphs also get source and sink counts). */
  participation?: boolean;
  /** Per-edge-slot counts per dimension. */
  edgeParticipation?: boolean;
  /**
   * Which implementation counts plain simplices (no participation): "webassembly" (64-bit words), or
   * "typescript" (the reference). Default "auto": WebAssembly where the runtime provides it, TypeScript
   * otherwise. Both give identical results.
   */
  kernel?: "auto" | "webassembly" | "typescript";
}

/**
 * Number of k-simplices of the clique complex (undirected graph) or directed flag complex (directed
 * graph) for every k, at one threshold or with all edges. Plain counts take the bitset fast path;
 * participation takes the annotated enumeration. Nothing is stored.
 */
export function countSimplices(graph: WeightedGraph, options: CountSimplicesOptions = {}): SimplexCounts {
  const { maxDim, budget } = resolveLimits(options);
  let mask: Int32Array | null = null;
  if (options.threshold !== undefined) {
    if (options.semantics === undefined)
      throw new TypeError("a threshold needs semantics: 'distance' or 'similarity'");
    if (Number.isNaN(options.threshold)) throw new RangeError("the threshold is NaN");
    const cut = toFiltrationValue(options.threshold, options.semantics);
    const f = edgeFiltration(graph, options.semantics);
    mask = new Int32Array(f.length);
    for (let s = 0; s < f.length; s++) mask[s] = f[s] <= cut ? 0 : -1;
  }
  const g = buildEnumerationGraph(graph, mask);
  const monitor = new WorkMonitor(options);
  monitor.begin("counting simplices", 0, g.n);
  const participation = options.participation === true;
  const edgeParticipation = options.edgeParticipation === true;
  if (!participation && !edgeParticipation) {
    const kernel = options.kernel ?? "auto";
    if (kernel !== "auto" && kernel !== "webassembly" && kernel !== "typescript")
      throw new RangeError(`kernel must be "auto", "webassembly" or "typescript", got ${String(kernel)}`);
    const plain =
      (kernel === "typescript" ? null : countWithWasm(g, maxDim, budget, monitor)) ??
      (kernel === "webassembly" ? kernelMissing() : countWithBitsets(g, maxDim, budget, monitor));
    const { counts, truncated } = plain;
    return { counts, euler: eulerCharacteristic(counts), truncated };
  }
  const r = enumerateAnnotated(g, {
    maxDim,
    budget,
    monitor,
    bins: null,
    binCount: 1,
    participation,
    edgeParticipation,
    slotCount: graph.targets.length,
    reverse: edgeParticipation && !graph.directed ? reverseSlots(graph) : null,
  });
  const counts = Float64Array.from(r.hist, (row) => row[0]);
  const result: SimplexCounts = { counts, euler: eulerCharacteristic(counts), truncated: r.truncated };
  if (participation) {
    result.participation = graph.directed
      ? { member: r.member!, source: r.source!, sink: r.sink! }
      : { member: r.member! };
  }
  if (edgeParticipation) result.edgeParticipation = r.edges!;
  return result;
}

function kernelMissing(): never {
  throw new Error(
    "the WebAssembly counting kernel is not available here, or its memory cannot hold this graph's tables " +
      '(kernel: "webassembly" was asked for; "auto" would count in TypeScript)',
  );
}
