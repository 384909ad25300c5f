/** A copy of `a` in a new array of `size` elements (the rest zero): the growth step of the typed stores. */
export function grownInt(a: Int32Array, size: number): Int32Array {
  const b = new Int32Array(size);
  b.set(a);
  return b;
}

/** A copy of `a` in a new array of `size` elements (the rest zero). */
export function grownFloat(a: Float64Array, size: number): Float64Array {
  const b = new Float64Array(size);
  b.set(a);
  return b;
}
