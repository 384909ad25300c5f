"""Reference distances between persistence diagrams from a general-purpose assignment solver, for
test/reference/distance-scipy.test.ts.

Reads JSON on stdin: a list of {"a": [[birth, death], ...], "b": [...], "p": p}. For each pair builds the
diagram-augmented cost matrix (n + m square: point-to-point L-infinity costs, each point to its own diagonal
copy at (death - birth) / 2, diagonal copies to each other at 0, everything else forbidden) and solves it
with scipy.optimize.linear_sum_assignment:
  - "wasserstein": (optimal sum of cost^p) ** (1 / p);
  - "bottleneck": the smallest entry r of the matrix for which the 0/1 matrix [cost > r] has an assignment
    of total 0 (linear_sum_assignment on it, over the sorted entries).
Writes a list of {"wasserstein": w, "bottleneck": b}.
"""

import json
import sys

import numpy as np
from scipy.optimize import linear_sum_assignment


def augmented(a, b):
    n, m = len(a), len(b)
    size = n + m
    cost = np.full((size, size), np.inf)
    for i, (bi, di) in enumerate(a):
        for j, (bj, dj) in enumerate(b):
            cost[i, j] = max(abs(bi - bj), abs(di - dj))
        cost[i, m + i] = (di - bi) / 2
    for j, (bj, dj) in enumerate(b):
        cost[n + j, j] = (dj - bj) / 2
        cost[n + j, m:] = 0.0
    return cost


def wasserstein(cost, p):
    if cost.size == 0:
        return 0.0
    powered = np.where(np.isfinite(cost), cost ** p, np.inf)
    rows, cols = linear_sum_assignment(powered)
    return float(powered[rows, cols].sum() ** (1.0 / p))


def bottleneck(cost):
    if cost.size == 0:
        return 0.0
    values = np.unique(cost[np.isfinite(cost)])
    lo, hi = 0, len(values) - 1
    while lo < hi:
        mid = (lo + hi) // 2
        over = (cost > values[mid]).astype(float)
        rows, cols = linear_sum_assignment(over)
        if over[rows, cols].sum() == 0:
            hi = mid
        else:
            lo = mid + 1
    return float(values[lo])


out = []
for case in json.load(sys.stdin):
    cost = augmented(case["a"], case["b"])
    out.append({"wasserstein": wasserstein(cost, case["p"]), "bottleneck": bottleneck(cost)})
json.dump(out, sys.stdout)
