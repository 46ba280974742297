"""Reference currents for a diode in series with a resistor, from the exact Lambert-W solution.

Generated offline, never at test time:  python3 test/reference/diode-series.py  (writes diode-series.json).

Circuit: a DC supply V drives a resistor R into the anode of a diode whose cathode is grounded.
Diode law (Shockley): i = I_S*(exp(vj/(n*Vt)) - 1).  Kirchhoff: V = i*R + vj.  Eliminating vj gives
(Banwell and Jayakumar, "Exact analytical solution for current flow through diode with series
resistance", Electronics Letters 36(4), 2000):

    i  = (n*Vt/R) * W(a * exp((V + I_S*R)/(n*Vt))) - I_S,      a = I_S*R/(n*Vt),
    vj = n*Vt * (ln W - ln a)                                   (from i + I_S = I_S*exp(vj/(n*Vt))),

with W the principal branch of the Lambert W function.  A series resistance R_S inside the diode is
in series with R, so the same formula holds with R + R_S in place of R; the anode terminal then sits at
vj + i*R_S.

mpmath.lambertw at 50 significant digits; Vt = k*T/q with the exact SI 2019 constants.
"""

import json
import pathlib

import mpmath
from mpmath import mpf

mpmath.mp.dps = 50

BOLTZMANN = mpf("1.380649e-23")  # J/K, exact (SI 2019)
ELEMENTARY_CHARGE = mpf("1.602176634e-19")  # C, exact (SI 2019)
TEMPERATURE = mpf("298.15")  # K (25 °C, the default analysis temperature)
VT = BOLTZMANN * TEMPERATURE / ELEMENTARY_CHARGE

SUPPLIES = ["0.1", "0.3", "1", "3", "10", "30", "100"]
RESISTANCE = mpf(1000)
SATURATION_CURRENT = mpf("1e-14")
EMISSION_COEFFICIENTS = [1, 2]
DIODE_SERIES_RESISTANCES = [mpf(0), mpf(10)]


def solve(supply, resistance, saturation_current, n):
    """Exact current and junction voltage of the loop supply -> resistance -> junction -> ground."""
    nvt = n * VT
    a = saturation_current * resistance / nvt
    w = mpmath.lambertw(a * mpmath.exp((supply + saturation_current * resistance) / nvt)).real
    current = nvt / resistance * w - saturation_current
    junction = nvt * (mpmath.log(w) - mpmath.log(a))
    # Check the two circuit equations at 50 digits before trusting the values.
    assert abs(supply - current * resistance - junction) < mpf("1e-40") * (1 + abs(supply))
    assert abs(current - saturation_current * mpmath.expm1(junction / nvt)) < mpf("1e-40") * abs(current)
    return current, junction


cases = []
for rs in DIODE_SERIES_RESISTANCES:
    for n in EMISSION_COEFFICIENTS:
        for s in SUPPLIES:
            supply = mpf(s)
            total = RESISTANCE + rs
            current, junction = solve(supply, total, SATURATION_CURRENT, n)
            cases.append(
                {
                    "supply": float(supply),
                    "resistance": float(RESISTANCE),
                    "diodeSeriesResistance": float(rs),
                    "totalResistance": float(total),
                    "saturationCurrent": float(SATURATION_CURRENT),
                    "emissionCoefficient": n,
                    "current": float(current),
                    "junctionVoltage": float(junction),
                    "anodeVoltage": float(junction + current * rs),
                }
            )

out = {
    "description": "Supply -> resistor -> diode anode, cathode grounded. Exact solution through the Lambert W "
    "function (Banwell and Jayakumar, Electronics Letters 36(4), 2000). totalResistance = resistance + "
    "diodeSeriesResistance enters the formula; anodeVoltage = junctionVoltage + current*diodeSeriesResistance.",
    "generator": "test/reference/diode-series.py",
    "method": f"mpmath {mpmath.__version__} lambertw at {mpmath.mp.dps} digits, rounded to double",
    "temperature": float(TEMPERATURE),
    "boltzmann": float(BOLTZMANN),
    "elementaryCharge": float(ELEMENTARY_CHARGE),
    "thermalVoltage": float(VT),
    "cases": cases,
}
path = pathlib.Path(__file__).with_suffix(".json")
path.write_text(json.dumps(out, indent=1) + "\n")
print(f"wrote {len(cases)} cases to {path}; Vt = {mpmath.nstr(VT, 20)}")
