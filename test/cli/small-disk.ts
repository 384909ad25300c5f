import { spawnSync } from "node:child_process";
import { mkdtempSync, rmdirSync, statfsSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

/**
 * Real file-system conditions for the write-failure tests: a small tmpfs (a full disk), remounted
 * read-only when asked. Mounting needs root (CAP_SYS_ADMIN); otherwise `smallDiskMissing` says why the
 * tests that need it are skipped (the reason goes into their names).
 */
export const smallDiskMissing: string | null = (() => {
  if (process.getuid?.() !== 0) return "(skipped: mounting a small tmpfs needs root)";
  const probe = mkdtempSync(join(tmpdir(), "cliquescape-probe-"));
  const mounted = spawnSync("mount", ["-t", "tmpfs", "-o", "size=1m", "tmpfs", probe], { encoding: "utf8" });
  if (mounted.status !== 0)
    return `(skipped: mount -t tmpfs refused: ${(mounted.stderr || String(mounted.error)).trim()})`;
  spawnSync("umount", [probe]);
  rmdirSync(probe);
  return null;
})();

export interface SmallDisk {
  dir: string;
  /** Fills the disk until only `pages` pages of 4 KiB stay free; returns the filler file. */
  fillLeaving(pages: number): string;
  readOnly(on: boolean): void;
  unmount(): void;
}

/** A fresh tmpfs of `mib` MiB (call only when smallDiskMissing is null). */
export function mountSmallDisk(mib: number): SmallDisk {
  const dir = mkdtempSync(join(tmpdir(), "cliquescape-disk-"));
  const mounted = spawnSync("mount", ["-t", "tmpfs", "-o", `size=${mib}m`, "tmpfs", dir], {
    encoding: "utf8",
  });
  if (mounted.status !== 0) throw new Error(`mount failed: ${mounted.stderr}`);
  return {
    dir,
    fillLeaving(pages) {
      const { bavail, bsize } = statfsSync(dir);
      const filler = join(dir, "filler.bin");
      writeFileSync(filler, Buffer.alloc(Math.max(0, (bavail - pages) * bsize)));
      return filler;
    },
    readOnly(on) {
      const run = spawnSync("mount", ["-o", `remount,${on ? "ro" : "rw"}`, dir], { encoding: "utf8" });
      if (run.status !== 0) throw new Error(`remount failed: ${run.stderr}`);
    },
    unmount() {
      spawnSync("umount", ["-l", dir]);
      rmdirSync(dir);
    },
  };
}
