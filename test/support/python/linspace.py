"""numpy.linspace(start, stop, num) of each [start, stop, num] of a JSON list on stdin, for
test/reference/threshold-grid-numpy.test.ts."""

import json
import sys

import numpy as np

json.dump([np.linspace(a, b, int(n)).tolist() for a, b, n in json.load(sys.stdin)], sys.stdout)
