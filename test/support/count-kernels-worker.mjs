// Worker thread for the kernel differential test: counts one case with both plain-counting kernels of the
// built core (WebAssembly and TypeScript) and posts both outcomes back, under the caller's time bound.
import { parentPort, workerData } from "node:worker_threads";

const core = await import(workerData.coreUrl);

parentPort.on("message", (task) => {
  try {
    parentPort.postMessage({ index: task.index, result: compare(task) });
  } catch (error) {
    parentPort.postMessage({ index: task.index, error: `${error?.name}: ${error?.message}` });
  }
});
parentPort.postMessage({ ready: true });

/** Counts, truncation and Euler characteristic, or that the budget stopped the count. */
function count(graph, kernel, options) {
  try {
    const r = core.countSimplices(graph, { ...options, kernel });
    return { counts: Array.from(r.counts), truncated: r.truncated, euler: r.euler };
  } catch (error) {
    if (!(error instanceof core.SimplexBudgetError)) throw error;
    return { stopped: true, counted: Array.from(error.counted), progress: error.progress };
  }
}

function compare(task) {
  const graph = core.fromEdgeList(task.graph);
  const options = {
    budget: task.budget,
    ...(task.maxDim === null ? {} : { maxDim: task.maxDim }),
    ...(task.threshold === null ? {} : { threshold: task.threshold, semantics: "distance" }),
  };
  const runs = { plain: both(graph, options) };
  const total = runs.plain.typescript.counts?.reduce((a, b) => a + b, 0);
  if (task.budgetEdges && total !== undefined && total > 0) {
    runs.atTotal = both(graph, { ...options, budget: total });
    runs.belowTotal = both(graph, { ...options, budget: total - 1 });
  }
  return runs;
}

function both(graph, options) {
  return {
    webassembly: count(graph, "webassembly", options),
    typescript: count(graph, "typescript", options),
  };
}
