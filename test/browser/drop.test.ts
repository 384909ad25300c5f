// Files dropped on the page are read in its worker by io's own parsers: a malformed file shows the command
// line's message with its line and column; a matrix written by numpy gives inspect's numbers.

import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runCli } from "../cli/run-cli.js";
import { missingPythonModules, PYTHON } from "../support/python.js";
import { launchChromium, missingChromium, screenshot } from "./chromium.js";

const PAGE = pathToFileURL(
  fileURLToPath(new URL("../../packages/viewer/dist/index.html", import.meta.url)),
).href;
const skip = missingChromium();

/** Drops a file on the page the way a browser delivers a drag from the desktop: a drop event with files. */
async function dropFile(page: Page, name: string, bytes: Uint8Array): Promise<void> {
  await page.evaluate(
    ({ name, data }) => {
      const transfer = new DataTransfer();
      transfer.items.add(new File([new Uint8Array(data)], name));
      document.body.dispatchEvent(
        new DragEvent("drop", { dataTransfer: transfer, bubbles: true, cancelable: true }),
      );
    },
    { name, data: [...bytes] },
  );
}

describe.skipIf(skip)(`dropping files on the page${skip ? ` (skipped: ${skip})` : ""}`, () => {
  let browser: Awaited<ReturnType<typeof launchChromium>>;
  const dir = mkdtempSync(join(tmpdir(), "cliquescape-drop-"));

  beforeAll(async () => {
    browser = await launchChromium();
  });
  afterAll(async () => {
    await browser?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it("shows the reader's message for a malformed matrix, with its line, exactly as the CLI prints it", async () => {
    const { page } = browser;
    await page.goto(PAGE);
    await page.evaluate(() => window.cliquescape!.ready);
    expect(await page.evaluate(() => window.cliquescape!.view)).toBe("drop");
    // A typo in row 3 of a 3 × 3 matrix (a real mistake: a word where a number belongs).
    const text = "0,0.5,0.2\n0.5,0,0.7\n0.2,oops,0\n";
    writeFileSync(join(dir, "bad.csv"), text);
    const cli = spawnSync(
      process.execPath,
      [
        fileURLToPath(new URL("../../packages/cli/bin/cliquescape.js", import.meta.url)),
        "inspect",
        "bad.csv",
      ],
      { cwd: dir, encoding: "utf8" },
    );
    expect(cli.status).toBe(1);
    const message = cli.stderr.trim().replace(/^cliquescape: /, "");
    expect(message).toBe('bad.csv:3:2: "oops" is not a number');

    await dropFile(page, "bad.csv", new TextEncoder().encode(text));
    const error = page.locator(".drop-error");
    await error.waitFor();
    expect(await error.locator("pre").textContent()).toBe(message);
    expect(await error.locator("strong").textContent()).toContain("line 3, column 2");
    await screenshot(page, "drop-error");
  });

  it("analyses a matrix written by numpy.save, with the numbers `inspect` gives at the page's threshold", async (context) => {
    const missing = missingPythonModules(["numpy"]);
    if (missing) return context.skip(missing);
    const path = join(dir, "coactivity.npy");
    // A symmetric non-negative matrix with zero diagonal, saved with numpy's defaults (float64, C order).
    const made = spawnSync(
      PYTHON,
      [
        "-c",
        `
import numpy as np
rng = np.random.default_rng(7)
a = rng.random((30, 30))
a = np.triu(a * (rng.random((30, 30)) < 0.3), 1)
np.save(${JSON.stringify(path)}, a + a.T)
`,
      ],
      { encoding: "utf8" },
    );
    expect(made.status, made.stderr).toBe(0);
    const { page } = browser;
    await page.goto(PAGE);
    await page.evaluate(() => window.cliquescape!.ready);
    await dropFile(page, "coactivity.npy", readFileSync(path));
    await page.waitForFunction(() => window.cliquescape?.graph !== undefined, null, { timeout: 60_000 });
    const threshold = await page.evaluate(() => window.cliquescape!.graph!.control.threshold());
    const shown = await page.evaluate(() => ({
      edges: Number(document.querySelector('[data-field="edges"]')!.textContent!.replace(/,/g, "")),
      euler: Number(document.querySelector('[data-field="euler"]')!.textContent),
      betti: [...document.querySelectorAll('[data-field^="betti-"]')]
        .map((c) => c.textContent)
        .filter((t) => t !== "–")
        .map(Number),
    }));
    const report = JSON.parse(
      runCli(["inspect", path, "--threshold", String(threshold), "--format", "json"]).stdout,
    );
    expect(shown).toEqual({ edges: report.edges, euler: report.euler, betti: report.betti });
    await screenshot(page, "drop-npy");
  });
});
