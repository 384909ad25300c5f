import { readFileSync } from "node:fs";
import { basename, dirname, isAbsolute, resolve } from "node:path";
import {
  type DatasetEntry,
  type GraphJson,
  graphToJson,
  hashFile,
  openDataset,
  readCoordinates,
} from "@cliquescape/io";
import { readSpecFile, validateSpec } from "../extract/load-spec.js";
import { readPreparedGraph } from "../extract/read-prepared-graph.js";
import { runFolder } from "../extract/run-folder.js";
import type { RunSpec } from "../extract/run-spec.js";
import { tableSetProblem } from "../extract/table-set.js";
import { loadGraph } from "../load-graph.js";
import { type ComplexOptions, homologyDimOf } from "../options/complex-options.js";
import { type GraphOptions, UsageError } from "../options/graph-options.js";
import { fileInside } from "./inside-folder.js";

/**
 * What `view` serves and `report` writes: the session the page opens with (the shape the page reads in
 * packages/viewer/src/session/page-session.ts), and for a run folder its graphs by id.
 */
export interface ViewTarget {
  /** A run folder, or the one graph file. */
  kind: "run" | "graph";
  /** The folder, or the file, the user gave: nothing outside it is served by path. */
  root: string;
  session: unknown;
  graphIds: string[];
  /** A run's graph in the page's JSON form, read and prepared as the run's spec says. */
  graph(id: string): GraphJson;
}

export interface ViewOptions {
  graph: GraphOptions;
  complex: ComplexOptions;
  /** Node coordinates for a single graph file. */
  coords?: string;
  /** Where a run's dataset is, when the path in its spec does not lead there from here. */
  dataset?: string;
}

/** The run files the page reads; errors.csv is optional. */
const RUN_FILES = ["spec.json", "features.csv", "errors.csv"];

/** A run folder (it holds spec.json) or a single graph file. */
export function openViewTarget(path: string, options: ViewOptions): ViewTarget {
  const root = resolve(path);
  if (fileInside(root, "spec.json")) return runTarget(root, options);
  return graphTarget(path, options);
}

function graphTarget(path: string, options: ViewOptions): ViewTarget {
  const { graph } = loadGraph(path, options.graph);
  const coordinates = options.coords ? readCoordinates(options.coords, graph) : undefined;
  const { topDim, prime } = options.complex;
  return {
    kind: "graph",
    root: resolve(path),
    graphIds: [],
    session: {
      kind: "graph",
      name: basename(path),
      settings: {
        semantics: options.graph.preparation.weights,
        topDim: topDim ?? null,
        maxHomologyDim: homologyDimOf(options.complex),
        prime,
      },
      graph: graphToJson(graph, coordinates),
    },
    graph: () => {
      throw new UsageError("a single graph file has no graphs by id");
    },
  };
}

function runTarget(root: string, options: ViewOptions): ViewTarget {
  const unfinished = tableSetProblem(runFolder(root));
  if (unfinished !== null)
    throw new UsageError(
      `${root}: the tables are not a whole set (${unfinished}); run the same extract command again to rewrite them`,
    );
  const files: Record<string, string> = {};
  for (const name of RUN_FILES) {
    const file = fileInside(root, name);
    if (file) files[name] = readFileSync(file, "utf8");
    else if (name !== "errors.csv")
      throw new UsageError(`${root} has no ${name} inside it: is it a finished run of cliquescape extract?`);
  }
  const spec = validateSpec(readSpecFile(fileInside(root, "spec.json")!), `${root}/spec.json`);
  const { entries, note } = datasetEntries(root, spec, options.dataset);
  return {
    kind: "run",
    root,
    graphIds: [...entries.keys()],
    session: {
      kind: "run",
      name: basename(root),
      files,
      graphIds: [...entries.keys()],
      ...(note ? { graphNote: note } : {}),
    },
    graph: (id) => {
      const entry = entries.get(id);
      if (!entry) throw new UsageError(`the run has no graph "${id}"`);
      const { graph, coordinates } = readPreparedGraph(entry, spec.preparation);
      return graphToJson(graph, coordinates);
    },
  };
}

/**
 * The dataset entries of a run, by id, so its graphs can be opened: the dataset named in the spec, found
 * from the working directory or from the run folder and the two folders above it (a run written to
 * out/NAME by a command run at the repository root), or where --dataset says. Inputs whose bytes changed
 * since the run are named in the note.
 */
function datasetEntries(
  root: string,
  spec: RunSpec,
  given: string | undefined,
): { entries: Map<string, DatasetEntry>; note?: string } {
  const named = given ?? spec.dataset;
  if (!named)
    return { entries: new Map(), note: "The run's spec names no dataset, so its graphs cannot be opened." };
  const candidates = isAbsolute(named)
    ? [named]
    : [process.cwd(), root, dirname(root), dirname(dirname(root))].map((base) => resolve(base, named));
  let dataset: ReturnType<typeof openDataset> | undefined;
  for (const candidate of candidates) {
    try {
      dataset = openDataset(candidate, spec.datasetOptions);
      break;
    } catch {
      // Not here; try the next place.
    }
  }
  if (!dataset) {
    return {
      entries: new Map(),
      note: `The run's dataset ${named} was not found from here, so its graphs cannot be opened; pass --dataset PATH.`,
    };
  }
  const entries = new Map(dataset.entries.map((entry) => [entry.id, entry]));
  const recorded = new Map((spec.inputs ?? []).map((input) => [input.id, input.sha256]));
  const changed = dataset.entries.filter((entry) => {
    const sha = recorded.get(entry.id);
    return sha !== undefined && hashFile(entry.file) !== sha;
  });
  if (changed.length === 0) return { entries };
  const ids = changed
    .slice(0, 5)
    .map((e) => e.id)
    .join(", ");
  return {
    entries,
    note: `${changed.length} input file(s) changed since the run (${ids}${changed.length > 5 ? ", …" : ""}): their graphs are shown as the files are now.`,
  };
}
