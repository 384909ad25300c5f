"""Core numbers of undirected graphs from networkx, for test/reference/degeneracy-order-networkx.test.ts.

Reads JSON on stdin, one of
  {"graph": "karate"}      W. W. Zachary (1977), networkx.karate_club_graph()
  {"graph": "lesmis"}      D. E. Knuth, The Stanford GraphBase (1993), networkx.les_miserables_graph()
  {"graph": "florentine"}  J. F. Padgett and C. K. Ansell (1993), networkx.florentine_families_graph()
  {"graph": "davis"}       A. Davis, B. B. Gardner and M. R. Gardner (1941), networkx.davis_southern_women_graph()
  {"graph": "gnp", "n", "p", "seed"}        networkx.gnp_random_graph(n, p, seed=seed)
  {"graph": "ba", "n", "m", "seed"}         networkx.barabasi_albert_graph(n, m, seed=seed)
  {"graph": "edges", "n", "edges": [[u, v], ...]}
Nodes are renumbered 0..n-1 in the order networkx lists them. Writes JSON: {"n", "edges": [[u, v], ...],
"core": [core number of each node]} with networkx.core_number (the k-core decomposition: the core number of
v is the largest k such that v belongs to a subgraph whose every vertex has degree >= k).
"""

import json
import sys

import networkx as nx

spec = json.load(sys.stdin)
kind = spec["graph"]
if kind == "karate":
    g = nx.karate_club_graph()
elif kind == "lesmis":
    g = nx.les_miserables_graph()
elif kind == "florentine":
    g = nx.florentine_families_graph()
elif kind == "davis":
    g = nx.davis_southern_women_graph()
elif kind == "gnp":
    g = nx.gnp_random_graph(spec["n"], spec["p"], seed=spec["seed"])
elif kind == "ba":
    g = nx.barabasi_albert_graph(spec["n"], spec["m"], seed=spec["seed"])
else:
    g = nx.Graph()
    g.add_nodes_from(range(spec["n"]))
    g.add_edges_from(spec["edges"])

index = {node: i for i, node in enumerate(g.nodes())}
core = nx.core_number(g)
json.dump(
    {
        "n": g.number_of_nodes(),
        "edges": [[index[u], index[v]] for u, v in g.edges()],
        "core": [core[node] for node in g.nodes()],
    },
    sys.stdout,
)
