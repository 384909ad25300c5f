"""Persistence image pixels as integrals of the persistence surface, for
test/reference/vectorise-image-scipy.test.ts.

"Persistence images: a stable vector representation of persistent homology", JMLR 18
(2017), Section 4: each point (b, d) goes to (b, p = d - b); the surface is the sum of w(p) times the
normal density of deviation sigma centred there; a pixel holds the surface's integral over its square.
Here every pixel is integrated in two dimensions by scipy.integrate.dblquad, without using that the
Gaussian is separable. Input on stdin (JSON): births, deaths, birthRange, persistenceRange, resolution,
sigma, rampEnd (linear weight min(1, max(0, p / rampEnd))). Output: the image, row-major [birth][persistence].
"""

import json
import math
import sys

from scipy.integrate import dblquad

q = json.load(sys.stdin)
(b0, b1), (p0, p1), (nb, np_), sigma = q["birthRange"], q["persistenceRange"], q["resolution"], q["sigma"]
points = [(b, d - b) for b, d in zip(q["births"], q["deaths"])]
weights = [min(1.0, max(0.0, p / q["rampEnd"])) for _, p in points]
norm = 1.0 / (2.0 * math.pi * sigma * sigma)


def surface(p, b):
    return sum(
        w * norm * math.exp(-((b - pb) ** 2 + (p - pp) ** 2) / (2.0 * sigma * sigma))
        for w, (pb, pp) in zip(weights, points)
    )


image = []
for x in range(nb):
    lo, hi = b0 + (b1 - b0) * x / nb, b0 + (b1 - b0) * (x + 1) / nb
    for y in range(np_):
        plo, phi = p0 + (p1 - p0) * y / np_, p0 + (p1 - p0) * (y + 1) / np_
        value, _ = dblquad(surface, lo, hi, plo, phi, epsabs=1e-13, epsrel=1e-11)
        image.append(value)
json.dump(image, sys.stdout)
