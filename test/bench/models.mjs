// Seeded JS versions of the yardstick's benchmark graph models (same models and sizes as its gen.py;
// not byte-identical to its numpy output). Each returns { n, directed, sources, targets, weights,
// semantics, note }: undirected edges appear once, no self-loops, no duplicates. Weights feed the sweep.
import { geometricSkip, seededRandom } from "./random.mjs";

class EdgeBuffer {
  constructor() {
    this.s = new Int32Array(1 << 16);
    this.t = new Int32Array(1 << 16);
    this.w = new Float64Array(1 << 16);
    this.m = 0;
  }
  push(u, v, w) {
    if (this.m === this.s.length) {
      const grow = (a) => {
        const b = new a.constructor(a.length * 2);
        b.set(a);
        return b;
      };
      this.s = grow(this.s);
      this.t = grow(this.t);
      this.w = grow(this.w);
    }
    this.s[this.m] = u;
    this.t[this.m] = v;
    this.w[this.m++] = w;
  }
  done(n, directed, semantics, note) {
    const m = this.m;
    return {
      n,
      directed,
      sources: this.s.slice(0, m),
      targets: this.t.slice(0, m),
      weights: this.w.slice(0, m),
      semantics,
      note,
    };
  }
}

/** G(n, p) on unordered pairs; uniform(0,1) distance weights. */
export function erUndirected({ n, p, seed }) {
  const rnd = seededRandom(seed);
  const out = new EdgeBuffer();
  for (let u = 0; u < n - 1; u++) {
    for (let v = u + 1 + geometricSkip(rnd, p); v < n; v += 1 + geometricSkip(rnd, p)) out.push(u, v, rnd());
  }
  return out.done(n, false, "distance", `Erdős–Rényi p=${p}`);
}

/** G(n, p) on ordered pairs (arcs); uniform(0,1) distance weights. */
export function erDirected({ n, p, seed }) {
  const rnd = seededRandom(seed);
  const out = new EdgeBuffer();
  for (let u = 0; u < n; u++) {
    for (let i = geometricSkip(rnd, p); i < n - 1; i += 1 + geometricSkip(rnd, p)) {
      out.push(u, i >= u ? i + 1 : i, rnd());
    }
  }
  return out.done(n, true, "distance", `directed Erdős–Rényi p=${p}`);
}

/** Complete graph with uniform(0,1) weights; keep the round(density · C(n,2)) strongest (similarity). */
export function thresholdComplete({ n, density, seed }) {
  const rnd = seededRandom(seed);
  const pairs = (n * (n - 1)) / 2;
  const w = new Float64Array(pairs);
  for (let i = 0; i < pairs; i++) w[i] = rnd();
  const keep = Math.round(density * pairs);
  const cut = Float64Array.from(w).sort()[pairs - keep];
  const out = new EdgeBuffer();
  let i = 0;
  for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++, i++) if (w[i] >= cut) out.push(u, v, w[i]);
  return out.done(n, false, "similarity", `complete graph, strongest ${density * 100}% kept`);
}

/** Points uniform in a box, bucketed into cubic cells of side ≥ `reach` for neighbour searches. */
function cellGrid(pts, n, side, reach) {
  const G = Math.max(1, Math.floor(side / reach));
  const cs = side / G;
  const cellOf = new Int32Array(n);
  const start = new Int32Array(G * G * G + 1);
  for (let i = 0; i < n; i++) {
    const x = Math.min(G - 1, Math.floor(pts[3 * i] / cs));
    const y = Math.min(G - 1, Math.floor(pts[3 * i + 1] / cs));
    const z = Math.min(G - 1, Math.floor(pts[3 * i + 2] / cs));
    cellOf[i] = (x * G + y) * G + z;
    start[cellOf[i] + 1]++;
  }
  for (let c = 0; c < G * G * G; c++) start[c + 1] += start[c];
  const members = new Int32Array(n);
  const fill = start.slice(0, G * G * G);
  for (let i = 0; i < n; i++) members[fill[cellOf[i]]++] = i;
  return { G, cs, start, members };
}

