// Worker thread for the time-bounded differential tests: computes one case per message with the built core
// (packages/core/dist) and posts plain results back. It runs in a thread so that a case that never
// finishes can be cut off (Worker.terminate) instead of stalling the test run.
import { parentPort, workerData } from "node:worker_threads";

const core = await import(workerData.coreUrl);

parentPort.on("message", (task) => {
  try {
    parentPort.postMessage({ index: task.index, result: computeCase(task) });
  } catch (error) {
    parentPort.postMessage({ index: task.index, error: `${error?.name}: ${error?.message}` });
  }
});
parentPort.postMessage({ ready: true });

function computeCase(task) {
  const { graph: input, semantics, prime, thresholds, layouts, rank, simplexLimit } = task;
  const graph = core.fromEdgeList(input);
  // Highest dimension with at most `simplexLimit` simplices up to maxDim + 1 (counted with a budget).
  let maxDim = task.maxDim;
  for (; maxDim > 0; maxDim--) {
    try {
      core.countSimplices(graph, { maxDim: maxDim + 1, budget: simplexLimit });
      break;
    } catch (error) {
      if (!(error instanceof core.SimplexBudgetError)) throw error;
    }
  }
  const barcodes = {};
  // A layout may name a policy of the sweep over bands after a slash ("dense/earlyHandOff").
  for (const layout of layouts) {
    const [name, sweep] = layout.split("/");
    const barcode = core.computeBarcode(graph, {
      semantics,
      maxDim,
      prime,
      ...(graph.directed ? {} : { cliqueLayout: name }),
      ...(sweep === undefined ? {} : { bandSweep: task.sweepPolicies[sweep] }),
    });
    barcodes[layout] = {
      bars: barcode.bars.map((b) => [b.dim, b.birth, b.death, b.birthSimplex, b.deathSimplex]),
      betti: thresholds.map((t) => core.bettiFromBarcode(barcode, t)),
    };
  }
  // Counts up to maxDim + 1, the simplices the barcode sees (a complete digraph has billions above).
  const cap = { maxDim: maxDim + 1 };
  const counts = thresholds.map((threshold) => {
    const c = core.countSimplices(graph, { threshold, semantics, ...cap });
    return { counts: Array.from(c.counts), euler: c.euler, truncated: c.truncated };
  });
  // Per-threshold WebAssembly counts (what "auto" picks for dense graphs against maxDim), and the annotated
  // TypeScript enumeration (the reference) that must give the same.
  const sweep = core.sweepSimplexCounts(graph, core.explicitGrid(thresholds, semantics), {
    ...cap,
    kernel: "webassembly",
  });
  const reference = core.sweepSimplexCounts(graph, core.explicitGrid(thresholds, semantics), {
    ...cap,
    kernel: "typescript",
  });
  // explicitGrid sorts its thresholds into filtration order: report them with their counts.
  const swept = Array.from(sweep.thresholds, (t, i) => ({
    threshold: t,
    counts: Array.from(sweep.counts[i]),
    reference: Array.from(reference.counts[i]),
    euler: [sweep.euler[i], reference.euler[i]],
    truncated: [sweep.truncated, reference.truncated],
  }));
  const ranks = rank
    ? thresholds.map((threshold) => core.bettiAt(graph, { threshold, semantics, maxDim, prime }))
    : null;
  return { maxDim, barcodes, counts, swept, ranks };
}
