import { realpathSync, statSync } from "node:fs";
import { join, sep } from "node:path";

/**
 * The file a URL path names inside `root`, or null when the path could leave it: every segment is decoded
 * and must be a plain name (no "", ".", "..", no encoded "/" or "\", no NUL), and the file's real path
 * (symlinks followed) must still lie inside the root's real path. Directories are never served.
 */
export function fileInside(root: string, urlPath: string): string | null {
  const segments: string[] = [];
  for (const raw of urlPath.split("/")) {
    let segment: string;
    try {
      segment = decodeURIComponent(raw);
    } catch {
      return null;
    }
    if (segment === "" || segment === "." || segment === ".." || /[\\/\0]/.test(segment)) return null;
    segments.push(segment);
  }
  if (segments.length === 0) return null;
  try {
    const realRoot = realpathSync(root);
    const real = realpathSync(join(realRoot, ...segments));
    if (!real.startsWith(realRoot + sep)) return null;
    return statSync(real).isFile() ? real : null;
  } catch {
    return null;
  }
}
