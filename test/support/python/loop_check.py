"""Checks a loop drawn by the page against the graph file, with numpy and networkx (outside references).

stdin: {"file": matrix CSV with a label row and column, "edges": [[label, label], ...], "birth": w,
        "semantics": "similarity" | "distance"}
stdout: {"simple_cycle": bool, "length": int, "present_at_birth": bool, "weights": [...]}
A set of edges is one simple cycle when its graph is connected and every node has degree 2 (networkx).
An edge is present at threshold W when w >= W (similarity) or w <= W (distance), w != 0.
"""
import csv
import json
import sys

import networkx as nx
import numpy as np

job = json.load(sys.stdin)
with open(job["file"], newline="") as handle:
    rows = list(csv.reader(handle))
labels = rows[0][1:]
matrix = np.array([[float(x) for x in row[1:]] for row in rows[1:]])
index = {label: i for i, label in enumerate(labels)}
loop = nx.Graph()
loop.add_edges_from((u, v) for u, v in job["edges"])
simple_cycle = nx.is_connected(loop) and all(d == 2 for _, d in loop.degree())
weights = [float(matrix[index[u], index[v]]) for u, v in job["edges"]]
if job["semantics"] == "similarity":
    present = all(w != 0 and w >= job["birth"] for w in weights)
else:
    present = all(w <= job["birth"] for w in weights)
print(json.dumps({"simple_cycle": bool(simple_cycle), "length": loop.number_of_edges(),
                  "present_at_birth": bool(present), "weights": weights}))
