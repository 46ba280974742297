"""Poles of a third-order Butterworth low-pass with a 1 MHz cutoff, from scipy.signal.butter.

The test builds the doubly terminated LC ladder of that filter (normalized elements 1, 2, 1 between
equal 1-ohm terminations, scaled to 50 ohm and 1 MHz) and checks that the circuit's natural
frequencies are these poles. Run offline: python3 butterworth-poles.py > butterworth-poles.json
"""
import json
import math

import scipy
import scipy.signal

cutoff = 1e6  # Hz
zeros, poles, gain = scipy.signal.butter(3, 2 * math.pi * cutoff, btype="low", analog=True, output="zpk")
print(
    json.dumps(
        {
            "source": f"scipy.signal.butter(3, 2*pi*1e6, analog=True, output='zpk'), scipy {scipy.__version__}",
            "cutoff": cutoff,
            "termination": 50.0,
            "normalizedElements": [1.0, 2.0, 1.0],
            "poles": [{"re": float(p.real), "im": float(p.imag)} for p in poles],
        },
        indent=2,
    )
)
