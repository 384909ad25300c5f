import { createReadStream } from "node:fs";
import { createServer, type IncomingMessage, type Server, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import { basename } from "node:path";
import { fileInside } from "./inside-folder.js";
import { scriptJson } from "./page-data.js";
import type { ViewTarget } from "./view-target.js";

/** The only address the viewer listens on: this machine, never the network. */
export const LOOPBACK = "127.0.0.1";

const HEADERS = {
  "Cache-Control": "no-store",
  "X-Content-Type-Options": "nosniff",
  "Referrer-Policy": "no-referrer",
  "Cross-Origin-Resource-Policy": "same-origin",
};

const TYPES: Record<string, string> = {
  ".csv": "text/csv; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".html": "text/html; charset=utf-8",
  ".txt": "text/plain; charset=utf-8",
  ".tsv": "text/tab-separated-values; charset=utf-8",
};

/**
 * Serves the page for one target on 127.0.0.1: the page itself, its session, a run's graphs by id, and
 * files by path only from inside what was given (a run folder, or the one graph file): no path outside it,
 * through "..", encoded dots or symlinks, and no directory listing. Requests naming another host are
 * refused, so a web page elsewhere cannot reach the server through a rebound domain name.
 */
export function servePage(target: ViewTarget, html: string, port: number): Promise<Server> {
  const session = scriptJson(target.session);
  const ids = new Set(target.graphIds);
  const server = createServer((request, response) => {
    try {
      route(request, response);
    } catch (error) {
      send(response, 500, `${(error as Error).message}\n`, "text/plain; charset=utf-8");
    }
  });

  function route(request: IncomingMessage, response: ServerResponse): void {
    const { port: actual } = server.address() as AddressInfo;
    const host = request.headers.host ?? "";
    if (host !== `${LOOPBACK}:${actual}` && host !== `localhost:${actual}`) {
      send(response, 421, "this server answers requests for 127.0.0.1 only\n");
      return;
    }
    if (request.method !== "GET" && request.method !== "HEAD") {
      send(response, 405, "read only\n", "text/plain", { Allow: "GET, HEAD" });
      return;
    }
    // The raw path, not a normalised one: "/a/../b" must be refused, not quietly read as "/b".
    const path = (request.url ?? "/").split("?")[0];
    if (path === "/" || path === "/index.html") {
      send(response, 200, html, TYPES[".html"]);
      return;
    }
    if (path === "/session.json") {
      send(response, 200, session, TYPES[".json"]);
      return;
    }
    const graph = /^\/graph\/([^/]+)\.json$/.exec(path);
    if (graph) {
      const id = safeDecode(graph[1]);
      if (id === null || !ids.has(id)) {
        send(response, 404, "no such graph\n");
        return;
      }
      send(response, 200, JSON.stringify(target.graph(id)), TYPES[".json"]);
      return;
    }
    if (path.startsWith("/files/")) {
      const rest = path.slice("/files/".length);
      const file =
        target.kind === "run"
          ? fileInside(target.root, rest)
          : safeDecode(rest) === basename(target.root)
            ? target.root
            : null;
      if (!file) {
        send(response, 404, "not found\n");
        return;
      }
      const type = TYPES[file.slice(file.lastIndexOf(".")).toLowerCase()] ?? "application/octet-stream";
      response.writeHead(200, { ...HEADERS, "Content-Type": type });
      if (request.method === "HEAD") {
        response.end();
        return;
      }
      createReadStream(file).pipe(response);
      return;
    }
    send(response, 404, "not found\n");
  }

  function send(
    response: ServerResponse,
    status: number,
    body: string,
    type = "text/plain; charset=utf-8",
    extra: Record<string, string> = {},
  ): void {
    response.writeHead(status, { ...HEADERS, ...extra, "Content-Type": type });
    response.end(body);
  }

  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, LOOPBACK, () => resolve(server));
  });
}

function safeDecode(text: string): string | null {
  try {
    return decodeURIComponent(text);
  } catch {
    return null;
  }
}
