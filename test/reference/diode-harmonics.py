"""Large-signal harmonics of a diode fed from a resistor, from the exact Lambert-W solution at each phase.

Generated offline, never at test time:  python3 test/reference/diode-harmonics.py  (writes diode-harmonics.json).

Circuit: a source V(θ) = Vdc + A·cos θ drives a resistor R into the anode of a diode whose cathode is
grounded (no series resistance, no breakdown). Diode law (Shockley): i = I_S·(exp(vj/(n·Vt)) − 1).
At every phase the loop is solved exactly (Banwell and Jayakumar, "Exact analytical solution for
current flow through diode with series resistance", Electronics Letters 36(4), 2000):

    i  = (n·Vt/R)·W(a·exp((V + I_S·R)/(n·Vt))) − I_S,   a = I_S·R/(n·Vt),   vj = V − i·R.

The output is periodic and analytic in θ, so the trapezoid rule on N points (the DFT) gives its Fourier
coefficients with an error of the size of the coefficients of order N − h, far below 1e-30 for N = 256
at these amplitudes. With the drive a pure cosine, every coefficient is real:
y(θ) = y0 + Σ_h c_h·cos hθ, c_h = (2/N)·Σ_k y(θ_k)·cos(h·θ_k).

mpmath.lambertw at 50 significant digits; Vt = k·T/q with the exact SI 2019 constants.
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

SATURATION_CURRENT = mpf("1e-14")
EMISSION = 1
RESISTANCE = mpf(20)
BIAS = mpf("0.7")
AMPLITUDES = ["0.0005", "0.002", "0.006", "0.017", "0.05", "0.1", "0.2"]
PHASES = 256


def loop(supply):
    """Exact current and junction voltage of supply -> R -> junction -> ground."""
    nvt = EMISSION * VT
    a = SATURATION_CURRENT * RESISTANCE / nvt
    w = mpmath.lambertw(a * mpmath.exp((supply + SATURATION_CURRENT * RESISTANCE) / nvt)).real
    current = nvt / RESISTANCE * w - SATURATION_CURRENT
    junction = supply - current * RESISTANCE
    assert abs(current - SATURATION_CURRENT * mpmath.expm1(junction / nvt)) < mpf("1e-40") * abs(current)
    return current, junction


def harmonics(samples):
    """Mean and cosine coefficients 1..3 of samples at θ_k = 2πk/N."""
    n = len(samples)
    mean = sum(samples) / n
    coefficients = []
    for h in (1, 2, 3):
        coefficients.append(2 * sum(y * mpmath.cos(2 * mpmath.pi * h * k / n) for k, y in enumerate(samples)) / n)
    return mean, coefficients


quiescent_current, quiescent_junction = loop(BIAS)
dynamic_resistance = EMISSION * VT / (quiescent_current + SATURATION_CURRENT)
cases = []
for amplitude_text in AMPLITUDES:
    amplitude = mpf(amplitude_text)
    currents = []
    junctions = []
    for k in range(PHASES):
        i, vj = loop(BIAS + amplitude * mpmath.cos(2 * mpmath.pi * k / PHASES))
        currents.append(i)
        junctions.append(vj)
    v_mean, v_h = harmonics(junctions)
    i_mean, i_h = harmonics(currents)
    cases.append(
        {
            "amplitude": float(amplitude),
            "junctionMeanShift": float(v_mean - quiescent_junction),
            "junctionHarmonics": [float(c) for c in v_h],
            "currentMeanShift": float(i_mean - quiescent_current),
            "currentHarmonics": [float(c) for c in i_h],
        }
    )

out = {
    "description": "Source Vdc + A cos(theta) -> resistor R -> diode anode, cathode grounded. Exact Lambert-W "
    "solution at each of N phases; harmonics are the real cosine coefficients c_h (peak), h = 1, 2, 3, of the "
    "junction voltage and of the loop current; mean shifts are relative to the quiescent values.",
    "generator": "test/reference/diode-harmonics.py",
    "method": f"mpmath {mpmath.__version__} lambertw at {mpmath.mp.dps} digits, DFT on {PHASES} phases, rounded to double",
    "temperature": float(TEMPERATURE),
    "thermalVoltage": float(VT),
    "saturationCurrent": float(SATURATION_CURRENT),
    "emissionCoefficient": EMISSION,
    "resistance": float(RESISTANCE),
    "bias": float(BIAS),
    "quiescentCurrent": float(quiescent_current),
    "quiescentJunctionVoltage": float(quiescent_junction),
    "dynamicResistance": float(dynamic_resistance),
    "cases": cases,
}
path = pathlib.Path(__file__).with_suffix(".json")
path.write_text(json.dumps(out, indent=1) + "\n")
print(f"wrote {len(cases)} cases to {path}; r_d = {mpmath.nstr(dynamic_resistance, 8)} ohm")
