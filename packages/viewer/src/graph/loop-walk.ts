/**
 * The nodes of a closed edge loop in walking order, from its edges as node pairs [u0, v0, u1, v1, …] in
 * any orientation (directed loops may cross arcs backwards). The first node is repeated at the end.
 */
export function loopWalk(pairs: ArrayLike<number>): number[] {
  const m = pairs.length / 2;
  if (m === 0) return [];
  const used = new Uint8Array(m);
  const walk = [pairs[0], pairs[1]];
  used[0] = 1;
  for (let step = 1; step < m; step++) {
    const at = walk[walk.length - 1];
    let next = -1;
    for (let e = 0; e < m && next < 0; e++) {
      if (used[e]) continue;
      if (pairs[2 * e] === at) next = pairs[2 * e + 1];
      else if (pairs[2 * e + 1] === at) next = pairs[2 * e];
      if (next >= 0) used[e] = 1;
    }
    if (next < 0) throw new RangeError("the edges do not form one closed loop");
    walk.push(next);
  }
  if (walk[walk.length - 1] !== walk[0]) throw new RangeError("the edges do not form one closed loop");
  return walk;
}
