"""Reference counts of low-dimensional simplices by tensor contraction with numpy (numpy.einsum).

Reads JSON on stdin: {"n", "directed", "edges": [[u, v, w], ...], "thresholds": [...], "semantics"}.
For the graph at each threshold ("distance": keep w <= W; "similarity": keep w >= W) and with all edges,
writes the number of k-simplices for k = 0..3 as [[c0, c1, c2, c3], ...] under "perThreshold" and "all".

With A the 0/1 adjacency matrix (zero diagonal), a directed k-simplex (v0..vk) is a product of A[vi, vj]
over i < j, so the counts are sums of such products (common practice); the zero diagonal makes
repeated vertices contribute nothing. An undirected k-clique is counted (k+1)! times that way.
"""

import json
import math
import sys

import numpy as np


def three_simplices(a):
    """Sum over a, b, c, d of A_ab A_ac A_ad A_bc A_bd A_cd, as Sum_ab A_ab x^T A x with x = A[a] * A[b]."""
    x = a[:, None, :] * a[None, :, :]
    return (a * np.einsum("abc,cd,abd->ab", x, a, x, optimize=True)).sum()


def counts(n, directed, edges):
    a = np.zeros((n, n), dtype=np.float64)
    for u, v in edges:
        a[u, v] = 1
        if not directed:
            a[v, u] = 1
    ordered = [
        n,
        a.sum(),
        np.einsum("ab,ac,bc->", a, a, a, optimize=True),
        three_simplices(a),
    ]
    if not directed:
        ordered = [c / math.factorial(k + 1) for k, c in enumerate(ordered)]
    return [int(round(float(c))) for c in ordered]


def main():
    spec = json.load(sys.stdin)
    n, directed = spec["n"], spec["directed"]

    def kept(threshold):
        keep = (lambda w: w <= threshold) if spec["semantics"] == "distance" else (lambda w: w >= threshold)
        return [(u, v) for u, v, w in spec["edges"] if keep(w)]

    json.dump(
        {
            "all": counts(n, directed, [(u, v) for u, v, _ in spec["edges"]]),
            "perThreshold": [counts(n, directed, kept(t)) for t in spec["thresholds"]],
        },
        sys.stdout,
    )


main()
