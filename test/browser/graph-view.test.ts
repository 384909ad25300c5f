// The graph page served by `cliquescape view`, driven in headless Chromium as a person would: keyboard
// only. Its numbers and its loop are checked against the command line's JSON and against networkx.
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runCli } from "../cli/run-cli.js";
import { missingPythonModules, runPythonScript } from "../support/python.js";
import { downloaded, launchChromium, missingChromium, SCREENSHOTS, screenshot } from "./chromium.js";
import { type RunningView, startView } from "./view-server.js";

const GRAPH = "demo-data/graphs/ring01u.csv";
const skip = missingChromium();

/** The numbers the page shows at its threshold, read from the page's table. */
async function shownNumbers(page: Page) {
  return page.evaluate(() => {
    const text = (key: string) => document.querySelector(`[data-field="${key}"]`)?.textContent ?? "";
    const number = (key: string) => Number(text(key).replace(/,/g, ""));
    const perDim = (prefix: string) =>
      [...document.querySelectorAll(`[data-field^="${prefix}-"]`)]
        .map((cell) => cell.textContent ?? "")
        .filter((t) => t !== "–")
        .map((t) => Number(t.replace(/,/g, "")));
    return {
      nodes: number("nodes"),
      edges: number("edges"),
      euler: number("euler"),
      counts: perDim("count"),
      betti: perDim("betti"),
    };
  });
}

/** Presses Tab until the element matching `selector` has the focus (at most 60 presses). */
async function tabTo(page: Page, selector: string): Promise<void> {
  for (let i = 0; i < 60; i++) {
    if (await page.evaluate((s) => document.activeElement?.matches(s) ?? false, selector)) return;
    await page.keyboard.press("Tab");
  }
  throw new Error(`Tab never reached ${selector}`);
}

const withoutTrailingZeros = (xs: number[]) => {
  const copy = [...xs];
  while (copy.length > 0 && copy[copy.length - 1] === 0) copy.pop();
  return copy;
};

