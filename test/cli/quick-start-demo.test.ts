import { spawnSync } from "node:child_process";
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, symlinkSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, it } from "vitest";

const ROOT = fileURLToPath(new URL("../..", import.meta.url));

/** Data rows of a CSV file (its lines less the header). */
const dataRows = (file: string) => readFileSync(file, "utf8").trim().split("\n").length - 1;

describe("the README's quick start: npm run demo", () => {
  // The demo script writes out/demo and out/demo-recordings next to demo-data/, replacing what is there;
  // so it runs in a scratch copy of the repository's layout (demo-data copied, the built packages and
  // node_modules linked), not over a developer's own demo results.
  const root = mkdtempSync(join(tmpdir(), "cliquescape-quick-start-"));
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it("runs the main job on the bundled data, prints the group means and says how to open the report", () => {
    cpSync(join(ROOT, "demo-data"), join(root, "demo-data"), { recursive: true });
    symlinkSync(join(ROOT, "packages"), join(root, "packages"));
    symlinkSync(join(ROOT, "node_modules"), join(root, "node_modules"));
    const run = spawnSync(process.execPath, [join(root, "demo-data", "run-demo.mjs")], {
      cwd: root,
      encoding: "utf8",
    });
    expect(run.status, run.stderr).toBe(0);
    // demo-data/README.md: 36 co-activity networks in three groups, then 9 recordings of the same kinds.
    expect(dataRows(join(root, "out", "demo", "features.csv"))).toBe(36);
    expect(dataRows(join(root, "out", "demo-recordings", "features.csv"))).toBe(9);
    for (const group of ["islands", "ring", "scrambled"])
      expect(run.stdout).toMatch(new RegExp(`^${group} `, "m"));
    const report = join(root, "out", "demo", "report.html");
    expect(existsSync(report)).toBe(true);
    expect(run.stdout).toContain(`See the demo run: open file://${report} in a browser`);
  }, 180_000);
});
