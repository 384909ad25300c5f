"""math.erf of each number of a JSON list on stdin, for test/reference/vectorise-erf-python.test.ts.

Entries may also be strings that float() reads ("inf", "-inf"), since JSON has no infinities.
"""

import json
import math
import sys

json.dump([math.erf(float(x)) for x in json.load(sys.stdin)], sys.stdout)
