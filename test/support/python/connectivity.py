"""Reference connectivity matrices from numpy, scipy and scikit-learn, for
test/reference/connectivity-python.test.ts.

Reads JSON on stdin: {"series": [[channel 0 over time], [channel 1 over time], ...], "lags": [1, 2, ...]}
(channels x time points). Writes JSON:
  "pearson":   numpy.corrcoef(x)                      (rows are variables)
  "spearman":  scipy.stats.spearmanr(x.T).correlation (columns are variables, axis=0)
  "ledoitWolf": {"covariance": LedoitWolf().fit(x.T).covariance_, "precision": .precision_,
                 "shrinkage": .shrinkage_, "partial": -P_ij / sqrt(P_ii P_jj) of that precision (diagonal 1)}
  "lagged":    {lag: [[numpy.corrcoef(x[i, :-lag], x[j, lag:])[0, 1] for j] for i]} (i leads j)
Floats are written with repr, so they read back exactly.
"""

import json
import sys

import numpy as np
from scipy import stats
from sklearn.covariance import LedoitWolf

spec = json.load(sys.stdin)
x = np.array(spec["series"], dtype=np.float64)
n = x.shape[0]

out = {}
out["pearson"] = np.corrcoef(x).tolist()
rho = stats.spearmanr(x.T).correlation
out["spearman"] = (np.array([[1.0, rho], [rho, 1.0]]) if np.ndim(rho) == 0 else rho).tolist()

lw = LedoitWolf().fit(x.T)
p = lw.precision_
d = np.sqrt(np.diag(p))
partial = -p / np.outer(d, d)
np.fill_diagonal(partial, 1.0)
out["ledoitWolf"] = {
    "covariance": lw.covariance_.tolist(),
    "precision": p.tolist(),
    "shrinkage": float(lw.shrinkage_),
    "partial": partial.tolist(),
}

lagged = {}
for lag in spec.get("lags", []):
    lagged[str(lag)] = [
        [float(np.corrcoef(x[i, :-lag], x[j, lag:])[0, 1]) for j in range(n)] for i in range(n)
    ]
out["lagged"] = lagged

json.dump(out, sys.stdout)
