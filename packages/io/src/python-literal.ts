/**
 * The values a .npy header may hold: a Python literal of dicts, tuples, lists, strings, ints and booleans.
 * Integers beyond 2^53 stay exact as bigint, so a forged shape is refused for what it is.
 */
export type PythonValue =
  | string
  | number
  | bigint
  | boolean
  | null
  | PythonValue[]
  | { [key: string]: PythonValue };

/** Thrown with the character offset in the literal where parsing failed. */
export class PythonLiteralError extends Error {
  readonly offset: number;
  constructor(message: string, offset: number) {
    super(message);
    this.offset = offset;
  }
}

/** Deepest nesting read. numpy's own headers nest two levels (a dict holding a tuple). */
export const MAX_LITERAL_DEPTH = 32;

/**
 * Parses the small subset of Python literal syntax the .npy format uses for its header (NumPy format
 * specification, NEP 1: "a Python literal expression of a dictionary"). Tuples and lists both become arrays;
 * dicts become objects without a prototype, so a key like `__proto__` is a key like any other. Never
 * evaluates anything, and refuses nesting deeper than MAX_LITERAL_DEPTH instead of recursing without end.
 */
export function parsePythonLiteral(text: string): PythonValue {
  let pos = 0;
  const fail = (message: string): never => {
    throw new PythonLiteralError(message, pos);
  };
  const skipSpace = () => {
    while (pos < text.length && /\s/.test(text[pos])) pos++;
  };
  const expect = (ch: string) => {
    skipSpace();
    if (text[pos] !== ch) fail(`expected ${JSON.stringify(ch)} but found ${describe()}`);
    pos++;
  };
  const describe = () => (pos >= text.length ? "the end of the header" : JSON.stringify(text[pos]));

  const sequence = (close: string, item: () => void) => {
    for (;;) {
      skipSpace();
      if (text[pos] === close) {
        pos++;
        return;
      }
      item();
      skipSpace();
      if (text[pos] === ",") {
        pos++;
        continue;
      }
      expect(close);
      return;
    }
  };

  const value = (depth: number): PythonValue => {
    skipSpace();
    const ch = text[pos];
    if ((ch === "{" || ch === "(" || ch === "[") && depth >= MAX_LITERAL_DEPTH) {
      fail(`nested more than ${MAX_LITERAL_DEPTH} levels deep`);
    }
    if (ch === "{") {
      pos++;
      const out: { [key: string]: PythonValue } = Object.create(null);
      sequence("}", () => {
        const key = value(depth + 1);
        if (typeof key !== "string") fail("dictionary keys must be strings");
        expect(":");
        out[key as string] = value(depth + 1);
      });
      return out;
    }
    if (ch === "(" || ch === "[") {
      pos++;
      const out: PythonValue[] = [];
      sequence(ch === "(" ? ")" : "]", () => out.push(value(depth + 1)));
      return out;
    }
    if (ch === "'" || ch === '"') {
      const end = text.indexOf(ch, pos + 1);
      if (end < 0) fail("string is never closed");
      const s = text.slice(pos + 1, end);
      if (s.includes("\\")) fail("escapes in strings are not supported");
      pos = end + 1;
      return s;
    }
    const word = /^(?:True|False|None)/.exec(text.slice(pos, pos + 5));
    if (word) {
      pos += word[0].length;
      return word[0] === "True" ? true : word[0] === "False" ? false : null;
    }
    const digits = /[+-]?\d+/y;
    digits.lastIndex = pos;
    const integer = digits.exec(text);
    if (!integer) return fail(`unexpected ${describe()}`);
    pos = digits.lastIndex;
    if (text[pos] === "L") pos++; // Python 2's long suffix, in files written by old numpy
    const exact = BigInt(integer[0]);
    return exact >= BigInt(Number.MIN_SAFE_INTEGER) && exact <= BigInt(Number.MAX_SAFE_INTEGER)
      ? Number(exact)
      : exact;
  };

  const result = value(0);
  skipSpace();
  if (pos < text.length) fail(`unexpected ${describe()} after the dictionary`);
  return result;
}
