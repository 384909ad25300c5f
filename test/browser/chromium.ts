import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { type BrowserContext, chromium, type Page } from "playwright-core";

/** Debian's Chromium (apt-get install chromium); override with CHROMIUM=/path/to/chrome. */
export const CHROMIUM = process.env.CHROMIUM ?? "/usr/bin/chromium";

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
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
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
