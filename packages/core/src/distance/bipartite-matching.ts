/**
 * Maximum bipartite matching by the Hopcroft–Karp algorithm (J. E. Hopcroft, R. M. Karp, "An n^{5/2}
 * algorithm for maximum matchings in bipartite graphs", SIAM J. Comput. 2, 1973), on a graph given as
 * compressed rows whose edges carry a cost: only edges of cost ≤ `limit` exist, so one graph serves every
 * threshold of a search. Left vertices with `active[u] = 0` take no part. Work arrays are kept
 * between calls.
 */
export class BipartiteMatcher {
  private matchLeft: Int32Array;
  private matchRight: Int32Array;
  private layer: Int32Array;
  private queue: Int32Array;
  private stack: Int32Array;
  private cursor: Int32Array;

  constructor(
    private readonly left: number,
    private readonly right: number,
    private readonly offsets: Int32Array,
    private readonly targets: Int32Array,
    private readonly costs: Float64Array,
  ) {
    this.matchLeft = new Int32Array(left);
    this.matchRight = new Int32Array(right);
    this.layer = new Int32Array(left);
    this.queue = new Int32Array(left);
    this.stack = new Int32Array(left);
    this.cursor = new Int32Array(left);
  }

  /** Size of a maximum matching among active left vertices, using edges of cost ≤ limit. */
  maximumMatching(limit: number, active: Uint8Array): number {
    const { left, offsets, targets, costs, matchLeft, matchRight, layer, queue } = this;
    matchLeft.fill(-1);
    matchRight.fill(-1, 0, this.right);
    let size = 0;
    // Greedy start: most vertices are matched here, leaving few augmenting phases.
    for (let u = 0; u < left; u++) {
      if (!active[u]) continue;
      for (let e = offsets[u]; e < offsets[u + 1]; e++) {
        if (costs[e] <= limit && matchRight[targets[e]] < 0) {
          matchRight[targets[e]] = u;
          matchLeft[u] = targets[e];
          size++;
          break;
        }
      }
    }
    const UNSEEN = 0x7fffffff;
    for (;;) {
      // Breadth-first layers from the free active left vertices along alternating paths.
      let head = 0;
      let tail = 0;
      for (let u = 0; u < left; u++) {
        if (active[u] && matchLeft[u] < 0) {
          layer[u] = 0;
          queue[tail++] = u;
        } else layer[u] = UNSEEN;
      }
      let reachedFree = false;
      while (head < tail) {
        const u = queue[head++];
        for (let e = offsets[u]; e < offsets[u + 1]; e++) {
          if (costs[e] > limit) continue;
          const w = matchRight[targets[e]];
          if (w < 0) reachedFree = true;
          else if (layer[w] === UNSEEN) {
            layer[w] = layer[u] + 1;
            queue[tail++] = w;
          }
        }
      }
      if (!reachedFree) return size;
      for (let u = 0; u < left; u++) this.cursor[u] = offsets[u];
      let grew = false;
      for (let u = 0; u < left; u++) {
        if (active[u] && matchLeft[u] < 0 && this.augment(u, limit)) {
          size++;
          grew = true;
        }
      }
      if (!grew) return size;
    }
  }

  /** Depth-first search for an augmenting path along the layers, iterative (paths can be long). */
  private augment(root: number, limit: number): boolean {
    const { offsets, targets, costs, matchLeft, matchRight, layer, stack, cursor } = this;
    let top = 0;
    stack[0] = root;
    while (top >= 0) {
      const u = stack[top];
      let e = cursor[u];
      while (e < offsets[u + 1] && costs[e] > limit) e++;
      cursor[u] = e;
      if (e < offsets[u + 1]) {
        const w = matchRight[targets[e]];
        if (w < 0) {
          // Flip the path: every vertex on the stack takes the edge its cursor points at.
          for (let k = top; k >= 0; k--) {
            const x = stack[k];
            const v = targets[cursor[x]];
            matchLeft[x] = v;
            matchRight[v] = x;
          }
          return true;
        }
        if (layer[w] === layer[u] + 1) stack[++top] = w;
        else cursor[u]++;
      } else {
        layer[u] = 0x7fffffff; // a dead end for the rest of this phase
        top--;
        if (top >= 0) cursor[stack[top]]++;
      }
    }
    return false;
  }
}
