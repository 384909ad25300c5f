import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoSubsetRun } from "../browser/demo-subset.js";
import { runCli, scratchFiles } from "./run-cli.js";

/** The session a report embeds, read back from its HTML. */
function embeddedSession(html: string) {
  const match = /<script type="application\/json" id="cliquescape-session">(.*?)<\/script>/s.exec(html);
  if (!match) throw new Error("no embedded session");
  return JSON.parse(match[1]);
}

describe("report", () => {
  let run: string;
  const out = mkdtempSync(join(tmpdir(), "cliquescape-report-"));

  beforeAll(() => {
    run = demoSubsetRun(1);
  });
  afterAll(() => {
    rmSync(dirname(run), { recursive: true, force: true });
    rmSync(out, { recursive: true, force: true });
  });

  it("embeds the run's tables and every graph, and tells how to open the file", () => {
    const file = join(out, "report.html");
    const result = runCli(["report", run, "--out", file]);
    expect(result.status, result.stderr).toBe(0);
    expect(result.stdout).toContain(`open it: file://${file}`);
    const html = readFileSync(file, "utf8");
    const session = embeddedSession(html);
    expect(session.kind).toBe("run");
    expect(session.files["features.csv"]).toBe(readFileSync(join(run, "features.csv"), "utf8"));
    expect(session.graphIds).toEqual(["ring01u", "isl01u", "scr01u"]);
    expect(html.match(/data-graph-id="/g)).toHaveLength(3);
    // Nothing the page loads comes from elsewhere: no external script, style or image element.
    expect(html).not.toMatch(/<(script|link|img)[^>]+(src|href)=["']?(https?:)?\/\//i);
  });

  it("still writes the tables when the dataset has moved, says why graphs cannot open, and takes --dataset", () => {
    const moved = join(out, "moved-run");
    cpSync(run, moved, { recursive: true });
    const spec = JSON.parse(readFileSync(join(moved, "spec.json"), "utf8"));
    expect(spec.dataset).toBe(join(dirname(run), "manifest.csv"));
    // The spec names the manifest by the path extract was given; point it somewhere that does not exist.
    const fake = { ...spec, dataset: "gone/manifest.csv" };
    writeFileSync(join(moved, "spec.json"), JSON.stringify(fake));
    const file = join(out, "moved.html");
    expect(runCli(["report", moved, "--out", file]).status).toBe(0);
    const session = embeddedSession(readFileSync(file, "utf8"));
    expect(session.graphIds).toEqual([]);
    expect(session.graphNote).toContain("gone/manifest.csv was not found from here");
    const again = runCli(["report", moved, "--out", file, "--dataset", join(dirname(run), "manifest.csv")]);
    expect(again.status, again.stderr).toBe(0);
    expect(embeddedSession(readFileSync(file, "utf8")).graphIds).toHaveLength(3);
  });

  it("writes a single graph file as a report too", () => {
    const file = join(out, "one.html");
    expect(runCli(["report", "demo-data/graphs/ring09d.csv", "--directed", "--out", file]).status).toBe(0);
    const session = embeddedSession(readFileSync(file, "utf8"));
    expect(session).toMatchObject({
      kind: "graph",
      name: "ring09d.csv",
      settings: { semantics: "similarity", maxHomologyDim: 2 },
    });
    expect(session.graph.directed).toBe(true);
  });

  it("refuses an --out that is not .html (exit 2) and a bad input file with its position (exit 1)", () => {
    expect(runCli(["report", run, "--out", join(out, "r.txt")]).status).toBe(2);
    const dir = scratchFiles({ "bad.csv": "0,1\n1,x\n" });
    const bad = runCli(["view", join(dir, "bad.csv")]);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toContain(`${join(dir, "bad.csv")}:2:2: "x" is not a number`);
  });
});
