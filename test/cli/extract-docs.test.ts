/**
 * docs/extract.md carries the JSON Schema of the run spec; it must be the schema the validator really
 * uses (generated from it by zod's toJSONSchema), so a user's editor and the command agree.
 */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { runSpecJsonSchema } from "../../packages/cli/src/extract/run-spec.js";

const DOC = fileURLToPath(new URL("../../docs/extract.md", import.meta.url));

describe("docs/extract.md", () => {
  it("holds the run spec's JSON Schema exactly as the validator generates it", () => {
    const text = readFileSync(DOC, "utf8");
    const block =
      /<!-- run-spec-schema:start -->[\s\S]*?```json\n([\s\S]*?)\n```[\s\S]*?<!-- run-spec-schema:end -->/.exec(
        text,
      );
    expect(block, "schema block in docs/extract.md").not.toBeNull();
    expect(JSON.parse(block![1])).toEqual(runSpecJsonSchema());
  });

  it("documents every option of the command", async () => {
    const { extractCommand } = await import("../../packages/cli/src/commands/extract.js");
    const text = readFileSync(DOC, "utf8");
    for (const option of extractCommand().options) {
      const flag = option.long!;
      expect(text, `${flag} in docs/extract.md`).toContain(`\`${flag}`);
    }
  });
});
