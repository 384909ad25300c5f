import { linkSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from "node:fs";
import { hostname } from "node:os";
import { join } from "node:path";
import type { RunFolder } from "./run-folder.js";

/** Who holds a run folder: written into its run.lock by the run that works there. */
export interface LockHolder {
  pid: number;
  host: string;
  /** When the run started (ISO 8601, UTC). */
  started: string;
  /** The kernel's boot id, when the system has one: a lock from before a reboot is stale whatever its pid. */
  boot: string | null;
}

/** Raised when another run works in the same folder; exit code 75 (try again when it ends). */
export class RunFolderBusyError extends Error {
  override name = "RunFolderBusyError";
}

export interface RunFolderLock {
  /** Removes the lock if it is still ours. Also done when the process exits. */
  release(): void;
}

/**
 * Takes the run folder's lock, or refuses at once when another live run holds it. The lock file is made
 * whole under a temporary name and linked into place (link fails if the name exists), so no run ever
 * reads a half-written lock. A lock whose process is gone (same host and boot, no such pid) is stale: it
 * is replaced, and `onNote` says so. Another host's lock cannot be checked and is never taken over.
 */
export function lockRunFolder(
  folder: RunFolder,
  out: string,
  onNote: (note: string) => void = (note) => process.stderr.write(`cliquescape: ${note}\n`),
): RunFolderLock {
  const mine: LockHolder = {
    pid: process.pid,
    host: hostname(),
    started: new Date().toISOString(),
    boot: bootId(),
  };
  const text = `${JSON.stringify(mine)}\n`;
  const temporary = join(folder.root, `.run.lock.${process.pid}.tmp`);
  try {
    writeFileSync(temporary, text);
  } catch (error) {
    rmSync(temporary, { force: true });
    throw Object.assign(error as Error, { path: folder.lock });
  }
  try {
    for (let attempt = 0; ; attempt++) {
      try {
        linkSync(temporary, folder.lock);
        break;
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code !== "EEXIST") throw error;
      }
      const holder = readHolder(folder.lock);
      if (holder === "gone") continue; // released between our link and our read
      if (holder !== null && isAlive(holder, mine))
        throw new RunFolderBusyError(busyMessage(out, folder.lock, holder, mine));
      if (attempt >= 3)
        throw new RunFolderBusyError(
          `--out ${out}: cannot take the lock ${folder.lock}: other runs keep changing it; try again`,
        );
      // Stale (or unreadable, so never finished by its writer): replace it under a takeover lock, so that of
      // two runs finding the same stale lock only one replaces it.
      if (takeOver(folder.lock, temporary, holder, mine)) {
        onNote(
          holder === null
            ? `${folder.lock} was unreadable; took the run folder over`
            : `took over the lock of a run that ended without releasing it (pid ${holder.pid} on ${holder.host}, started ${holder.started}) in ${out}`,
        );
        break;
      }
    }
  } finally {
    rmSync(temporary, { force: true });
  }
  const release = () => {
    process.off("exit", release);
    try {
      if (readFileSync(folder.lock, "utf8") === text) rmSync(folder.lock, { force: true });
    } catch {
      // already gone
    }
  };
  process.on("exit", release);
  return { release };
}

// Replaces the stale lock `holder` with ours, unless another run got there first. Returns whether it did.
function takeOver(lock: string, temporary: string, holder: LockHolder | null, mine: LockHolder): boolean {
  const guard = `${lock}.takeover`;
  try {
    linkSync(temporary, guard);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== "EEXIST") throw error;
    const other = readHolder(guard);
    // A run that died in the instant of its own takeover leaves the guard: it is stale like any lock.
    if (other !== "gone" && (other === null || !isAlive(other, mine)) && olderThan(guard, 2000))
      rmSync(guard, { force: true });
    return false;
  }
  try {
    const now = readHolder(lock);
    if (now !== "gone" && JSON.stringify(now) !== JSON.stringify(holder)) return false;
    renameSync(temporary, lock);
    return true;
  } finally {
    rmSync(guard, { force: true });
  }
}

function readHolder(path: string): LockHolder | null | "gone" {
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "ENOENT") return "gone";
    throw error;
  }
  try {
    const value = JSON.parse(text) as LockHolder;
    return typeof value.pid === "number" && typeof value.host === "string" ? value : null;
  } catch {
    return null;
  }
}

/** Whether the holder may still be running. Only a process of this host and boot can be checked. */
function isAlive(holder: LockHolder, mine: LockHolder): boolean {
  if (holder.host !== mine.host) return true;
  if (holder.boot !== null && mine.boot !== null && holder.boot !== mine.boot) return false;
  if (holder.pid === mine.pid) return false; // not us (we hold no lock yet): an earlier process with our pid
  try {
    process.kill(holder.pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === "EPERM"; // it exists, under another user
  }
}

function busyMessage(out: string, lock: string, holder: LockHolder, mine: LockHolder): string {
  const sameHost = holder.host === mine.host;
  return (
    `--out ${out} is in use by another run: pid ${holder.pid} on ${sameHost ? "this host" : "host"} ` +
    `${holder.host}, started ${holder.started} (lock ${lock}). Wait for it to end, or choose another --out.` +
    (sameHost ? "" : ` If that run is gone (its machine stopped), delete ${lock} and run again.`)
  );
}

function olderThan(path: string, ms: number): boolean {
  try {
    return Date.now() - statSync(path).mtimeMs > ms;
  } catch {
    return false;
  }
}

// Linux names each boot; elsewhere there is nothing to compare and only the pid decides.
function bootId(): string | null {
  try {
    return readFileSync("/proc/sys/kernel/random/boot_id", "utf8").trim();
  } catch {
    return null;
  }
}
