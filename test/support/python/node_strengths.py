"""Reference degrees and strengths per node from networkx, for
test/reference/node-edge-features-networkx.test.ts.

Reads JSON on stdin: a graph spec as in clique_counts.py, plus optional "threshold" and "semantics"
("distance": keep w <= threshold; "similarity": keep w >= threshold; weights are kept). Writes JSON: the
graph's edges [u, v, w] and, per node in order 0..n-1, "degree" and "strength" (undirected:
Graph.degree() and Graph.degree(weight="weight")) or "in_degree", "out_degree", "in_strength",
"out_strength" (directed: DiGraph.in_degree / out_degree, with and without weight="weight").
"""

import json
import sys

from clique_counts import load


def main():
    spec = json.load(sys.stdin)
    g = load(spec)
    edges = [[u, v, w] for u, v, w in g.edges(data="weight")]
    if "threshold" in spec:
        t, semantics = spec["threshold"], spec["semantics"]
        drop = [
            (u, v)
            for u, v, w in g.edges(data="weight")
            if not (w <= t if semantics == "distance" else w >= t)
        ]
        g.remove_edges_from(drop)
    nodes = range(g.number_of_nodes())
    if g.is_directed():
        result = {
            "in_degree": [g.in_degree(v) for v in nodes],
            "out_degree": [g.out_degree(v) for v in nodes],
            "in_strength": [g.in_degree(v, weight="weight") for v in nodes],
            "out_strength": [g.out_degree(v, weight="weight") for v in nodes],
        }
    else:
        result = {
            "degree": [g.degree(v) for v in nodes],
            "strength": [g.degree(v, weight="weight") for v in nodes],
        }
    json.dump({"n": g.number_of_nodes(), "edges": edges, **result}, sys.stdout)


if __name__ == "__main__":
    main()
