import "./styles.css";
import { AnalysisClient } from "./compute/analysis-client.js";
import { type AnalysisSettings, DEFAULT_SETTINGS } from "./compute/graph-analysis.js";
import type { OpenedGraph } from "./compute/worker-protocol.js";
import { h } from "./dom.js";
import { DropZone } from "./drop/drop-page.js";
import { type GraphPageHandle, showGraphPage } from "./graph-page.js";
import { showRunPage } from "./run/run-page.js";
import { loadSession, type SessionSettings } from "./session/page-session.js";

/** What tests and benchmarks reach: the page's own state, never a second computation. */
declare global {
  interface Window {
    cliquescape?: { ready: Promise<void>; graph?: GraphPageHandle; view: "graph" | "run" | "drop" };
  }
}

const app = document.getElementById("app")!;
const client = new AnalysisClient();
const hooks: NonNullable<Window["cliquescape"]> = { ready: Promise.resolve(), view: "drop" };
window.cliquescape = hooks;

function settingsOf(session: SessionSettings): AnalysisSettings {
  return {
    ...DEFAULT_SETTINGS,
    semantics: session.semantics,
    ...(session.topDim !== undefined ? { topDim: session.topDim } : {}),
    ...(session.maxHomologyDim !== undefined ? { maxHomologyDim: session.maxHomologyDim } : {}),
    ...(session.prime !== undefined ? { prime: session.prime } : {}),
  };
}

function busy(text: string): void {
  app.replaceChildren(h("p", { class: "busy", role: "status" }, text));
}

async function openGraph(
  opened: OpenedGraph,
  title: string,
  back?: { label: string; go: () => void },
): Promise<void> {
  hooks.view = "graph";
  hooks.graph = await showGraphPage(app, opened, client, title, back);
}

async function start(): Promise<void> {
  const { session, graphs } = await loadSession();
  const dropZone = new DropZone(async (file, read) => {
    const bytes = new Uint8Array(await file.arrayBuffer());
    const settings = settingsOf({ semantics: read.semantics ?? "similarity" });
    const opened = await client.request<OpenedGraph>(
      { kind: "open-bytes", name: file.name, bytes, read, settings },
      [bytes.buffer],
    );
    await openGraph(opened, file.name, { label: "Open another", go: () => location.reload() });
  });

  if (session.kind === "graph") {
    document.title = `${session.name} · cliquescape`;
    busy(`Computing ${session.name}…`);
    const opened = await client.request<OpenedGraph>({
      kind: "open-json",
      json: session.graph,
      source: session.name,
      settings: settingsOf(session.settings),
    });
    await openGraph(opened, session.name);
    return;
  }
  if (session.kind === "run") {
    document.title = `Run ${session.name} · cliquescape`;
    const showRun = () => {
      hooks.view = "run";
      hooks.graph = undefined;
      const run = showRunPage(app, session, (id) => void openRunGraph(id, run.settings));
    };
    const openRunGraph = async (
      id: string,
      run: { weights: AnalysisSettings["semantics"]; topDim: number; prime: number },
    ) => {
      busy(`Computing ${id}…`);
      try {
        const json = await graphs.graph(id);
        // The run's own settings: counts to its top dimension, homology below it.
        const settings = settingsOf({
          semantics: run.weights,
          topDim: run.topDim,
          maxHomologyDim: Math.max(0, run.topDim - 1),
          prime: run.prime,
        });
        const opened = await client.request<OpenedGraph>({ kind: "open-json", json, source: id, settings });
        await openGraph(opened, id, { label: "Run", go: showRun });
      } catch (error) {
        showRun();
        app.prepend(
          h(
            "p",
            { class: "drop-error", role: "alert" },
            `${id}: ${error instanceof Error ? error.message : String(error)}`,
          ),
        );
      }
    };
    showRun();
    return;
  }
  hooks.view = "drop";
  app.replaceChildren(
    h(
      "div",
      { class: "drop-page" },
      h("h1", {}, "cliquescape"),
      h(
        "p",
        { class: "lede" },
        "See the loops behind the Betti numbers of a weighted network, drawn on the graph.",
      ),
      dropZone.element,
    ),
  );
}

hooks.ready = start().catch((error) => {
  app.replaceChildren(
    h("p", { class: "drop-error", role: "alert" }, error instanceof Error ? error.message : String(error)),
  );
});
