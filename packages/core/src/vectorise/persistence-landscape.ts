/**
 * The first `layers` persistence landscape functions sampled at `samples` (P. Bubenik, "Statistical
 * topological data analysis using persistence landscapes", JMLR 16, 2015, Definition 3):
 *
 *   λ_k(t) = k-th largest value of max(0, min(t − b_i, d_i − t)) over the points (b_i, d_i),
 *
 * 0 when there are fewer than k points. Result row-major [layer][sample]: λ_{k+1}(samples[s]) at
 * k · samples.length + s.
 */
export function persistenceLandscape(
  births: ArrayLike<number>,
  deaths: ArrayLike<number>,
  layers: number,
  samples: ArrayLike<number>,
): Float64Array {
  if (!Number.isInteger(layers) || layers < 1)
    throw new RangeError(`layers must be an integer ≥ 1, got ${layers}`);
  const T = samples.length;
  const out = new Float64Array(layers * T);
  const top = new Float64Array(layers); // the largest tent values at one sample, descending
  for (let s = 0; s < T; s++) {
    const t = samples[s];
    top.fill(0);
    for (let i = 0; i < births.length; i++) {
      const tent = Math.min(t - births[i], deaths[i] - t);
      if (!(tent > top[layers - 1])) continue;
      let at = layers - 1;
      for (; at > 0 && top[at - 1] < tent; at--) top[at] = top[at - 1];
      top[at] = tent;
    }
    for (let k = 0; k < layers; k++) out[k * T + s] = top[k];
  }
  return out;
}
