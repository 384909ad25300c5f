"""Correlation matrices written the way users write them, for test/cli/numpy-inputs.test.ts.

Reads JSON on stdin: {"dir": folder, "files": [{"name", "nodes", "samples", "seed", "constant": [rows],
"perturb": delta (optional), "format": "npy" | "txt"}], "stack": {"name", "graphs", "nodes",
"samples", "seed"} (optional)}. Each matrix is numpy.corrcoef of seeded Gaussian time series (rows =
nodes); rows listed in "constant" are constant signals, whose correlations numpy returns as NaN (with a
RuntimeWarning). "perturb" adds delta to the first cell (i, j), i < j, holding a correlation above 0.1 (an
edge under every default) and reports i, j and both cells as Python prints them. "npy" files are written by numpy.save, "txt" by numpy.savetxt with its defaults (format
%.18e, space-separated, NaN as "nan"); a stack is numpy.save of numpy.stack of such matrices.

Writes JSON, per file (and per stack slice): facts computed by numpy on the matrix as saved: pairs whose
two cells differ (both finite), pairs with a negative or a positive value, NaN cells off the diagonal, the
positive degree of every node, and the largest relative difference between a_ij and a_ji.
"""

import json
import os
import sys
import warnings

import numpy as np


def corrcoef(nodes, samples, seed, constant):
    rng = np.random.default_rng(seed)
    series = rng.standard_normal((nodes, samples))
    for row in constant:
        series[row] = 1.0
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", RuntimeWarning)  # numpy warns when it divides by a zero deviation
        return np.corrcoef(series)


def facts(c):
    n = len(c)
    upper = np.triu(np.ones((n, n), dtype=bool), 1)
    finite = np.isfinite(c) & np.isfinite(c.T) & upper
    mean = (c + c.T) / 2
    positive = finite & (mean > 0)
    with np.errstate(invalid="ignore"):
        relative = np.abs(c - c.T) / np.maximum(np.abs(c), np.abs(c.T))
    return {
        "asymmetric_pairs": int((finite & (c != c.T)).sum()),
        "largest_relative_asymmetry": float(np.nanmax(np.where(finite, relative, 0))),
        "negative_pairs": int((finite & (mean < 0)).sum()),
        "positive_pairs": int(positive.sum()),
        "nan_cells": int((np.isnan(c) & ~np.eye(n, dtype=bool)).sum()),
        "degree": (positive | positive.T).sum(1).tolist(),
    }


spec = json.load(sys.stdin)
out = {}
for f in spec["files"]:
    c = corrcoef(f["nodes"], f["samples"], f["seed"], f.get("constant", []))
    if "perturb" in f:
        i, j = [int(x[0]) for x in np.nonzero(np.triu(c > 0.1, 1))]
        c[i, j] += f["perturb"]
        out[f["name"] + ":perturbed"] = [i, j, repr(float(c[i, j])), repr(float(c[j, i]))]
    path = os.path.join(spec["dir"], f["name"])
    if f.get("format", "npy") == "npy":
        np.save(path, c)
    else:
        np.savetxt(path, c)
    out[f["name"]] = facts(c)
if "stack" in spec:
    s = spec["stack"]
    mats = [corrcoef(s["nodes"], s["samples"], s["seed"] + k, []) for k in range(s["graphs"])]
    np.save(os.path.join(spec["dir"], s["name"]), np.stack(mats))
    out[s["name"]] = [facts(m) for m in mats]
print(json.dumps(out))
