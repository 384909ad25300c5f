"""The numpy reference for test/bench/connect-bench.mjs: the same recordings, the same matrices.

Usage: connect_numpy.py FOLDER MEASURE OUT.npy [OURS.npy]
Loads every FOLDER/*.npy recording (time points x channels) in name order and computes
  pearson: numpy.corrcoef(x, rowvar=False)
  partial: -P_ij / sqrt(P_ii P_jj) of sklearn.covariance.LedoitWolf().fit(x).precision_
with the diagonal set to 0 (as cliquescape writes it), saves the (k, n, n) stack to OUT.npy, and, given
OURS.npy, prints the largest absolute difference between the two stacks.
"""

import os
import sys

import numpy as np

folder, measure, out = sys.argv[1:4]
files = sorted(f for f in os.listdir(folder) if f.endswith(".npy"))
stack = None
for k, name in enumerate(files):
    x = np.load(os.path.join(folder, name))
    if measure == "pearson":
        m = np.corrcoef(x, rowvar=False)
    else:
        from sklearn.covariance import LedoitWolf

        p = LedoitWolf().fit(x).precision_
        d = np.sqrt(np.diag(p))
        m = -p / np.outer(d, d)
    np.fill_diagonal(m, 0.0)
    if stack is None:
        stack = np.empty((len(files),) + m.shape)
    stack[k] = m
np.save(out, stack)
if len(sys.argv) > 4:
    ours = np.load(sys.argv[4])
    print(float(np.abs(ours - stack).max()))
