/**
 * Exact mean and variance of simplex counts in Erdős–Rényi random graphs, for statistical tests.
 */
import { binomial, fallingFactorial } from "./combinatorics.js";

export interface Moments {
  mean: number;
  variance: number;
}

/**
 * Number of k-cliques (k vertices, i.e. (k−1)-simplices) in G(n, p).
 *
 * Mean: C(n, k) p^{C(k,2)} (B. Bollobás, Random Graphs, 2nd ed., 2001, ch. 4). Variance, derived here: write
 * X = Σ_A 1[A is a clique] over k-sets A. Two k-sets sharing s vertices share C(s, 2) possible edges, so
 * Cov = p^{2C(k,2) − C(s,2)} − p^{2C(k,2)}, which is 0 for s ≤ 1 (no common edge: independent). There are
 * C(n, k) C(k, s) C(n−k, k−s) ordered pairs (A, B) with |A ∩ B| = s, hence
 * Var X = Σ_{s=2..k} C(n, k) C(k, s) C(n−k, k−s) (p^{2C(k,2) − C(s,2)} − p^{2C(k,2)}).
 */
export function cliqueCountMoments(n: number, p: number, k: number): Moments {
  const edges = binomial(k, 2);
  const mean = binomial(n, k) * p ** edges;
  let variance = 0;
  for (let s = 2; s <= k; s++) {
    const pairs = binomial(n, k) * binomial(k, s) * binomial(n - k, k - s);
    variance += pairs * (p ** (2 * edges - binomial(s, 2)) - p ** (2 * edges));
  }
  return { mean, variance };
}

/**
 * Number of directed k-simplices, i.e. ordered (k+1)-tuples (v0..vk) of distinct vertices with an arc
 * vi→vj for every i < j, in the directed Erdős–Rényi graph where each of the n(n−1) ordered pairs is an arc
 * independently with probability p.
 *
 * Mean, derived here: there are n!/(n−k−1)! ordered tuples of m = k+1 distinct vertices; each needs its
 * C(m, 2) = k(k+1)/2 forward arcs, all distinct ordered pairs and hence independent, so
 * E = n!/(n−k−1)! · p^{k(k+1)/2}.
 *
 * Variance, derived here: for two tuples σ, τ let M be the set of position pairs (i, a) with σ_i = τ_a
 * (a partial injective map between positions 0..m−1). They share the arc σ_i→σ_j = τ_a→τ_b exactly
 * when (i, a), (j, b) ∈ M with i < j and a < b (a "concordant" pair); a discordant pair gives opposite arcs,
 * which are distinct and independent. With c(M) concordant pairs,
 * Cov = p^{2C(m,2) − c(M)} − p^{2C(m,2)}, zero when c(M) = 0. Given M with s matched positions there are
 * (n)_m choices of σ and (n−m)_{m−s} of τ's unmatched entries, so
 * Var = Σ_M (n)_m (n−m)_{m−s} (p^{2C(m,2) − c(M)} − p^{2C(m,2)}), summed over all partial injective maps M.
 */
export function directedSimplexCountMoments(n: number, p: number, k: number): Moments {
  const m = k + 1;
  const arcs = binomial(m, 2);
  const mean = fallingFactorial(n, m) * p ** arcs;
  let variance = 0;
  forEachPartialMatching(m, (matched) => {
    const s = matched.length;
    let concordant = 0;
    for (let x = 0; x < s; x++) {
      for (let y = x + 1; y < s; y++) {
        // matched pairs are listed with increasing σ-position, so concordance is a < b.
        if (matched[x] < matched[y]) concordant++;
      }
    }
    if (concordant === 0) return;
    const pairs = fallingFactorial(n, m) * fallingFactorial(n - m, m - s);
    variance += pairs * (p ** (2 * arcs - concordant) - p ** (2 * arcs));
  });
  return { mean, variance };
}

/**
 * Calls `visit` once per partial injective map from positions 0..m−1 of σ to positions 0..m−1 of τ,
 * given as the τ-positions of the matched σ-positions in increasing σ-position order.
 */
function forEachPartialMatching(m: number, visit: (matched: number[]) => void): void {
  const used = new Array<boolean>(m).fill(false);
  const matched: number[] = [];
  const extend = (i: number): void => {
    if (i === m) {
      visit(matched);
      return;
    }
    extend(i + 1); // σ-position i unmatched
    for (let a = 0; a < m; a++) {
      if (used[a]) continue;
      used[a] = true;
      matched.push(a);
      extend(i + 1);
      matched.pop();
      used[a] = false;
    }
  };
  extend(0);
}
