// `cliquescape view` as a server: bound to the loopback address only, serving what it was given and
// nothing else — no "..", no encoded dots, no symlink out of the run folder, no directory listing — and
// stopping cleanly on Ctrl-C.
import { mkdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from "node:fs";
import { request } from "node:http";
import { dirname, join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoSubsetRun } from "../browser/demo-subset.js";
import { type RunningView, startView } from "../browser/view-server.js";

/** A GET with the path sent exactly as written (no client-side normalisation of ".." or "%2e"). */
function get(
  port: number,
  path: string,
  host = `127.0.0.1:${port}`,
): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const req = request({ host: "127.0.0.1", port, path, headers: { host } }, (res) => {
      let body = "";
      res.on("data", (chunk) => {
        body += chunk;
      });
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on("error", reject);
    req.end();
  });
}

/** Local addresses (hex, as the kernel lists them) with a listening TCP socket on `port`. */
function listeningAddresses(port: number): string[] {
  const hexPort = port.toString(16).toUpperCase().padStart(4, "0");
  const addresses: string[] = [];
  for (const table of ["/proc/net/tcp", "/proc/net/tcp6"]) {
    let text = "";
    try {
      text = readFileSync(table, "utf8");
    } catch {
      continue;
    }
    for (const line of text.trim().split("\n").slice(1)) {
      const [, local, , state] = line.trim().split(/\s+/);
      const [address, p] = local.split(":");
      if (p === hexPort && state === "0A") addresses.push(address);
    }
  }
  return addresses;
}

describe("view serving a run folder", () => {
  let run: string;
  let view: RunningView;
  let port: number;

  beforeAll(async () => {
    run = demoSubsetRun(1);
    const outside = dirname(run);
    writeFileSync(join(outside, "secret.txt"), "not for the page\n");
    mkdirSync(join(outside, "private"));
    writeFileSync(join(outside, "private", "notes.txt"), "private\n");
    // Links placed inside the run folder that lead out of it.
    symlinkSync(join(outside, "secret.txt"), join(run, "barcodes", "escape.json"));
    symlinkSync(join(outside, "private"), join(run, "linked"));
    view = await startView([run]);
    port = Number(new URL(view.url).port);
  });

  afterAll(async () => {
    await view?.stop();
    if (run) rmSync(dirname(run), { recursive: true, force: true });
  });

  it("listens on 127.0.0.1 only and says so", () => {
    expect(view.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/$/);
    // The kernel's socket table (little-endian hex): 0100007F is 127.0.0.1; no wildcard or IPv6 listener.
    expect(listeningAddresses(port)).toEqual(["0100007F"]);
  });

  it("serves the page, its session, the run's files and graphs", async () => {
    const page = await get(port, "/");
    expect(page.status).toBe(200);
    expect(page.body).toContain("<!doctype html>");
    const session = JSON.parse((await get(port, "/session.json")).body);
    expect(session.kind).toBe("run");
    expect(session.graphIds).toEqual(["ring01u", "isl01u", "scr01u"]);
    const spec = await get(port, "/files/spec.json");
    expect(spec.status).toBe(200);
    expect(spec.body).toBe(readFileSync(join(run, "spec.json"), "utf8"));
    const graph = JSON.parse((await get(port, "/graph/ring01u.json")).body);
    expect(graph).toMatchObject({ format: "cliquescape-graph/1", n: 48, directed: false });
  });

  it("refuses every way out of the folder, directory listings and unknown graphs", async () => {
    const refused = [
      "/files/../manifest.csv",
      "/files/barcodes/../../secret.txt",
      "/files/%2e%2e/secret.txt",
      "/files/%2E%2E/%2e%2e/etc/passwd",
      "/files/..%2fsecret.txt",
      "/files/barcodes%2f..%2f..%2fsecret.txt",
      "/files/..%5csecret.txt",
      "/files/barcodes/escape.json",
      "/files/linked/notes.txt",
      "/files/barcodes/",
      "/files/barcodes",
      "/files/",
      "/../secret.txt",
      "/graph/..%2fspec.json",
      "/graph/nobody.json",
      "/files/spec.json%00.csv",
    ];
    for (const path of refused) {
      const response = await get(port, path);
      expect({ path, status: response.status }).toEqual({ path, status: 404 });
      expect(response.body).not.toContain("not for the page");
      expect(response.body).not.toContain("private");
    }
  });

  it("answers only requests addressed to the loopback name, and only reads", async () => {
    expect((await get(port, "/session.json", `evil.example:${port}`)).status).toBe(421);
    const post = await new Promise<number>((resolve, reject) => {
      const req = request({ host: "127.0.0.1", port, path: "/session.json", method: "POST" }, (res) => {
        res.resume();
        resolve(res.statusCode ?? 0);
      });
      req.on("error", reject);
      req.end();
    });
    expect(post).toBe(405);
  });

  it("stops on Ctrl-C with exit code 0", async () => {
    const other = await startView([run]);
    expect(await other.stop()).toBe(0);
    expect(other.output()).toContain("cliquescape view: stopped");
  });
});
