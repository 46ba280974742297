"""Exact moments of a resistive divider's output under resistor tolerances, and reference yields.

The divider: a 10 V supply, `upper` = 3 kΩ from the supply to `out`, `lower` = 1 kΩ from `out` to
ground, so out = 10·lower/(upper + lower) = 2.5 V at nominal. Each resistor varies independently:

- uniform ±5 %: R = p·(1 + 0.05·u), u uniform on [−1, 1];
- normal ±5 %: R = p·(1 + (0.05/3)·z), z standard normal truncated to [−3, 3].

The mean, variance and fourth central moment of out are integrals over the two draws, computed with
scipy's adaptive quadrature (scipy.integrate.dblquad). Also: the probability that out ≤ 2.55 V when
only `lower` varies uniformly by ±10 % (a closed form), and Wilson score intervals from
scipy.stats.binomtest for checking the interval formula.

Run: python3 test/reference/monte-carlo-moments.py > test/reference/monte-carlo-moments.json
"""
import json

from scipy import integrate, stats

SUPPLY, UPPER, LOWER, TOL = 10.0, 3000.0, 1000.0, 0.05


def out(u1, u2, scale):
    r1 = UPPER * (1 + scale * u1)
    r2 = LOWER * (1 + scale * u2)
    return SUPPLY * r2 / (r1 + r2)


def moments(density, lo, hi, scale):
    def expect(f):
        value, _ = integrate.dblquad(
            lambda u2, u1: f(out(u1, u2, scale)) * density(u1) * density(u2),
            lo, hi, lo, hi, epsabs=1e-14, epsrel=1e-12,
        )
        return value

    mean = expect(lambda y: y)
    variance = expect(lambda y: (y - mean) ** 2)
    fourth = expect(lambda y: (y - mean) ** 4)
    return {"mean": mean, "variance": variance, "fourthCentralMoment": fourth}


truncated = stats.truncnorm(-3, 3)
cases = {
    "uniform": moments(lambda u: 0.5, -1.0, 1.0, TOL),
    "normal": moments(truncated.pdf, -3.0, 3.0, TOL / 3),
}

# Yield: only `lower` varies uniformly by ±10 %; out ≤ limit ⇔ lower ≤ R* = limit·UPPER/(SUPPLY − limit).
limit = 2.55
r_star = limit * UPPER / (SUPPLY - limit)
probability = (r_star / LOWER - 0.9) / 0.2

wilson = []
for passed, total in [(81, 263), (0, 20), (20, 20), (950, 1000)]:
    ci = stats.binomtest(passed, total).proportion_ci(confidence_level=0.95, method="wilson")
    wilson.append({"passed": passed, "total": total, "low": ci.low, "high": ci.high})

print(json.dumps({
    "divider": {"supply": SUPPLY, "upper": UPPER, "lower": LOWER, "relative": TOL},
    "moments": cases,
    "yield": {"relative": 0.1, "max": limit, "probability": probability},
    "wilson": wilson,
}, indent=2))
