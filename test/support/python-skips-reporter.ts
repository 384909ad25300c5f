/**
 * Ends `npm test` with one line naming the reference checks skipped because Debian's Python packages are
 * missing, and the command that installs them. Test files ask for modules through missingPythonModules
 * (test/support/python.ts), which, when one is missing, appends `{ file, modules }` to the log named by
 * CLIQUESCAPE_PYTHON_SKIPS; this reporter, in vitest's main process, reads it back once the run is over.
 */
import { existsSync, readFileSync, rmSync } from "node:fs";
import { relative } from "node:path";
import type { Reporter, TestModule } from "vitest/node";

export class PythonSkipsReporter implements Reporter {
  constructor(private readonly log: string) {}

  onInit(): void {
    rmSync(this.log, { force: true });
  }

  onTestRunEnd(testModules: ReadonlyArray<TestModule>): void {
    const line = pythonSkipsLine(this.readLog(), testModules);
    rmSync(this.log, { force: true });
    if (line) process.stdout.write(`\n${line}\n`);
  }

  private readLog(): { file: string; modules: string[] }[] {
    if (!existsSync(this.log)) return [];
    return readFileSync(this.log, "utf8")
      .split("\n")
      .filter((l) => l !== "")
      .map((l) => JSON.parse(l) as { file: string; modules: string[] });
  }
}

/** "SKIPPED 47 reference checks … install them with: sudo apt-get install -y …", or null when none were. */
export function pythonSkipsLine(
  entries: readonly { file: string; modules: string[] }[],
  testModules: ReadonlyArray<TestModule>,
): string | null {
  const modulesOf = new Map<string, Set<string>>();
  for (const { file, modules } of entries) {
    const set = modulesOf.get(file) ?? new Set<string>();
    for (const m of modules) set.add(m);
    modulesOf.set(file, set);
  }
  const files: string[] = [];
  const packages = new Set(["python3"]);
  let skipped = 0;
  for (const module of testModules) {
    if (!modulesOf.has(module.moduleId)) continue;
    const count = [...module.children.allTests()].filter((t) => t.result().state === "skipped").length;
    if (count === 0) continue;
    skipped += count;
    files.push(`${relative(process.cwd(), module.moduleId)} (${count})`);
    for (const m of modulesOf.get(module.moduleId) ?? []) packages.add(debianPackage(m));
  }
  if (skipped === 0) return null;
  const list = [...packages];
  return (
    `SKIPPED ${skipped} reference check${skipped === 1 ? "" : "s"} that need Debian's ${list.join(", ")}: ` +
    `${files.join(", ")}. Install them with: sudo apt-get install -y ${list.join(" ")}`
  );
}

/** The Debian package of a Python module: python3-<module>, or python3 itself for the standard library. */
function debianPackage(module: string): string {
  return ["csv", "json"].includes(module) ? "python3" : `python3-${module}`;
}
