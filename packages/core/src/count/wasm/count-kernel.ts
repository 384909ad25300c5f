import { COUNT_KERNEL_BASE64 } from "./count-kernel-bytes.js";

/**
 * The WebAssembly counting kernel (source: packages/core/wasm/count-kernel.ts), instantiated synchronously
 * on first use from bytes embedded in the module. null where the runtime has no WebAssembly or refuses to
 * compile it (e.g. a page whose content security policy forbids it): the TypeScript counter then runs.
 */
export interface CountKernel {
  readonly memory: { readonly buffer: ArrayBuffer; grow(pages: number): number };
  /** Reads the layout table at address 0 (see wasm-counter.ts). */
  setup(): void;
  /** Counts the subtrees of roots from ≤ v < to. */
  countRoots(from: number, to: number): void;
  isTruncated(): number;
}

/** Called by the kernel when the simplex count passes the checkpoint; may throw to stop the count. */
let onCheckpoint: (depth: number) => void = () => {};

export function setKernelCheckpoint(hook: (depth: number) => void): void {
  onCheckpoint = hook;
}

// Only the part of the WebAssembly JS API used here (the core is compiled without DOM or Node types).
interface WasmApi {
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports: object) => { exports: unknown };
}

let compiled: object | null | undefined;
let kernel: CountKernel | null = null;

/** The kernel instance (compiled once, instantiated again after discardKernel), or null if unavailable. */
export function countKernel(): CountKernel | null {
  if (kernel !== null) return kernel;
  const api = (globalThis as { WebAssembly?: WasmApi }).WebAssembly;
  if (compiled === undefined) {
    try {
      compiled = api === undefined ? null : new api.Module(decodeBase64(COUNT_KERNEL_BASE64));
    } catch {
      compiled = null;
    }
  }
  if (compiled === null || api === undefined) return null;
  const imports = { "count-kernel": { passCheckpoint: (depth: number) => onCheckpoint(depth) } };
  kernel = new api.Instance(compiled, imports).exports as CountKernel;
  return kernel;
}

/** Drops the instance, so that the memory a large count grew can be reclaimed; the next use makes a new one. */
export function discardKernel(): void {
  kernel = null;
}

/** Bytes of a base64 string (RFC 4648 alphabet, with padding). Exported for its test only. */
export function decodeBase64(text: string): Uint8Array {
  const value = new Int8Array(128).fill(-1);
  const alphabet = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/";
  for (let i = 0; i < 64; i++) value[alphabet.charCodeAt(i)] = i;
  let end = text.length;
  while (end > 0 && text[end - 1] === "=") end--;
  const bytes = new Uint8Array((end * 3) >>> 2);
  let acc = 0;
  let bits = 0;
  let out = 0;
  for (let i = 0; i < end; i++) {
    acc = (acc << 6) | value[text.charCodeAt(i)];
    bits += 6;
    if (bits >= 8) {
      bits -= 8;
      bytes[out++] = (acc >>> bits) & 255;
    }
  }
  return bytes;
}
