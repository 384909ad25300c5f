// Benchmarks write their figures into their own section of docs/benchmarks.md, between
// `<!-- NAME:start -->` and `<!-- NAME:end -->`; the rest of the file stays as it is.
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

const DOCS = join(dirname(fileURLToPath(import.meta.url)), "..", "..", "docs", "benchmarks.md");

/** Replaces section NAME (or appends it) with `section`, which carries its own start and end markers. */
export function writeDocsSection(name, section) {
  const text = existsSync(DOCS) ? readFileSync(DOCS, "utf8") : "# Benchmarks\n";
  const pattern = new RegExp(`<!-- ${name}:start -->[\\s\\S]*<!-- ${name}:end -->`);
  const next = pattern.test(text) ? text.replace(pattern, section) : `${text.trimEnd()}\n\n${section}\n`;
  writeFileSync(DOCS, next);
  console.error(`wrote the section into ${DOCS}`);
}
