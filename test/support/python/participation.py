"""Reference per-node and per-edge participation counts from networkx, for
test/reference/counting-networkx-participation.test.ts.

Reads JSON on stdin: a graph spec as in clique_counts.py, plus optional "threshold" and "semantics".
Lists every simplex of the graph (at the threshold, if given) from networkx.enumerate_all_cliques (directed:
every admissible order of each clique of the underlying undirected graph) and writes, per dimension k:
"member"[k][v] (k-simplices containing v), "source"[k][v] / "sink"[k][v] (directed: v first / last) and
"edges": [[u, v, [count for k = 0..top]], ...] (k-simplices containing the edge u-v, or the arc u->v),
and the whole graph as "n", "directed", "graphEdges": [[u, v, w], ...].
"""

import json
import sys

import networkx as nx

from clique_counts import at_threshold, load


def orders(g, vertices):
    """Every order (v0..vk) of `vertices` with an arc vi -> vj for all i < j."""
    if len(vertices) <= 1:
        yield list(vertices)
        return
    for v in vertices:
        if all(g.has_edge(v, u) for u in vertices if u != v):
            for rest in orders(g, vertices - {v}):
                yield [v, *rest]


def main():
    spec = json.load(sys.stdin)
    g = load(spec)
    graph_edges = [[u, v, w] for u, v, w in g.edges(data="weight")]
    if "threshold" in spec:
        g = at_threshold(g, spec["threshold"], spec["semantics"])
    n = g.number_of_nodes()
    underlying = g.to_undirected() if g.is_directed() else g
    simplices = []
    for clique in nx.enumerate_all_cliques(underlying):
        simplices.extend(orders(g, frozenset(clique)) if g.is_directed() else [sorted(clique)])
    top = max((len(s) - 1 for s in simplices), default=0)
    member = [[0] * n for _ in range(top + 1)]
    source = [[0] * n for _ in range(top + 1)]
    sink = [[0] * n for _ in range(top + 1)]
    edges = {}
    for s in simplices:
        k = len(s) - 1
        for v in s:
            member[k][v] += 1
        source[k][s[0]] += 1
        sink[k][s[-1]] += 1
        for i in range(len(s)):
            for j in range(i + 1, len(s)):
                key = (s[i], s[j]) if g.is_directed() else (min(s[i], s[j]), max(s[i], s[j]))
                edges.setdefault(key, [0] * (top + 1))[k] += 1
    json.dump(
        {
            "n": n,
            "directed": g.is_directed(),
            "graphEdges": graph_edges,
            "member": member,
            "source": source,
            "sink": sink,
            "edges": [[u, v, counts] for (u, v), counts in sorted(edges.items())],
        },
        sys.stdout,
    )


if __name__ == "__main__":
    main()
