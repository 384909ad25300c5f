import { renameSync, rmSync, writeFileSync } from "node:fs";
import { encodeNpy, type NpyWriteDtype } from "./encode-npy.js";

/**
 * Writes a .npy file atomically: to a temporary file beside the target, then renamed over it, so a
 * crash never leaves a half-written file under the real name.
 */
export function writeNpyFile(
  path: string,
  values: ArrayLike<number>,
  shape: readonly number[],
  dtype: NpyWriteDtype = "float64",
): void {
  const bytes = encodeNpy(values, shape, dtype);
  const temporary = `${path}.${process.pid}.${Date.now()}.tmp`;
  try {
    writeFileSync(temporary, bytes);
    renameSync(temporary, path);
  } catch (error) {
    rmSync(temporary, { force: true });
    throw error;
  }
}
