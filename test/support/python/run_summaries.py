"""Reference summaries of a run's features.csv, with numpy and scikit-learn.

stdin: {"features": path to features.csv, "curve": column prefix (e.g. "betti_d1"), "axis": [column suffixes]}
stdout: {"labels": {label: {"mean": [...], "sd": [...]}},      numpy mean and std(ddof=1) per label
         "explained": [r1, r2], "points": [[x, y], ...]}     sklearn StandardScaler + PCA(n_components=2)
Columns that are constant or not finite in some row are left out of the PCA, as the page does.
"""
import csv
import json
import sys

import numpy as np
from sklearn.decomposition import PCA
from sklearn.preprocessing import StandardScaler

job = json.load(sys.stdin)
with open(job["features"], newline="") as handle:
    rows = list(csv.reader(handle))
header, body = rows[0], rows[1:]
labels = [r[1] for r in body]
first = 4 if header[3] == "truncated" else 3  # id, label, split[, truncated], then the features
values = np.array([[float(x) if x != "" else np.nan for x in r[first:]] for r in body])
names = header[first:]
curve = [names.index(f'{job["curve"]}_{s}') for s in job["axis"]]
out = {"labels": {}}
for label in sorted(set(labels)):
    block = values[[i for i, l in enumerate(labels) if l == label]][:, curve]
    sd = block.std(axis=0, ddof=1) if len(block) > 1 else np.zeros(len(curve))
    out["labels"][label] = {"mean": block.mean(axis=0).tolist(), "sd": sd.tolist()}
keep = [j for j in range(values.shape[1])
        if np.all(np.isfinite(values[:, j])) and np.ptp(values[:, j]) > 0]
pca = PCA(n_components=2)
points = pca.fit_transform(StandardScaler().fit_transform(values[:, keep]))
out["explained"] = pca.explained_variance_ratio_.tolist()
out["points"] = points.tolist()
print(json.dumps(out))
