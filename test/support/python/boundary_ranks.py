"""Rank of each boundary matrix of a JSON list of jobs on stdin: over GF(p) by sympy, over Q (p = 0) by
numpy.linalg.matrix_rank; for test/reference/homology-ranks-python.test.ts."""

import json, sys
import numpy as np
from sympy import GF
from sympy.polys.matrices import DomainMatrix
jobs = json.load(sys.stdin)
out = []
for job in jobs:
    rows, cols, p = job["rows"], job["cols"], job["p"]
    if rows == 0 or cols == 0:
        out.append(0)
        continue
    dense = [[0] * cols for _ in range(rows)]
    for r, c, v in job["entries"]:
        dense[r][c] += v
    if p == 0:
        out.append(int(np.linalg.matrix_rank(np.array(dense, dtype=float))))
    else:
        K = GF(p)
        out.append(int(DomainMatrix([[K(x) for x in row] for row in dense], (rows, cols), K).rank()))
json.dump(out, sys.stdout)
