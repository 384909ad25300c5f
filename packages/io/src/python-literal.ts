/** The values a .npy header may hold: a Python literal of dicts, tuples, lists, strings, ints and booleans. */
export type PythonValue = string | number | boolean | null | PythonValue[] | { [key: string]: PythonValue };

/** Thrown with the character offset in the literal where parsing failed. */
export class PythonLiteralError extends Error {
  readonly offset: number;
  constructor(message: string, offset: number) {
    super(message);
    this.offset = offset;
  }
}

/**
 * Parses the small subset of Python literal syntax the .npy format uses for its header (NumPy format
 * specification, NEP 1: "a Python literal expression of a dictionary"). Tuples and lists both become arrays.
 * Never evaluates anything.
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

  const value = (): PythonValue => {
    skipSpace();
    const ch = text[pos];
    if (ch === "{") {
      pos++;
      const out: { [key: string]: PythonValue } = {};
      sequence("}", () => {
        const key = value();
        if (typeof key !== "string") fail("dictionary keys must be strings");
        expect(":");
        out[key as string] = value();
      });
      return out;
    }
    if (ch === "(" || ch === "[") {
      pos++;
      const out: PythonValue[] = [];
      sequence(ch === "(" ? ")" : "]", () => out.push(value()));
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
    const word = /^(?:True|False|None|[+-]?\d+L?)/.exec(text.slice(pos, pos + 40));
    if (!word) return fail(`unexpected ${describe()}`);
    pos += word[0].length;
    if (word[0] === "True") return true;
    if (word[0] === "False") return false;
    if (word[0] === "None") return null;
    return Number(word[0].replace("L", ""));
  };

  const result = value();
  skipSpace();
  if (pos < text.length) fail(`unexpected ${describe()} after the dictionary`);
  return result;
}
