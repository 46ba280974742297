"""Reference values of the principal branch W0 of the Lambert W function on x >= 0.

Generated offline, never at test time:  python3 test/reference/lambert-w.py  (writes lambert-w.json).

W0(x) is the real w >= -1 with w*exp(w) = x (R. M. Corless, G. H. Gonnet, D. E. G. Hare, D. J. Jeffrey
and D. E. Knuth, "On the Lambert W function", Advances in Computational Mathematics 5, 1996).
Values: mpmath.lambertw at 50 significant digits, rounded once to the nearest double.
"points" holds W0(x) for doubles x; "logPoints" holds W0(exp(L)) for doubles L, an argument that
overflows a double for L > 709.78, as the diode-resistor solution needs at large supply voltages.
"""

import json
import pathlib

import mpmath
import numpy as np

mpmath.mp.dps = 50

xs = set(float(x) for x in np.logspace(-300, 300, 61))
xs.update(float(x) for x in np.logspace(-8, 8, 49))
xs.update([0.0, 5e-324, 1e-310, 0.1, 0.5, 1.0, float(mpmath.e), 2.0, 10.0, 100.0, 1e100, 1.7976931348623157e308])
points = []
for x in sorted(xs):
    w = mpmath.lambertw(mpmath.mpf(x)).real
    points.append({"x": x, "w": float(w)})

ls = [-700.0, -50.0, -10.0, -1.0, 0.0, 0.5, 1.0, 1.5, 2.0, 5.0, 10.0, 50.0, 100.0, 700.0, 709.0, 710.0, 800.0,
      1000.0, 3866.0, 1e4, 1e5, 1e6, 1e10, 1e15, 1e100, 1e300]
log_points = []
for L in ls:
    w = mpmath.lambertw(mpmath.exp(mpmath.mpf(L))).real
    log_points.append({"logX": L, "w": float(w)})

out = {
    "description": "Principal branch W0 of the Lambert W function: points = W0(x); logPoints = W0(exp(logX)).",
    "generator": "test/reference/lambert-w.py",
    "method": f"mpmath {mpmath.__version__} lambertw at {mpmath.mp.dps} digits, rounded to double",
    "points": points,
    "logPoints": log_points,
}
path = pathlib.Path(__file__).with_suffix(".json")
path.write_text(json.dumps(out, indent=1) + "\n")
print(f"wrote {len(points)} + {len(log_points)} values to {path}")
print(points[:4], [p for p in points if p['x'] in (1.0,)], log_points[-3:])
