// `cliquescape report` opened from disk in headless Chromium with the network off: the run renders and a
// graph opens, and the page makes no request beyond its own file (and the in-memory blob of its worker).
import { rmSync } from "node:fs";
import { dirname, join } from "node:path";
import { pathToFileURL } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runCli } from "../cli/run-cli.js";
import { downloaded, launchChromium, missingChromium, screenshot } from "./chromium.js";
import { demoSubsetRun } from "./demo-subset.js";

const skip = missingChromium();

describe.skipIf(skip)(`report opened from disk${skip ? ` (skipped: ${skip})` : ""}`, () => {
  let run: string;
  let report: string;
  let browser: Awaited<ReturnType<typeof launchChromium>>;
  const requests: string[] = [];

  beforeAll(async () => {
    run = demoSubsetRun(3);
    report = join(dirname(run), "report.html");
    const written = runCli(["report", run, "--out", report]);
    expect(written.status, written.stderr).toBe(0);
    expect(written.stdout).toContain(`open it: ${pathToFileURL(report).href}`);
    browser = await launchChromium();
    await browser.context.setOffline(true);
    browser.context.on("request", (request) => requests.push(request.url()));
  });

  afterAll(async () => {
    await browser?.close();
    if (run) rmSync(dirname(run), { recursive: true, force: true });
  });

  it("renders the run's table, curves and map, opens a graph with its loops, and requests nothing", async () => {
    const { page } = browser;
    await page.goto(pathToFileURL(report).href);
    await page.evaluate(() => window.cliquescape!.ready);
    expect(await page.evaluate(() => window.cliquescape!.view)).toBe("run");
    // 3 graphs per label, 3 labels: 9 rows, each id opens its graph.
    expect(await page.locator("table.run-table tbody tr").count()).toBe(9);
    expect(await page.locator("table.run-table button[data-open]").count()).toBe(9);
    // Each chart saves as SVG: the mean curves with their bands, and one marker per graph in the map.
    const saved = (chart: string) =>
      downloaded(page, () =>
        page
          .locator("figure", { has: page.locator(`#${chart}`) })
          .getByRole("button", { name: "SVG" })
          .click(),
      );
    const curves = await saved("label-curves-chart");
    expect(curves.name).toBe("betti_d1-by-label.svg");
    expect(curves.bytes.toString().match(/<path/g)!.length).toBeGreaterThan(3 * 2);
    const map = await saved("feature-map-chart");
    expect(map.name).toBe("feature-map.svg");
    expect(map.bytes.toString().match(/<path/g)!.length).toBeGreaterThanOrEqual(9);
    await screenshot(page, "run-report");

    // Sorting by a column header reorders the rows.
    const firstId = () => page.locator("table.run-table tbody tr th").first().textContent();
    const before = await firstId();
    await page.locator("table.run-table thead button.sort").first().click();
    expect(await firstId()).not.toBe(before);

    await page.click('button[data-open="ring01u"]');
    await page.waitForFunction(() => window.cliquescape?.graph !== undefined, null, { timeout: 60_000 });
    await page.waitForFunction(() => !document.querySelector(".loop-nodes")?.textContent?.includes("…"));
    expect(await page.locator(".loop-item").count()).toBeGreaterThan(0);
    await screenshot(page, "run-report-graph");

    const others = requests.filter((url) => url !== pathToFileURL(report).href && !url.startsWith("blob:"));
    expect(others).toEqual([]);
    expect(requests).toContain(pathToFileURL(report).href);
  });
});
