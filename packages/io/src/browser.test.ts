import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import * as browser from "./browser.js";

const here = dirname(fileURLToPath(import.meta.url));

/** Every module the browser entry reaches through relative imports, and the bare imports among them. */
function reachable(entry: string): { files: string[]; bare: Set<string> } {
  const files: string[] = [];
  const bare = new Set<string>();
  const todo = [entry];
  while (todo.length > 0) {
    const file = todo.pop()!;
    if (files.includes(file)) continue;
    files.push(file);
    const source = readFileSync(file, "utf8");
    // `import type` and `export type` vanish at compile time; every other import or re-export is loaded.
    for (const m of source.matchAll(/^(?:import|export)\s+(?!type\s)[^;]*?from\s+"([^"]+)"/gms)) {
      const spec = m[1];
      if (spec.startsWith(".")) todo.push(join(dirname(file), spec).replace(/\.js$/, ".ts"));
      else bare.add(spec);
    }
  }
  return { files, bare };
}

describe("@cliquescape/io/browser", () => {
  it("reaches no Node API and no package but core", () => {
    const { files, bare } = reachable(join(here, "browser.ts"));
    expect(files.length).toBeGreaterThan(5);
    expect([...bare].sort()).toEqual(["@cliquescape/core"]);
  });

  it("parses the same bytes as the Node reader, with the same error positions", () => {
    const bytes = new TextEncoder().encode("0,1,x\n1,0,2\n2,2,0\n");
    expect(() => browser.parseGraphBytes(bytes, "m.csv")).toThrow('m.csv:1:3: "x" is not a number');
  });
});
