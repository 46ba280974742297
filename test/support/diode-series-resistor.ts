/**
 * The exact DC solution of a diode in series with a resistor, as an outside reference for the
 * operating-point solver.
 *
 * Circuit: a supply V drives a resistance R into the anode of a diode whose cathode returns to the
 * supply's negative terminal. With the Shockley law i = I_S·(e^(vj/(n·Vt)) − 1) and V = i·R + vj,
 * eliminating vj gives (J. C. Banwell and A. Jayakumar, "Exact analytical solution for current flow
 * through diode with series resistance", Electronics Letters 36(4), 2000)
 *
 *   i  = (n·Vt/R)·W0(a·e^((V + I_S·R)/(n·Vt))) − I_S,        a = I_S·R/(n·Vt),
 *   vj = n·Vt·(ln W − ln a)                                  (from i + I_S = I_S·e^(vj/(n·Vt))).
 *
 * The argument of W0 overflows a double for V above about 18 V at n = 1, so W0 is evaluated from
 * its logarithm ln a + (V + I_S·R)/(n·Vt) with {@link lambertW0OfExp}. A series resistance inside
 * the diode adds to R; the anode terminal then sits at vj + i·R_S.
 */
import { lambertW0OfExp } from '../../src/math/lambert-w.js';

/** The loop supply → resistor → diode, every value in SI units. */
export interface DiodeSeriesResistorCircuit {
  /** Supply voltage V across the series pair, positive in the diode's forward direction (V). */
  readonly supply: number;
  /** Total series resistance R, the diode's own series resistance included (Ω), > 0. */
  readonly resistance: number;
  /** Saturation current I_S of the diode law (A), > 0. */
  readonly saturationCurrent: number;
  /** Emission coefficient n of the diode law, > 0. */
  readonly emissionCoefficient: number;
  /** Thermal voltage Vt = k·T/q (V), > 0. */
  readonly thermalVoltage: number;
}

/** The current and junction voltage of the loop. */
export interface DiodeSeriesResistorSolution {
  /** Current i around the loop, anode to cathode through the diode (A). */
  readonly current: number;
  /** Voltage vj across the diode's exponential junction, anode side positive (V). */
  readonly junctionVoltage: number;
}

function checkPositive(value: number, name: string): void {
  if (!(Number.isFinite(value) && value > 0)) {
    throw new RangeError(`${name} must be a finite number > 0, got ${value}`);
  }
}

/**
 * The exact current and junction voltage of a diode in series with a resistor (Banwell and
 * Jayakumar 2000), for any finite supply of either sign.
 *
 * @param circuit - supply, resistance, saturation current, emission coefficient and thermal voltage
 * @returns the loop current and the junction voltage; the current is exact to a few units in the
 *   last place, with an absolute floor of a few eps·I_S where it is comparable to I_S
 * @throws RangeError when the supply is not finite or another value is not finite and positive
 */
export function diodeSeriesResistorSolution(
  circuit: DiodeSeriesResistorCircuit,
): DiodeSeriesResistorSolution {
  const { supply, resistance, saturationCurrent, emissionCoefficient, thermalVoltage } = circuit;
  if (!Number.isFinite(supply)) {
    throw new RangeError(`supply must be a finite number, got ${supply}`);
  }
  checkPositive(resistance, 'resistance');
  checkPositive(saturationCurrent, 'saturationCurrent');
  checkPositive(emissionCoefficient, 'emissionCoefficient');
  checkPositive(thermalVoltage, 'thermalVoltage');

  const nvt = emissionCoefficient * thermalVoltage;
  const logA = Math.log((saturationCurrent * resistance) / nvt);
  const w = lambertW0OfExp(logA + (supply + saturationCurrent * resistance) / nvt);
  const current = (nvt / resistance) * w - saturationCurrent;
  // Once the resistor takes most of the supply, V − i·R cancels; the logarithmic form does not, and
  // it is safe wherever W > 1. Where W ≤ 1, i·R < n·Vt is small and V − i·R loses nothing (and it
  // stays finite where W underflows at a large reverse supply, unlike ln W).
  const junctionVoltage = w > 1 ? nvt * (Math.log(w) - logA) : supply - current * resistance;
  return { current, junctionVoltage };
}

/**
 * The exact current of a diode in series with a resistor (Banwell and Jayakumar 2000):
 * i = (n·Vt/R)·W0((I_S·R/(n·Vt))·e^((V + I_S·R)/(n·Vt))) − I_S.
 *
 * @param circuit - supply, resistance, saturation current, emission coefficient and thermal voltage
 * @returns the current through the diode, anode to cathode (A)
 * @throws RangeError when the supply is not finite or another value is not finite and positive
 *
 * @example
 * diodeSeriesResistorCurrent({ supply: 1, resistance: 1000, saturationCurrent: 1e-14,
 *   emissionCoefficient: 1, thermalVoltage: 0.02586492578632875 }); // ≈ 3.7056e-4
 */
export function diodeSeriesResistorCurrent(circuit: DiodeSeriesResistorCircuit): number {
  return diodeSeriesResistorSolution(circuit).current;
}