/** Random geometric graph in the unit cube, radius chosen so the mean degree is exactly avgDeg. */
export function randomGeometric({ n, avgDeg, seed }) {
  const rnd = seededRandom(seed);
  const pts = new Float64Array(3 * n);
  for (let i = 0; i < 3 * n; i++) pts[i] = rnd();
  const target = Math.round((avgDeg * n) / 2);
  let rmax = 1.5 * (avgDeg / ((n * 4 * Math.PI) / 3)) ** (1 / 3);
  for (;;) {
    const found = new EdgeBuffer();
    const { G, start, members } = cellGrid(pts, n, 1, rmax);
    for (let x = 0; x < G; x++)
      for (let y = 0; y < G; y++)
        for (let z = 0; z < G; z++) {
          const a = (x * G + y) * G + z;
          for (let dx = -1; dx <= 1; dx++)
            for (let dy = -1; dy <= 1; dy++)
              for (let dz = -1; dz <= 1; dz++) {
                const X = x + dx;
                const Y = y + dy;
                const Z = z + dz;
                if (X < 0 || Y < 0 || Z < 0 || X >= G || Y >= G || Z >= G) continue;
                const b = (X * G + Y) * G + Z;
                if (b < a) continue;
                for (let p = start[a]; p < start[a + 1]; p++) {
                  const i = members[p];
                  for (let q = b === a ? p + 1 : start[b]; q < start[b + 1]; q++) {
                    const j = members[q];
                    const ex = pts[3 * i] - pts[3 * j];
                    const ey = pts[3 * i + 1] - pts[3 * j + 1];
                    const ez = pts[3 * i + 2] - pts[3 * j + 2];
                    const d = Math.sqrt(ex * ex + ey * ey + ez * ez);
                    if (d < rmax) found.push(Math.min(i, j), Math.max(i, j), d);
                  }
                }
              }
        }
    if (found.m > target) {
      const d = found.w.slice(0, found.m);
      const sorted = Float64Array.from(d).sort();
      const r = sorted[target - 1];
      const out = new EdgeBuffer();
      for (let e = 0; e < found.m; e++)
        if (d[e] <= r && out.m < target) out.push(found.s[e], found.t[e], d[e]);
      return out.done(n, false, "distance", `random geometric graph, unit cube, radius ${r.toPrecision(6)}`);
    }
    rmax *= 1.3;
  }
}

/**
 * Distance-dependent digraph ("microcircuit-like"), the yardstick's model: n points uniform in a cube of
 * side (n/5000)^(1/3); a pair at distance d < c connects with probability p0·exp(−d/λ); a connected pair is
 * reciprocal with probability `recip`, else gets one direction by a fair coin. λ is set by bisection so
 * the expected mean out-degree is outDeg (on a distance histogram of up to 2000 sampled nodes). Pairs are
 * drawn per pair of cells with the cells' largest probability and thinned (exact, and fast).
 */
export function microcircuit({ n, outDeg, recip, p0, seed }) {
  const rnd = seededRandom(seed);
  const rho = 5000;
  const L = (n / rho) ** (1 / 3);
  const pts = new Float64Array(3 * n);
  for (let i = 0; i < 3 * n; i++) pts[i] = rnd() * L;
  const kUnd = (2 * outDeg) / (1 + recip);
  const lamInf = (kUnd / (rho * p0 * 8 * Math.PI)) ** (1 / 3);
  const c = 8 * lamInf * 1.5;

  // calibrate λ on a histogram of distances from sampled nodes
  const sample = Math.min(n, 2000);
  const bins = 20000;
  const hist = new Float64Array(bins);
  for (let s = 0; s < sample; s++) {
    const i = sample === n ? s : Math.floor(rnd() * n);
    for (let j = 0; j < n; j++) {
      if (j === i) continue;
      const ex = pts[3 * i] - pts[3 * j];
      const ey = pts[3 * i + 1] - pts[3 * j + 1];
      const ez = pts[3 * i + 2] - pts[3 * j + 2];
      const d = Math.sqrt(ex * ex + ey * ey + ez * ez);
      if (d < c) hist[Math.floor((d / c) * bins)]++;
    }
  }
  const partners = (lam) => {
    let sum = 0;
    for (let b = 0; b < bins; b++) if (hist[b] > 0) sum += hist[b] * Math.exp(-((b + 0.5) * c) / bins / lam);
    return (p0 * sum) / sample;
  };
  let lo = lamInf * 0.5;
  let hi = lamInf * 3;
  for (let it = 0; it < 60; it++) {
    const mid = (lo + hi) / 2;
    if (partners(mid) < kUnd) lo = mid;
    else hi = mid;
  }
  const lam = (lo + hi) / 2;

  const { G, cs, start, members } = cellGrid(pts, n, L, c / 8);
  const reach = Math.ceil(c / cs) + 1;
  const out = new EdgeBuffer();
  const connect = (i, j, d) => {
    const k = rnd();
    if (k < recip) {
      out.push(i, j, d);
      out.push(j, i, d);
    } else if (k < recip + (1 - recip) / 2) out.push(i, j, d);
    else out.push(j, i, d);
  };
  for (let a = 0; a < G * G * G; a++) {
    const ax = Math.floor(a / (G * G));
    const ay = Math.floor(a / G) % G;
    const az = a % G;
    const na = start[a + 1] - start[a];
    if (na === 0) continue;
    for (let dx = -reach; dx <= reach; dx++) {
      const X = ax + dx;
      if (X < 0 || X >= G) continue;
      for (let dy = -reach; dy <= reach; dy++) {
        const Y = ay + dy;
        if (Y < 0 || Y >= G) continue;
        for (let dz = -reach; dz <= reach; dz++) {
          const Z = az + dz;
          if (Z < 0 || Z >= G) continue;
          const b = (X * G + Y) * G + Z;
          if (b < a) continue;
          const gx = Math.max(Math.abs(dx) - 1, 0);
          const gy = Math.max(Math.abs(dy) - 1, 0);
          const gz = Math.max(Math.abs(dz) - 1, 0);
          const dmin = cs * Math.sqrt(gx * gx + gy * gy + gz * gz);
          if (dmin >= c) continue;
          const pmax = p0 * Math.exp(-dmin / lam);
          const nb = start[b + 1] - start[b];
          const same = a === b;
          const total = same ? (na * (na - 1)) / 2 : na * nb;
          for (let t = geometricSkip(rnd, pmax); t < total; t += 1 + geometricSkip(rnd, pmax)) {
            let i;
            let j;
            if (same) {
              // t-th pair (p < q) of the cell, row by row
              let p = 0;
              let rest = t;
              while (rest >= na - 1 - p) {
                rest -= na - 1 - p;
                p++;
              }
              i = members[start[a] + p];
              j = members[start[a] + p + 1 + rest];
            } else {
              i = members[start[a] + Math.floor(t / nb)];
              j = members[start[b] + (t % nb)];
            }
            const ex = pts[3 * i] - pts[3 * j];
            const ey = pts[3 * i + 1] - pts[3 * j + 1];
            const ez = pts[3 * i + 2] - pts[3 * j + 2];
            const d = Math.sqrt(ex * ex + ey * ey + ez * ez);
            if (d < c && rnd() * pmax < p0 * Math.exp(-d / lam)) connect(i, j, d);
          }
        }
      }
    }
  }
  return out.done(
    n,
    true,
    "distance",
    `3-D box side ${L.toPrecision(4)}, λ=${lam.toPrecision(4)}, cutoff ${c.toPrecision(4)}`,
  );
}

