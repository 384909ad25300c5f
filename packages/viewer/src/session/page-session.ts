import type { WeightSemantics } from "@cliquescape/core";
import type { GraphJson } from "@cliquescape/io/browser";

/** Settings of the run or command the page was opened with; the page's defaults fill the rest. */
export interface SessionSettings {
  semantics: WeightSemantics;
  topDim?: number | null;
  maxHomologyDim?: number;
  prime?: number;
}

/** One graph, given whole. */
export interface GraphSession {
  kind: "graph";
  name: string;
  settings: SessionSettings;
  graph: GraphJson;
}

/** A run folder: its tables as text (the run-folder reader parses them); graphs fetched by id when opened. */
export interface RunSession {
  kind: "run";
  name: string;
  /** spec.json, features.csv and errors.csv as written by `cliquescape extract`. */
  files: Record<string, string>;
  /** Ids whose graph the page can open; the rest have none to show (input missing or failed). */
  graphIds: string[];
  /** Why graphs cannot be opened, when the dataset was not found. */
  graphNote?: string;
}

/** Nothing given: the page waits for a dropped file. */
export interface EmptySession {
  kind: "empty";
}

export type PageSession = GraphSession | RunSession | EmptySession;

/** Where a run's graphs come from: embedded in the report, or fetched from the server. */
export interface GraphSource {
  graph(id: string): Promise<GraphJson>;
}

/** The element ids and attribute the CLI writes into the page (see packages/cli/src/view/page-data.ts). */
export const SESSION_ELEMENT_ID = "cliquescape-session";
export const GRAPH_ATTRIBUTE = "data-graph-id";

/**
 * The session the page was opened with: embedded by `cliquescape report`, served by `cliquescape view`
 * (session.json next to the page), or none (a page opened on its own: drop a file).
 */
export async function loadSession(): Promise<{ session: PageSession; graphs: GraphSource }> {
  const embedded = document.getElementById(SESSION_ELEMENT_ID);
  if (embedded?.textContent) {
    const scripts = new Map<string, HTMLElement>();
    for (const script of document.querySelectorAll<HTMLElement>(`script[${GRAPH_ATTRIBUTE}]`))
      scripts.set(script.getAttribute(GRAPH_ATTRIBUTE)!, script);
    return {
      session: JSON.parse(embedded.textContent) as PageSession,
      graphs: {
        graph: async (id) => {
          const script = scripts.get(id);
          if (!script?.textContent) throw new Error(`the report holds no graph "${id}"`);
          return JSON.parse(script.textContent) as GraphJson;
        },
      },
    };
  }
  const served: GraphSource = {
    graph: async (id) => fetchJson<GraphJson>(`graph/${encodeURIComponent(id)}.json`),
  };
  if (location.protocol === "http:" || location.protocol === "https:") {
    try {
      return { session: await fetchJson<PageSession>("session.json"), graphs: served };
    } catch {
      // A page served without a session (a development server): fall through to the drop page.
    }
  }
  return { session: { kind: "empty" }, graphs: served };
}

async function fetchJson<T>(path: string): Promise<T> {
  const response = await fetch(path);
  if (!response.ok) throw new Error(`${path}: ${response.status} ${await response.text()}`);
  return (await response.json()) as T;
}
