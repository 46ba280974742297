"""Reference values of the charge-based MOSFET channel (weak, moderate and strong inversion).

Generated offline, never at test time:  python3 test/reference/mosfet-charge.py  (writes mosfet-charge.json).

The constant-slope-factor form of the model of C. C. Enz, F. Krummenacher and E. A. Vittoz (Analog
Integrated Circuits and Signal Processing 8, 1995), as docs/devices.md ("Weak to strong inversion")
states it, for nmos with every voltage referred to the body:

    Vp = (vg - Vth0)/n,
    if = ln^2(1 + exp((Vp - vs)/(2 Vt))),  ir = ln^2(1 + exp((Vp - vd)/(2 Vt))),
    id = 2 n beta Vt^2 (if - ir) (1 + lambda |vds|).

Derivatives (gm, gds, gmb and the second and third derivatives in vgs and vds) by mpmath.diff at
50 digits, with vg = vgs - vbs, vs = -vbs, vd = vds - vbs.  Vt at 300.15 K with the exact SI 2019 constants.
"""

import json
import pathlib

import mpmath
from mpmath import mpf

mpmath.mp.dps = 50

VT = mpf("1.380649e-23") * mpf("300.15") / mpf("1.602176634e-19")
N = mpf("1.4")
BETA = mpf("2e-4")
VTH0 = mpf("0.45")
LAMBDA = mpf("0.03")

# (vgs, vds, vbs): weak, moderate, strong inversion in saturation; triode; reversed; body biased.
POINTS = [
    ("0.15", "1.0", "0"),
    ("0.30", "1.0", "0"),
    ("0.45", "1.0", "0"),
    ("0.60", "1.0", "0"),
    ("0.90", "2.0", "0"),
    ("1.80", "3.0", "0"),
    ("1.50", "0.2", "0"),
    ("1.20", "-0.3", "0"),
    ("0.80", "1.5", "-0.5"),
]


def current(vgs, vds, vbs):
    vg, vs, vd = vgs - vbs, -vbs, vds - vbs
    vp = (vg - VTH0) / N
    f = mpmath.log(1 + mpmath.exp((vp - vs) / (2 * VT))) ** 2
    r = mpmath.log(1 + mpmath.exp((vp - vd) / (2 * VT))) ** 2
    return 2 * N * BETA * VT**2 * (f - r) * (1 + LAMBDA * abs(vds)), f, r


cases = []
for g, d, b in POINTS:
    vgs, vds, vbs = mpf(g), mpf(d), mpf(b)
    i, f, r = current(vgs, vds, vbs)
    fn = lambda x, y, z: current(x, y, z)[0]  # noqa: E731
    cases.append(
        {
            "vgs": float(vgs),
            "vds": float(vds),
            "vbs": float(vbs),
            "id": float(i),
            "forwardCoefficient": float(f),
            "reverseCoefficient": float(r),
            "gm": float(mpmath.diff(fn, (vgs, vds, vbs), (1, 0, 0))),
            "gds": float(mpmath.diff(fn, (vgs, vds, vbs), (0, 1, 0))),
            "gmb": float(mpmath.diff(fn, (vgs, vds, vbs), (0, 0, 1))),
            "d2Dvgs2": float(mpmath.diff(fn, (vgs, vds, vbs), (2, 0, 0))),
            "d2DvgsDvds": float(mpmath.diff(fn, (vgs, vds, vbs), (1, 1, 0))),
            "d2DvgsDvbs": float(mpmath.diff(fn, (vgs, vds, vbs), (1, 0, 1))),
            "d3Dvgs3": float(mpmath.diff(fn, (vgs, vds, vbs), (3, 0, 0))),
            "d3Dvgs2Dvds": float(mpmath.diff(fn, (vgs, vds, vbs), (2, 1, 0))),
        }
    )

document = {
    "source": "test/reference/mosfet-charge.py",
    "thermalVoltage": float(VT),
    "slopeFactor": float(N),
    "gainFactor": float(BETA),
    "thresholdVoltage": float(VTH0),
    "channelLengthModulation": float(LAMBDA),
    "cases": cases,
}
pathlib.Path(__file__).with_name("mosfet-charge.json").write_text(json.dumps(document, indent=2) + "\n")