/** The yardstick's graph set: same models, parameters and sizes (seeds are ours). */
export const GRAPH_SPECS = {
  U1: {
    model: erUndirected,
    params: { n: 15000, p: 0.02, seed: 111 },
    what: "undirected Erdős–Rényi p=0.02",
  },
  U2: {
    model: thresholdComplete,
    params: { n: 1200, density: 0.3, seed: 112 },
    what: "complete graph, random weights, strongest 30 % kept",
  },
  U3: {
    model: randomGeometric,
    params: { n: 20000, avgDeg: 40, seed: 113 },
    what: "random geometric graph, mean degree 40",
  },
  D1: { model: erDirected, params: { n: 5000, p: 0.05, seed: 211 }, what: "directed Erdős–Rényi p=0.05" },
  D2: {
    model: microcircuit,
    params: { n: 50000, outDeg: 50, recip: 0.1, p0: 1, seed: 212 },
    what: "3-D box, exponential distance decay, mean out-degree 50, 10 % reciprocal",
  },
  D3: { model: erDirected, params: { n: 450, p: 0.3, seed: 213 }, what: "directed Erdős–Rényi p=0.3" },
  "U1-brief": {
    model: erUndirected,
    params: { n: 2000, p: 0.02, seed: 101 },
    what: "undirected Erdős–Rényi p=0.02",
  },
  "U2-brief": {
    model: thresholdComplete,
    params: { n: 300, density: 0.3, seed: 102 },
    what: "complete graph, random weights, strongest 30 % kept",
  },
  "U3-brief": {
    model: randomGeometric,
    params: { n: 5000, avgDeg: 40, seed: 103 },
    what: "random geometric graph, mean degree 40",
  },
  "D1-brief": {
    model: erDirected,
    params: { n: 1000, p: 0.05, seed: 201 },
    what: "directed Erdős–Rényi p=0.05",
  },
  "D2-brief": {
    model: microcircuit,
    params: { n: 5000, outDeg: 50, recip: 0.1, p0: 1, seed: 202 },
    what: "3-D box, exponential distance decay, mean out-degree 50, 10 % reciprocal",
  },
  "D3-brief": {
    model: erDirected,
    params: { n: 300, p: 0.3, seed: 203 },
    what: "directed Erdős–Rényi p=0.3",
  },
};

export function generateGraph(name) {
  const spec = GRAPH_SPECS[name];
  if (!spec) throw new Error(`unknown graph ${name}; known: ${Object.keys(GRAPH_SPECS).join(", ")}`);
  return spec.model(spec.params);
}
