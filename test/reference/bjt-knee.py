"""Reference operating points of a bipolar transistor with a knee current (high injection).

Generated offline, never at test time:  python3 test/reference/bjt-knee.py  (writes bjt-knee.json).

Circuit: a source VB drives the base of an npn directly; its emitter returns to ground through RE;
a supply of 5 V holds the collector.  Model (docs/devices.md, "Bipolar transistor"; high injection of
H. K. Gummel and H. C. Poon, Bell Syst. Tech. J. 49, 1970, forward part of the normalized base charge):

    e_f = exp(vbe/(n_F*Vt)),  e_r = exp(vbc/(n_R*Vt)),
    qh  = (1 + sqrt(1 + 4*I_S*(e_f - 1)/IK))/2,
    ic  = I_S*(e_f - e_r)/qh - (I_S/bR)*(e_r - 1),
    ib  = (I_S/bF)*(e_f - 1) + (I_S/bR)*(e_r - 1),

with vbe = VB - ve and vbc = VB - 5.  Kirchhoff at the emitter: ve/RE = ic + ib, solved for ve with
mpmath.findroot at 50 digits; Vt = k*T/q with the exact SI 2019 constants at 298.15 K.
"""

import json
import pathlib

import mpmath
from mpmath import mpf

mpmath.mp.dps = 50

VT = mpf("1.380649e-23") * mpf("298.15") / mpf("1.602176634e-19")
SATURATION_CURRENT = mpf("1e-15")
BF = mpf(100)
BR = mpf(1)
IK = mpf("5e-3")
RE = mpf(10)
VCC = mpf(5)
BASE_VOLTAGES = ["0.55", "0.65", "0.72", "0.78", "0.85", "0.95"]


def currents(vb, ve):
    vbe = vb - ve
    vbc = vb - VCC
    ef = mpmath.exp(vbe / VT)
    er = mpmath.exp(vbc / VT)
    qh = (1 + mpmath.sqrt(1 + 4 * SATURATION_CURRENT * (ef - 1) / IK)) / 2
    ic = SATURATION_CURRENT * (ef - er) / qh - (SATURATION_CURRENT / BR) * (er - 1)
    ib = (SATURATION_CURRENT / BF) * (ef - 1) + (SATURATION_CURRENT / BR) * (er - 1)
    return ic, ib


cases = []
for text in BASE_VOLTAGES:
    vb = mpf(text)
    ve = mpmath.findroot(lambda v: v / RE - sum(currents(vb, v)), mpf("0.001"))
    ic, ib = currents(vb, ve)
    cases.append(
        {
            "baseVoltage": float(vb),
            "emitterVoltage": float(ve),
            "collectorCurrent": float(ic),
            "baseCurrent": float(ib),
            "beta": float(ic / ib),
        }
    )

document = {
    "source": "test/reference/bjt-knee.py",
    "thermalVoltage": float(VT),
    "saturationCurrent": float(SATURATION_CURRENT),
    "forwardBeta": float(BF),
    "reverseBeta": float(BR),
    "kneeCurrent": float(IK),
    "emitterResistance": float(RE),
    "supply": float(VCC),
    "cases": cases,
}
pathlib.Path(__file__).with_name("bjt-knee.json").write_text(json.dumps(document, indent=2) + "\n")
