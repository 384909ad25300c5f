import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";

/** SHA-256 of a file's bytes (hex), or null when it cannot be read (its reader will say why). */
export function hashFile(path: string): string | null {
  try {
    return createHash("sha256").update(readFileSync(path)).digest("hex");
  } catch {
    return null;
  }
}
