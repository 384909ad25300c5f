import { type Zippable, zipSync } from "fflate";
import { encodeNpy, type NpyWriteDtype } from "../encode-npy.js";
import { encodeNpyBigInt64, encodeNpyStrings } from "./encode-npy-extra.js";

/**
 * One array of an .npz file. `dtype` says the element type to write; without it the values decide:
 * Float64Array → float64, Float32Array → float32, Int32Array and BigInt64Array → int64, string[] →
 * fixed-width unicode ("<U…"), number[] → int64 (non-integers are refused). `shape` defaults to one axis.
 */
export interface NpzArray {
  /** The key numpy shows: the member is stored as `<name>.npy`. */
  name: string;
  values:
    | Float64Array
    | Float32Array
    | Int32Array
    | BigInt64Array
    | ArrayLike<number>
    | readonly number[]
    | readonly string[];
  shape?: readonly number[];
  /** The element type to write; "unicode" for strings (needed only to mark an empty string[]). */
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
    if (array.dtype === "unicode" || typeof values[0] === "string") {
      const strings = Array.from(values as ArrayLike<unknown>);
      if (!strings.every((v) => typeof v === "string")) throw new RangeError("mixes strings and numbers");
      return encodeNpyStrings(strings as string[], shape);
    }
    if (values instanceof BigInt64Array) {
      if (array.dtype !== undefined && array.dtype !== "int64") {
        throw new RangeError(`BigInt64Array values cannot be written as ${array.dtype}`);
      }
      return encodeNpyBigInt64(values, shape);
    }
    const numbers = values as ArrayLike<number>;
    const dtype = array.dtype ?? inferredDtype(numbers);
    for (let k = 0; k < numbers.length; k++) {
      if (typeof numbers[k] !== "number") throw new RangeError("mixes strings and numbers");
    }
    return encodeNpy(numbers, shape, dtype);
  } catch (error) {
    throw where(error);
  }
}

function inferredDtype(values: ArrayLike<number>): NpyWriteDtype {
  if (values instanceof Float64Array) return "float64";
  if (values instanceof Float32Array) return "float32";
  return "int64";
}
