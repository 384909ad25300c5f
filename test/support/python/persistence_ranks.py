"""Persistence barcodes of a clique-complex filtration over Z/p from ranks alone (outside reference).

stdin: {"n": int, "edges": [[u, v, w], ...] (undirected, w > 0), "max_dim": k, "primes": [p, ...]}
stdout: {"levels": [0, w_1, ...], "simplices": [count per dim], "bars": {"p": [[dim, birth, death|null], ...]},
         "betti": {"p": [[β_0 … β_k] at each level]}}

The complex is built here, not by the project: networkx's enumerate_all_cliques lists the cliques with at
most max_dim + 2 vertices; a clique enters at the largest weight of its edges, vertices at 0 (level 0).
Ranks are exact, over GF(p), by sympy (DomainMatrix(..., GF(p)).rank()).

Bars come from persistent Betti numbers, with no matrix reduction: for levels i <= j,
  β_k^{i,j} = dim Z_k(K_i) - dim(Z_k(K_i) ∩ B_k(K_j)),
  dim Z_k(K_i) = #k-simplices of K_i - rank ∂_k(K_i),
  dim(Z_k(K_i) ∩ B_k(K_j)) = dim(B_k(K_j) ∩ C_k(K_i))
                           = rank ∂_{k+1}(K_j) - rank(∂_{k+1}(K_j) restricted to the rows of K_j \\ K_i)
(B_k(K_j) ⊂ Z_k(K_j) and Z_k(K_i) = Z_k(K_j) ∩ C_k(K_i)). The number of bars born at level i and dying
at level j is μ^{i,j} = β^{i,j-1} - β^{i,j} - β^{i-1,j-1} + β^{i-1,j}, and β^{i,T} - β^{i-1,T} are
essential (H. Edelsbrunner and J. Harer, Computational Topology: An Introduction, 2010, §VII.1, the
fundamental lemma of persistent homology; H. Edelsbrunner, D. Letscher, A. Zomorodian, "Topological
persistence and simplification", Discrete Comput. Geom. 28, 2002).
"""
import json
import sys
from functools import lru_cache

import networkx as nx
from sympy import GF
from sympy.polys.matrices import DomainMatrix

job = json.load(sys.stdin)
max_dim = job["max_dim"]
graph = nx.Graph()
graph.add_nodes_from(range(job["n"]))
for u, v, w in job["edges"]:
    graph.add_edge(u, v, weight=w)

levels = [0] + sorted({w for _, _, w in job["edges"]})
level_of_weight = {w: i for i, w in enumerate(levels)}
# simplices[d] = list of (entry level, sorted vertex tuple), d = 0 .. max_dim + 1
simplices = [[] for _ in range(max_dim + 2)]
for clique in nx.enumerate_all_cliques(graph):
    d = len(clique) - 1
    if d > max_dim + 1:
        break  # cliques come in order of size
    clique = tuple(sorted(clique))
    entry = max((graph[a][b]["weight"] for a in clique for b in clique if a < b), default=0)
    simplices[d].append((level_of_weight[entry], clique))
index = [{s: i for i, (_, s) in enumerate(dim_list)} for dim_list in simplices]


def rank(p, d, col_level, row_min_level):
    """Rank of ∂_d over GF(p) on the d-simplices of K_col_level, keeping rows entering after row_min_level."""
    field = GF(p)
    cols = [s for lvl, s in simplices[d] if lvl <= col_level]
    rows = {}
    for lvl, s in simplices[d - 1]:
        if row_min_level < lvl <= col_level:
            rows[index[d - 1][s]] = len(rows)
    if not cols or not rows:
        return 0
    dense = [[0] * len(cols) for _ in range(len(rows))]
    for c, s in enumerate(cols):
        for i in range(len(s)):
            face = s[:i] + s[i + 1:]
            r = rows.get(index[d - 1][face])
            if r is not None:
                dense[r][c] = 1 if i % 2 == 0 else -1
    matrix = DomainMatrix([[field(x) for x in row] for row in dense], (len(rows), len(cols)), field)
    return int(matrix.rank())


out = {"levels": levels, "simplices": [len(s) for s in simplices], "bars": {}, "betti": {}}
top = len(levels) - 1
for p in job["primes"]:
    cached = lru_cache(maxsize=None)(lambda d, c, r: 0 if d == 0 else rank(p, d, c, r))

    def persistent_betti(k, i, j):
        if i < 0:
            return 0
        cycles = sum(1 for lvl, _ in simplices[k] if lvl <= i) - cached(k, i, -1)
        return cycles - cached(k + 1, j, -1) + cached(k + 1, j, i)

    bars = []
    for k in range(max_dim + 1):
        for i in range(top + 1):
            for j in range(i + 1, top + 1):
                mult = (persistent_betti(k, i, j - 1) - persistent_betti(k, i, j)
                        - persistent_betti(k, i - 1, j - 1) + persistent_betti(k, i - 1, j))
                bars += [[k, levels[i], levels[j]]] * mult
            mult = persistent_betti(k, i, top) - persistent_betti(k, i - 1, top)
            bars += [[k, levels[i], None]] * mult
    out["bars"][str(p)] = bars
    out["betti"][str(p)] = [[persistent_betti(k, i, i) for k in range(max_dim + 1)] for i in range(top + 1)]
json.dump(out, sys.stdout)
