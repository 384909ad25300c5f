/** The element types this package reads from .npy files. */
export interface NpyDtype {
  /** f = IEEE float, i = signed integer, u = unsigned integer, b = boolean. */
  kind: "f" | "i" | "u" | "b";
  /** Bytes per element. */
  size: number;
  littleEndian: boolean;
  /** The descr string as written in the file, e.g. "<f8". */
  descr: string;
}

// True on the machine running us; "=" in a descr means this machine's byte order.
const NATIVE_LITTLE = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

const SIZES: Record<string, readonly number[]> = { f: [4, 8], i: [1, 2, 4, 8], u: [1, 2, 4, 8], b: [1] };

/**
 * Parses a simple array-protocol type string (NumPy's "descr": byte order < > | =, kind letter, size in
 * bytes). Returns undefined for anything else, e.g. complex, float16, strings or structured types.
 */
export function parseDescr(descr: string): NpyDtype | undefined {
  const match = /^([<>|=])([fiub])(\d+)$/.exec(descr);
  if (!match) return undefined;
  const [, order, kind, digits] = match;
  const size = Number(digits);
  if (!SIZES[kind].includes(size)) return undefined;
  const littleEndian = order === "<" || (order === "=" && NATIVE_LITTLE) || (order === "|" && size === 1);
  if (order === "|" && size !== 1) return undefined;
  return { kind: kind as NpyDtype["kind"], size, littleEndian, descr };
}

/** Reads one element as a JavaScript number; 64-bit integers beyond 2^53 are rounded (the caller warns). */
export function readElement(view: DataView, offset: number, dtype: NpyDtype): number {
  const le = dtype.littleEndian;
  switch (dtype.kind) {
    case "f":
      return dtype.size === 8 ? view.getFloat64(offset, le) : view.getFloat32(offset, le);
    case "b":
      return view.getUint8(offset) === 0 ? 0 : 1;
    case "i":
      switch (dtype.size) {
        case 1:
          return view.getInt8(offset);
        case 2:
          return view.getInt16(offset, le);
        case 4:
          return view.getInt32(offset, le);
        default:
          return Number(view.getBigInt64(offset, le));
      }
    default:
      switch (dtype.size) {
        case 1:
          return view.getUint8(offset);
        case 2:
          return view.getUint16(offset, le);
        case 4:
          return view.getUint32(offset, le);
        default:
          return Number(view.getBigUint64(offset, le));
      }
  }
}

export const SUPPORTED_DTYPES =
  "float32, float64, int8, int16, int32, int64, uint8, uint16, uint32, uint64, bool (either byte order)";