describe.skipIf(skip)(`graph page in Chromium${skip ? ` (skipped: ${skip})` : ""}`, () => {
  let view: RunningView;
  let browser: Awaited<ReturnType<typeof launchChromium>>;
  let page: Page;

  beforeAll(async () => {
    view = await startView([GRAPH, "--coords", "demo-data/coords/ring01u.csv"]);
    browser = await launchChromium();
    page = browser.page;
    await page.goto(view.url);
    await page.waitForFunction(() => window.cliquescape?.graph !== undefined, null, { timeout: 60_000 });
    // The loop list names its loops once the worker has found them.
    await page.waitForFunction(() => !document.querySelector(".loop-nodes")?.textContent?.includes("…"));
    console.log(`screenshots: ${SCREENSHOTS}`);
  });

  afterAll(async () => {
    await browser?.close();
    await view?.stop();
  });

  it("moved by keyboard, shows the counts, χ and Betti numbers that `inspect --format json` prints there", async () => {
    await tabTo(page, "#threshold-slider");
    const before = await page.evaluate(() => window.cliquescape!.graph!.control.index);
    await page.keyboard.press("Home");
    await page.keyboard.press("PageDown");
    await page.keyboard.press("PageDown");
    await page.keyboard.press("ArrowRight");
    const after = await page.evaluate(() => window.cliquescape!.graph!.control.index);
    expect(after).not.toBe(before);
    const steps = await page.evaluate(() => window.cliquescape!.graph!.analysis.thresholds.length);
    expect(after).toBe(2 * Math.round(steps / 10) + 1);
    const threshold = await page.evaluate(() => window.cliquescape!.graph!.control.threshold());
    const shown = await shownNumbers(page);
    const cli = runCli(["inspect", GRAPH, "--threshold", String(threshold), "--format", "json"]);
    expect(cli.status).toBe(0);
    const report = JSON.parse(cli.stdout);
    expect(shown.nodes).toBe(report.nodes);
    expect(shown.edges).toBe(report.edges);
    expect(shown.euler).toBe(report.euler);
    expect(withoutTrailingZeros(shown.counts)).toEqual(withoutTrailingZeros(report.counts));
    expect(shown.betti).toEqual(report.betti);
    // The drawing agrees with the table: exactly that many edges are stroked on the edge layer.
    const drawn = await page.evaluate(() => window.cliquescape!.graph!.canvas.drawnEdgeCount());
    expect(drawn).toBe(report.edges);
    await screenshot(page, "graph-threshold");
  });

  it("chosen by keyboard, the most persistent H1 bar draws the loop `barcode --cycles 1` reports, a cycle at its birth", async () => {
    await tabTo(page, ".loop-item");
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("ArrowUp");
    await page.keyboard.press("Enter");
    await page.waitForSelector('.loop-item[aria-pressed="true"]');
    const chosen = Number(await page.getAttribute('.loop-item[aria-pressed="true"]', "data-bar"));
    await page.waitForFunction(() => window.cliquescape!.graph!.canvas.shownLoop().length > 0);
    // The loop as drawn: the edges on the page's loop layer, over the faded graph.
    const drawn = await page.evaluate(() => window.cliquescape!.graph!.canvas.shownLoop());
    const threshold = await page.evaluate(() => window.cliquescape!.graph!.control.threshold());

    const cli = runCli(["barcode", GRAPH, "--cycles", "1", "--format", "json"]);
    expect(cli.status).toBe(0);
    const bars = JSON.parse(cli.stdout).bars as { dim: number; birth: number; cycle?: [string, string][] }[];
    const withLoop = bars.flatMap((bar, i) => (bar.cycle ? [i] : []));
    expect(withLoop).toEqual([chosen]);
    const { birth, cycle } = bars[chosen];
    const undirected = (edges: string[][]) => edges.map((e) => [...e].sort().join("|")).sort();
    expect(undirected(drawn)).toEqual(undirected(cycle!));
    // Choosing the bar moved the threshold to its birth.
    expect(threshold).toBe(birth);

    const missing = missingPythonModules(["networkx", "numpy"]);
    if (missing) return console.warn(`cycle check skipped: ${missing}`);
    // networkx (is_connected, degrees) and numpy on the file itself: one simple cycle, every edge present.
    const check = runPythonScript<{ simple_cycle: boolean; present_at_birth: boolean; length: number }>(
      "loop_check.py",
      { file: GRAPH, edges: drawn, birth, semantics: "similarity" },
    );
    expect(check).toMatchObject({ simple_cycle: true, present_at_birth: true, length: drawn.length });
    await screenshot(page, "graph-loop");
  });

  it("saves the graph as PNG and SVG, the loop as CSV and each chart as SVG", async () => {
    const loop = await page.evaluate(() =>
      window.cliquescape!.graph!.canvas.shownLoop().map((pair) => [...pair].sort().join("|")),
    );
    expect(loop.length).toBeGreaterThan(2);
    const png = await downloaded(page, () => page.getByRole("button", { name: "PNG" }).click());
    expect(png.name).toBe("ring01u.png");
    expect(png.bytes.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
    const svg = (
      await downloaded(page, () => page.locator(".toolbar").getByRole("button", { name: "SVG" }).click())
    ).bytes.toString();
    // As many emphasised lines as loop edges, and one circle per node.
    expect(svg.match(/class="loop"/g)).toHaveLength(loop.length);
    expect(svg.match(/<circle/g)).toHaveLength(48);
    const csv = (
      await downloaded(page, () => page.getByRole("button", { name: "loop CSV" }).click())
    ).bytes.toString();
    const [header, ...rows] = csv.trim().split("\n");
    expect(header).toBe("step,source,target,source_label,target_label,weight");
    expect(rows.map((r) => r.split(",").slice(3, 5).sort().join("|")).sort()).toEqual([...loop].sort());
    for (const id of ["curves-chart", "barcode-chart", "diagram-chart"]) {
      const chart = await downloaded(page, () =>
        page
          .locator("figure", { has: page.locator(`#${id}`) })
          .getByRole("button", { name: "SVG" })
          .click(),
      );
      expect(chart.bytes.toString()).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
      expect(chart.bytes.toString()).toContain("<path");
    }
  });
});
