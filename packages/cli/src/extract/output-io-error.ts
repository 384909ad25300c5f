import { statSync } from "node:fs";
import { resolve } from "node:path";

/** Why the system refused a write, in words; the errno code follows in brackets. */
const REASONS: Record<string, string> = {
  ENOSPC: "no space left on the device",
  EDQUOT: "the disk quota is used up",
  EROFS: "the file system is read-only",
  EACCES: "permission denied",
  EPERM: "operation not permitted",
  ENOTDIR: "a part of the path is a file, not a folder",
  EEXIST: "a file of that name is in the way",
  EISDIR: "a folder of that name is in the way",
  EIO: "input/output error of the device",
  EMFILE: "too many open files",
  ENAMETOOLONG: "the name is too long for the file system",
};

/** The errno codes that are a fault of the place written to, not of the program. */
export const OUTPUT_IO_CODES = new Set(Object.keys(REASONS));

/**
 * A write into the run folder that the system refused (a full disk, a read-only mount, missing
 * permission, --out naming a file). One line naming the option, the path and the reason; exit code 74.
 * `note` says what became of the work (e.g. how many finished graphs are kept).
 */
export class OutputIOError extends Error {
  override name = "OutputIOError";
  readonly code: string;
  readonly path: string;

  constructor(cause: unknown, out: string, note = "") {
    const errno = cause as NodeJS.ErrnoException;
    const code = errno?.code ?? "EIO";
    const path = errno?.path ?? out;
    const reason =
      (code === "ENOTDIR" || code === "EEXIST") && isFile(out)
        ? "it is a file, not a folder"
        : (REASONS[code] ?? errno?.message ?? String(cause));
    const where = resolve(path) === resolve(out) ? "" : ` ${path}`;
    super(`--out ${out}: cannot write${where}: ${reason} (${code})${note ? `; ${note}` : ""}`);
    this.code = code;
    this.path = path;
  }
}

/** Whether `error` is the system refusing a write at a path inside (or at, or above) the run folder. */
export function isOutputIOError(error: unknown, out: string): boolean {
  const errno = error as NodeJS.ErrnoException;
  if (!errno || typeof errno.code !== "string" || !OUTPUT_IO_CODES.has(errno.code)) return false;
  if (typeof errno.path !== "string") return errno.code === "ENOSPC" || errno.code === "EDQUOT";
  const path = resolve(errno.path);
  const root = resolve(out);
  const destination = (errno as { dest?: unknown }).dest;
  const dest = typeof destination === "string" ? resolve(destination) : "";
  const near = (p: string) => p === root || p.startsWith(`${root}/`) || root.startsWith(`${p}/`);
  return near(path) || (dest !== "" && near(dest));
}

function isFile(path: string): boolean {
  try {
    return statSync(path).isFile();
  } catch {
    return false;
  }
}
