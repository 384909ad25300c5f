/** Set bits of every 16-bit value: a 64 KiB table, so a 32-bit popcount is two loads and an add. */
const BITS16 = new Uint8Array(65536);
for (let i = 1; i < 65536; i++) BITS16[i] = (i & 1) + BITS16[i >>> 1];

/** Number of set bits of a 32-bit word. */
export function popcount32(x: number): number {
  return BITS16[x & 0xffff] + BITS16[x >>> 16];
}
