import { encodeNpy, type NpyWriteDtype } from "./encode-npy.js";
import { writeFileAtomic } from "./write/write-file-atomic.js";

/** Writes a .npy file atomically (see writeFileAtomic): a crash never leaves a half-written file. */
export function writeNpyFile(
  path: string,
  values: ArrayLike<number>,
  shape: readonly number[],
  dtype: NpyWriteDtype = "float64",
): void {
  writeFileAtomic(path, encodeNpy(values, shape, dtype));
}
