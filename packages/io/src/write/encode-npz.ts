import { type Zippable, zipSync } from "fflate";
import { encodeNpy, type NpyWriteDtype } from "../encode-npy.js";
import { encodeNpyBigInt64, encodeNpyStrings } from "./encode-npy-extra.js";

/**
 * One array of an .npz file. The element type follows the values: Float64Array → float64,
 * Float32Array → float32, Int32Array and BigInt64Array → int64, string[] → fixed-width unicode ("<U…"),
 * number[] → `dtype` (default int64, which refuses non-integers). `shape` defaults to one axis.
 */
export interface NpzArray {
  /** The key numpy shows: the member is stored as `<name>.npy`. */
  name: string;
  values: Float64Array | Float32Array | Int32Array | BigInt64Array | readonly number[] | readonly string[];
  shape?: readonly number[];
  /** For number[]: the element type to write; "unicode" marks an empty string[] as strings. */
  dtype?: NpyWriteDtype | "unicode";
}

export interface NpzEncodeOptions {
  /** Deflate the members (as numpy.savez_compressed does). Default false: stored, as numpy.savez does. */
  compress?: boolean;
}

// Zip entries carry a DOS date in local time. Built from local fields at each call (the time zone can change
// while we run), it gives the same bytes in every zone. 1980-01-01 is the earliest DOS date (PKWARE APPNOTE
// 4.4.6).
const fixedTime = () => new Date(1980, 0, 1, 0, 0, 0);

/**
 * Encodes arrays as an .npz file: a zip archive (PKWARE APPNOTE) of .npy members, which numpy.load opens
 * without allow_pickle. Same input, same bytes: timestamps are fixed and members keep the given order.
 */
export function encodeNpz(arrays: readonly NpzArray[], options: NpzEncodeOptions = {}): Uint8Array {
  const members: Zippable = {};
  const level = options.compress ? 6 : 0;
  const mtime = fixedTime();
  for (const array of arrays) {
    if (array.name === "" || array.name.includes("/")) {
      throw new RangeError(`array name ${JSON.stringify(array.name)} is empty or contains "/"`);
    }
    const member = `${array.name}.npy`;
    if (member in members) throw new RangeError(`two arrays are named ${JSON.stringify(array.name)}`);
    members[member] = [encodeArray(array), { level, mtime }];
  }
  return zipSync(members, { level, mtime });
}

function encodeArray(array: NpzArray): Uint8Array {
  const { values } = array;
  const shape = array.shape ?? [values.length];
  const where = (error: unknown) =>
    new RangeError(`array ${JSON.stringify(array.name)}: ${(error as Error).message}`);
  try {
    if (values instanceof BigInt64Array) return encodeNpyBigInt64(values, shape);
    if (values instanceof Float64Array) return encodeNpy(values, shape, "float64");
    if (values instanceof Float32Array) return encodeNpy(values, shape, "float32");
    if (values instanceof Int32Array) return encodeNpy(values, shape, "int64");
    if (array.dtype === "unicode" || typeof values[0] === "string") {
      if (!values.every((v) => typeof v === "string")) throw new RangeError("mixes strings and numbers");
      return encodeNpyStrings(values as readonly string[], shape);
    }
    if (!values.every((v) => typeof v === "number")) throw new RangeError("mixes strings and numbers");
    return encodeNpy(
      values as readonly number[],
      shape,
      (array.dtype as NpyWriteDtype | undefined) ?? "int64",
    );
  } catch (error) {
    throw where(error);
  }
}
