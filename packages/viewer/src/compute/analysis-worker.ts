/// <reference lib="webworker" />
// The page's computations, off the main thread: reading dropped files with io's parsers, and core's counting,
// barcode, representative loops and participation on the graph being shown.
import { type Barcode, countSimplices, representativeCycle, type WeightedGraph } from "@cliquescape/core";
import { graphFromJson, InputFileError, parseGraphBytes } from "@cliquescape/io/browser";
import { type AnalysisSettings, analyseGraph } from "./graph-analysis.js";
import type {
  OpenedGraph,
  WorkerError,
  WorkerReply,
  WorkerRequest,
  WorkerResult,
} from "./worker-protocol.js";

declare const self: DedicatedWorkerGlobalScope;

let current: { graph: WeightedGraph; barcode: Barcode; settings: AnalysisSettings } | null = null;

self.onmessage = (event: MessageEvent<WorkerRequest & { id: number }>) => {
  const { id, ...request } = event.data;
  try {
    const result = handle(request);
    const reply: WorkerReply = { id, ok: true, result };
    self.postMessage(reply, transferables(result));
  } catch (error) {
    const reply: WorkerReply = { id, ok: false, error: describeError(error) };
    self.postMessage(reply);
  }
};

function handle(request: WorkerRequest): WorkerResult {
  switch (request.kind) {
    case "open-json": {
      const { graph, coordinates } = graphFromJson(request.json, request.source);
      return open(graph, request.settings, coordinates ? planar(coordinates) : null, []);
    }
    case "open-bytes": {
      const { graphs, warnings } = parseGraphBytes(request.bytes, request.name, request.read);
      if (graphs.length > 1) warnings.push(`the file holds ${graphs.length} graphs; showing the first`);
      return open(graphs[0], request.settings, null, warnings);
    }
    case "loop": {
      if (!current) throw new Error("no graph is open");
      return representativeCycle(current.graph, current.barcode, request.bar);
    }
    case "participation": {
      if (!current) throw new Error("no graph is open");
      const { participation } = countSimplices(current.graph, {
        threshold: request.threshold,
        semantics: current.settings.semantics,
        maxDim: current.settings.topDim ?? undefined,
        budget: current.settings.simplexBudget,
        participation: true,
      });
      // Simplices of dimension ≥ 1 through each node: its edges, triangles, tetrahedra, …
      const total = new Float64Array(current.graph.n);
      participation!.member.forEach((row, k) => {
        if (k > 0) for (let v = 0; v < total.length; v++) total[v] += row[v];
      });
      return total;
    }
  }
}

function open(
  graph: WeightedGraph,
  settings: AnalysisSettings,
  coordinates: Float64Array | null,
  warnings: string[],
): OpenedGraph {
  const { analysis, barcode } = analyseGraph(graph, settings);
  current = { graph, barcode, settings };
  return { analysis, coordinates, warnings };
}

/** The first two coordinates of each node: the plane the page draws in. */
function planar(coordinates: { dims: number; values: Float64Array }): Float64Array {
  const n = coordinates.values.length / coordinates.dims;
  const xy = new Float64Array(2 * n);
  for (let v = 0; v < n; v++) {
    xy[2 * v] = coordinates.values[v * coordinates.dims];
    xy[2 * v + 1] = coordinates.values[v * coordinates.dims + 1];
  }
  return xy;
}

function describeError(error: unknown): WorkerError {
  if (error instanceof InputFileError) {
    return {
      name: error.name,
      message: error.message,
      problem: error.problem,
      file: error.file,
      line: error.line,
      column: error.column,
    };
  }
  if (error instanceof Error) return { name: error.name, message: error.message };
  return { name: "Error", message: String(error) };
}

function transferables(result: WorkerResult): Transferable[] {
  if (result instanceof Int32Array || result instanceof Float64Array) return [result.buffer];
  const a = result.analysis;
  return [a.sources, a.targets, a.weights, a.thresholds, a.edgesAt, a.counts, a.euler, a.betti].map(
    (array) => array.buffer,
  );
}
