import { describe, expect, it } from "vitest";
import type { TestModule } from "vitest/node";
import { pythonSkipsLine } from "./python-skips-reporter.js";

/** A stand-in for vitest's TestModule: its path and the states of its tests. */
function module(moduleId: string, states: string[]): TestModule {
  const tests = states.map((state) => ({ result: () => ({ state }) }));
  return { moduleId, children: { allTests: () => tests.values() } } as unknown as TestModule;
}

describe("the line that ends npm test when Python packages are missing", () => {
  it("counts the skipped checks of files that missed a module and names the packages to install", () => {
    const line = pythonSkipsLine(
      [
        { file: `${process.cwd()}/test/a.test.ts`, modules: ["numpy"] },
        { file: `${process.cwd()}/test/b.test.ts`, modules: ["numpy", "torch"] },
        { file: `${process.cwd()}/test/c.test.ts`, modules: ["csv"] },
      ],
      [
        module(`${process.cwd()}/test/a.test.ts`, ["skipped", "skipped", "passed"]),
        module(`${process.cwd()}/test/b.test.ts`, ["skipped"]),
        module(`${process.cwd()}/test/c.test.ts`, ["passed"]),
        module(`${process.cwd()}/test/d.test.ts`, ["skipped"]),
      ],
    );
    expect(line).toBe(
      "SKIPPED 3 reference checks that need Debian's python3, python3-numpy, python3-torch: test/a.test.ts (2), test/b.test.ts (1). Install them with: sudo apt-get install -y python3 python3-numpy python3-torch",
    );
  });

  it("says nothing when nothing was skipped for want of Python", () => {
    expect(pythonSkipsLine([], [module("/x.test.ts", ["skipped"])])).toBeNull();
  });
});
