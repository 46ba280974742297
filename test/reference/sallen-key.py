"""Reference response of a unity-gain Sallen-Key second-order Butterworth low-pass filter.

Generated offline, never at test time:  python3 test/reference/sallen-key.py  (writes sallen-key.json).

Circuit (node names are the ones used in the JSON):

    in --R1-- a --R2-- b ,  C2 from b to ground,  C1 from a to out,
    an ideal op-amp wired as a follower: non-inverting input at b, output `out`, inverting input tied to out.

Nodal analysis of that circuit (R. P. Sallen and E. L. Kearns, "A practical method of designing RC
active filters", IRE Transactions on Circuit Theory 2(1), 1955) gives

    H(s) = V(out)/V(in) = 1 / (s^2*R1*R2*C1*C2 + s*C2*(R1 + R2) + 1),
    w0 = 1/sqrt(R1*R2*C1*C2),   Q = sqrt(R1*R2*C1*C2) / (C2*(R1 + R2)),
    V(a)/V(in) = (1 + s*R2*C2) * H(s).

With R1 = R2 = R and C1 = 2*C2, Q = sqrt(C1/C2)/2 = 1/sqrt(2) exactly: the Butterworth response.
The script checks that the denominator matches scipy.signal.butter(2, w0, analog=True) before writing.
Magnitudes in dB (20*log10|H|), phases in degrees, unwrapped, from scipy.signal.freqs.
"""

import json
import math
import pathlib

import numpy as np
import scipy
import scipy.signal as sig

R1 = 10e3  # ohm
R2 = 10e3  # ohm
C1 = 20e-9  # farad, from node a (between the resistors) to the output
C2 = 10e-9  # farad, from node b (non-inverting input) to ground

w0 = 1.0 / math.sqrt(R1 * R2 * C1 * C2)
f0 = w0 / (2.0 * math.pi)
q = math.sqrt(R1 * R2 * C1 * C2) / (C2 * (R1 + R2))
assert abs(q - 1.0 / math.sqrt(2.0)) < 1e-15

numerator = [1.0]
denominator = [R1 * R2 * C1 * C2, C2 * (R1 + R2), 1.0]
b_ref, a_ref = sig.butter(2, w0, btype="low", analog=True)
assert np.allclose(np.array(denominator) / denominator[0], np.array(a_ref) / a_ref[0], rtol=1e-13, atol=0)
assert np.allclose(b_ref / a_ref[0], [1.0 / denominator[0]], rtol=1e-13)

frequencies = np.logspace(1, 5, 29)  # 10 Hz .. 100 kHz, 7 points per decade
w = 2.0 * np.pi * frequencies
_, h = sig.freqs(numerator, denominator, worN=w)
_, ha = sig.freqs(np.polymul([R2 * C2, 1.0], numerator), denominator, worN=w)
_, h0 = sig.freqs(numerator, denominator, worN=[w0])

poles = np.roots(denominator)
poles = sorted(poles, key=lambda p: p.imag)

out = {
    "description": "Unity-gain Sallen-Key low-pass, second-order Butterworth (Q = 1/sqrt(2)). "
    "in --R1-- a --R2-- b; C1 from a to out; C2 from b to ground; ideal op-amp follower (+ at b, - and "
    "output at out). Magnitudes in dB, phases in degrees (unwrapped).",
    "generator": "test/reference/sallen-key.py",
    "method": f"scipy {scipy.__version__} scipy.signal.freqs on H(s) = 1/(s^2 R1 R2 C1 C2 + s C2 (R1+R2) + 1), "
    "denominator checked against scipy.signal.butter(2, w0, analog=True)",
    "components": {"R1": R1, "R2": R2, "C1": C1, "C2": C2},
    "topology": {
        "R1": ["in", "a"],
        "R2": ["a", "b"],
        "C1": ["a", "out"],
        "C2": ["b", "gnd"],
        "opAmp": {"plus": "b", "minus": "out", "output": "out"},
    },
    "naturalFrequency": f0,
    "angularNaturalFrequency": w0,
    "q": q,
    "atNaturalFrequency": {
        "magnitudeDb": float(20 * np.log10(abs(h0[0]))),
        "phaseDeg": float(np.degrees(np.angle(h0[0]))),
    },
    "poles": [{"re": float(p.real), "im": float(p.imag)} for p in poles],
    "frequencies": [float(f) for f in frequencies],
    "output": {
        "magnitudeDb": [float(v) for v in 20 * np.log10(np.abs(h))],
        "phaseDeg": [float(v) for v in np.degrees(np.unwrap(np.angle(h)))],
    },
    "nodeA": {
        "magnitudeDb": [float(v) for v in 20 * np.log10(np.abs(ha))],
        "phaseDeg": [float(v) for v in np.degrees(np.unwrap(np.angle(ha)))],
    },
}
path = pathlib.Path(__file__).with_suffix(".json")
path.write_text(json.dumps(out, indent=1) + "\n")
print(f"wrote {path}; f0 = {f0} Hz, Q = {q}, poles = {poles}")
print(out["atNaturalFrequency"], out["output"]["magnitudeDb"][-1], out["output"]["phaseDeg"][-1])
