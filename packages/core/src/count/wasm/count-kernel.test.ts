/**
 * The loader of the WebAssembly counting kernel (count-kernel.ts): one instance until it is discarded,
 * and null — so that counting goes on in TypeScript — wherever the runtime cannot give a kernel: no
 * WebAssembly at all, or a WebAssembly that refuses to compile (as under a content security policy that
 * forbids it). Counts are checked against C(n, k+1) for K_n (common practice).
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { binomial } from "../../../../../test/support/combinatorics.js";
import { completeGraph } from "../../../../../test/support/known-graphs.js";
import { seededRandom } from "../../../../../test/support/random.js";
import { decodeBase64 } from "./count-kernel.js";
import { COUNT_KERNEL_BASE64 } from "./count-kernel-bytes.js";

afterEach(() => {
  vi.unstubAllGlobals();
  vi.resetModules();
});

/** Fresh copies of the loader and of countSimplices, which see the globals as stubbed now. */
async function freshModules() {
  vi.resetModules();
  const loader = await import("./count-kernel.js");
  const { countSimplices } = await import("../count-simplices.js");
  return { ...loader, countSimplices };
}

describe("the kernel instance", () => {
  it("is the same object until discarded, then a new one that counts the same", async () => {
    const { countKernel, discardKernel, countSimplices } = await freshModules();
    const first = countKernel();
    expect(first).not.toBeNull();
    expect(countKernel()).toBe(first);
    discardKernel();
    const second = countKernel();
    expect(second).not.toBeNull();
    expect(second).not.toBe(first);
    expect(countKernel()).toBe(second);
    const k7 = Array.from({ length: 7 }, (_, k) => binomial(7, k + 1));
    expect(Array.from(countSimplices(completeGraph(7), { kernel: "webassembly" }).counts)).toEqual(k7);
  });

  it("is null where WebAssembly refuses to compile the kernel, and counting goes on in TypeScript", async () => {
    const real = (globalThis as { WebAssembly: { Instance: unknown } }).WebAssembly;
    let compiles = 0;
    vi.stubGlobal("WebAssembly", {
      Module: class {
        constructor() {
          compiles++;
          throw new Error("WebAssembly.Module(): refused by the content security policy");
        }
      },
      Instance: real.Instance,
    });
    const { countKernel, countSimplices } = await freshModules();
    expect(countKernel()).toBeNull();
    expect(countKernel()).toBeNull();
    expect(compiles).toBe(1); // a refusal is remembered, not retried on every count
    const k7 = Array.from({ length: 7 }, (_, k) => binomial(7, k + 1));
    expect(Array.from(countSimplices(completeGraph(7)).counts)).toEqual(k7);
    expect(() => countSimplices(completeGraph(7), { kernel: "webassembly" })).toThrow(
      /WebAssembly counting kernel is not available here/,
    );
  });

  it("is null, not an error, if WebAssembly is gone when a discarded instance is made again", async () => {
    const { countKernel, discardKernel } = await freshModules();
    expect(countKernel()).not.toBeNull();
    discardKernel();
    vi.stubGlobal("WebAssembly", undefined);
    expect(countKernel()).toBeNull();
  });
});

// The kernel's bytes are embedded as base64 and decoded by the loader's own decoder (the core runs where
// neither Node's Buffer nor a DOM atob may exist). Checked here against RFC 4648 ("The Base16, Base32, and
// Base64 Data Encodings", 2006), section 10's test vectors, and against Node's Buffer.from(text, "base64")
// as a general-purpose reference.
describe("the base64 decoder of the embedded kernel", () => {
  const bytesOf = (text: string) => Array.from(decodeBase64(text));
  const ascii = (s: string) => Array.from(s, (ch) => ch.charCodeAt(0));

  it("decodes the test vectors of RFC 4648, section 10", () => {
    const vectors: [string, string][] = [
      ["", ""],
      ["f", "Zg=="],
      ["fo", "Zm8="],
      ["foo", "Zm9v"],
      ["foob", "Zm9vYg=="],
      ["fooba", "Zm9vYmE="],
      ["foobar", "Zm9vYmFy"],
    ];
    for (const [plain, encoded] of vectors) expect(bytesOf(encoded), encoded).toEqual(ascii(plain));
  });

  it("agrees with Node's Buffer on random bytes of every length mod 3, padded and unpadded", () => {
    const random = seededRandom(4648);
    const seen = new Set<string>();
    for (let length = 0; length <= 40; length++) {
      const bytes = Buffer.from(Array.from({ length }, () => Math.floor(random() * 256)));
      const padded = bytes.toString("base64");
      for (const ch of padded.replace(/=+$/, "")) seen.add(ch);
      expect(bytesOf(padded), padded).toEqual(Array.from(bytes));
      expect(bytesOf(padded.replace(/=+$/, "")), `${padded} unpadded`).toEqual(Array.from(bytes));
    }
    expect(seen.size, "characters of the alphabet met").toBe(64);
  });

  it("decodes the embedded kernel as Node's Buffer does", () => {
    expect(Array.from(decodeBase64(COUNT_KERNEL_BASE64))).toEqual(
      Array.from(Buffer.from(COUNT_KERNEL_BASE64, "base64")),
    );
  });
});
