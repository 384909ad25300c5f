"""Reference simplex counts from networkx, for test/reference/counting-networkx.test.ts.

Reads JSON on stdin: {"graph": "karate"}, {"graph": "gnp", "n", "p", "seed", "directed"} or
{"graph": "edges", "n", "directed", "edges": [[u, v, w], ...]}, plus optional "thresholds" (list),
"semantics" ("distance": keep w <= W; "similarity": keep w >= W) and "listSize" (list the cliques of
that size). Writes JSON: the graph's edges [u, v, w]; per threshold and for the whole graph, the number
of simplices per dimension k (index k = clique size - 1); and the listed cliques.

Undirected: networkx.enumerate_all_cliques. Directed flag complex (ordered tuples v0..vk with an arc
vi -> vj for all i < j): every such tuple spans a clique of the underlying undirected graph, so for each
clique from networkx.enumerate_all_cliques we count the vertex orders whose forward arcs all exist.
"""

import json
import random
import sys

import networkx as nx


def load(spec):
    if spec["graph"] == "edges":
        g = nx.DiGraph() if spec["directed"] else nx.Graph()
        g.add_nodes_from(range(spec["n"]))
        g.add_weighted_edges_from(spec["edges"])
        return g
    if spec["graph"] == "karate":
        # W. W. Zachary (1977), as shipped with networkx; "weight" = number of contexts of interaction.
        return nx.karate_club_graph()
    g = nx.gnp_random_graph(spec["n"], spec["p"], seed=spec["seed"], directed=spec["directed"])
    weights = random.Random(spec["seed"])
    for u, v in sorted(g.edges()):
        g[u][v]["weight"] = round(weights.random(), 2)  # rounded so that thresholds meet ties
    return g


def admissible_orders(g, vertices):
    """Orders (v0..vk) of `vertices` with an arc vi -> vj for all i < j: v0 must reach all the others."""
    if len(vertices) <= 1:
        return 1
    return sum(
        admissible_orders(g, vertices - {v})
        for v in vertices
        if all(g.has_edge(v, u) for u in vertices if u != v)
    )


def simplex_counts(g):
    counts = [0] * g.number_of_nodes()
    for clique in nx.enumerate_all_cliques(g.to_undirected(as_view=True) if g.is_directed() else g):
        counts[len(clique) - 1] += admissible_orders(g, frozenset(clique)) if g.is_directed() else 1
    while counts and counts[-1] == 0:
        counts.pop()
    return counts


def at_threshold(g, threshold, semantics):
    keep = [
        (u, v)
        for u, v, w in g.edges(data="weight")
        if (w <= threshold if semantics == "distance" else w >= threshold)
    ]
    h = g.__class__()
    h.add_nodes_from(g.nodes())
    h.add_edges_from(keep)
    return h


def main():
    spec = json.load(sys.stdin)
    g = load(spec)
    assert sorted(g.nodes()) == list(range(g.number_of_nodes()))
    result = {
        "n": g.number_of_nodes(),
        "directed": g.is_directed(),
        "edges": [[u, v, w] for u, v, w in g.edges(data="weight")],
        "all": simplex_counts(g),
        "perThreshold": [
            simplex_counts(at_threshold(g, t, spec["semantics"])) for t in spec.get("thresholds", [])
        ],
        "cliques": [
            sorted(c) for c in nx.enumerate_all_cliques(g.to_undirected()) if len(c) == spec.get("listSize")
        ],
    }
    json.dump(result, sys.stdout)


if __name__ == "__main__":
    main()
