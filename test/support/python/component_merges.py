"""Connected components of a weighted graph below and at given thresholds, by networkx (outside reference).

stdin: {"n": int, "edges": [[u, v, w], ...] (undirected, distance weights), "thresholds": [t, ...]}
stdout: {"below": [[component id of each vertex] per t], "at": [[component id of each vertex] per t]}
"below" keeps the edges with w < t, "at" those with w <= t (networkx.connected_components); a component's
id is its smallest vertex.
"""
import json
import sys

import networkx as nx

job = json.load(sys.stdin)


def labels(keep):
    graph = nx.Graph()
    graph.add_nodes_from(range(job["n"]))
    graph.add_edges_from((u, v) for u, v, w in job["edges"] if keep(w))
    label = [0] * job["n"]
    for component in nx.connected_components(graph):
        smallest = min(component)
        for v in component:
            label[v] = smallest
    return label


out = {
    "below": [labels(lambda w, t=t: w < t) for t in job["thresholds"]],
    "at": [labels(lambda w, t=t: w <= t) for t in job["thresholds"]],
}
json.dump(out, sys.stdout)
