import { existsSync, mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { type BrowserContext, chromium, type Page } from "playwright-core";

import { CHROMIUM, CHROMIUM_ARGS } from "./chromium-flags.mjs";

export { CHROMIUM };

/**
 * null when Chromium is there, otherwise why not. Outside CI the browser tests then skip with that reason
 * in their name; under CI (.ci/run installs chromium) a missing browser is a failure.
 */
export function missingChromium(): string | null {
  if (existsSync(CHROMIUM)) return null;
  const reason = `no Chromium at ${CHROMIUM} (apt-get install -y chromium, or set CHROMIUM)`;
  if (process.env.CI) throw new Error(`${reason}; .ci/run installs it, so this is a CI setup fault`);
  return reason;
}

/** Where the browser tests keep their screenshots for a reviewer (1280 × 800 each). */
export const SCREENSHOTS = fileURLToPath(new URL("../../out/screenshots/", import.meta.url));

/** Saves a screenshot of the page as out/screenshots/NAME.png and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOTS, { recursive: true });
  const path = join(SCREENSHOTS, `${name}.png`);
  await page.screenshot({ path });
  return path;
}

/** The screen size the page is designed for and screenshotted at. */
export const VIEWPORT = { width: 1280, height: 800 };

/**
 * A headless Chromium with a fresh profile that talks to nothing on its own (no sync, no component
 * updates, no background networking), as a persistent context so the profile folder is ours to remove.
 */
export async function launchChromium(): Promise<{
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}> {
  const profile = mkdtempSync(join(tmpdir(), "cliquescape-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: VIEWPORT,
    args: CHROMIUM_ARGS,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Clicks what `click` clicks and returns the text of the file the page downloads. */
export async function downloaded(
  page: Page,
  click: () => Promise<void>,
): Promise<{ name: string; bytes: Buffer }> {
  const [download] = await Promise.all([page.waitForEvent("download"), click()]);
  const path = await download.path();
  const { readFileSync } = await import("node:fs");
  return { name: download.suggestedFilename(), bytes: readFileSync(path) };
}
