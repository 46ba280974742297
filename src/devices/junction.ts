/**
 * What every pn junction shares: the thermal voltage, the temperature law of the saturation current,
 * an exponential that stays finite, the logarithmic step limiter, and the depletion capacitance.
 */
import { invalidValue } from '../errors/messages.js';

/** Boltzmann constant, J/K (SI 2019, exact). */
export const BOLTZMANN = 1.380649e-23;
/** Elementary charge, C (SI 2019, exact). */
export const ELEMENTARY_CHARGE = 1.602176634e-19;

/** The thermal voltage k·T/q in volts at temperature T in kelvin. */
export function thermalVoltage(temperature: number): number {
  if (typeof temperature !== 'number' || !(temperature > 0) || !Number.isFinite(temperature)) {
    throw invalidValue(['temperature'], temperature, 'a finite temperature above 0 K');
  }
  return (BOLTZMANN * temperature) / ELEMENTARY_CHARGE;
}

/**
 * Saturation current at temperature T from its value at Tref, in the usual form derived from the
 * intrinsic carrier density (e.g. Sze & Ng, Physics of Semiconductor Devices, 3rd ed., 2007):
 * I_S(T) = I_S·(T/Tref)^(p/n)·exp((E_g/(n·Vt(T)))·(T/Tref − 1)), with E_g in volts.
 */
export function saturationCurrentAt(
  isRef: number,
  temperature: number,
  referenceTemperature: number,
  bandgap: number,
  exponent: number,
  emission: number,
): number {
  const ratio = temperature / referenceTemperature;
  const vt = thermalVoltage(temperature);
  return isRef * ratio ** (exponent / emission) * Math.exp((bandgap / (emission * vt)) * (ratio - 1));
}

/**
 * Above this argument the exponential continues as its tangent, so that no Newton step overflows. A
 * solution beyond it lies outside the Shockley law; the operating point warns of it.
 */
export const EXP_LIMIT = 80;
const EXP_AT_LIMIT = Math.exp(EXP_LIMIT);
/**
 * The slope of {@link boundedExp} above {@link EXP_LIMIT}. Below it the slope is the value itself, so
 * a caller that needs both can take one exponential: slope = a <= EXP_LIMIT ? value : this.
 */
export const EXP_SLOPE_ABOVE_LIMIT = EXP_AT_LIMIT;

/** exp(a), continued linearly above a = 80 (value and slope match there): finite on the whole real line. */
export function boundedExp(a: number): number {
  return a <= EXP_LIMIT ? Math.exp(a) : EXP_AT_LIMIT * (1 + a - EXP_LIMIT);
}

/** The derivative of {@link boundedExp}. */
export function boundedExpSlope(a: number): number {
  return a <= EXP_LIMIT ? Math.exp(a) : EXP_AT_LIMIT;
}

/** The second (and every higher) derivative of {@link boundedExp}: e^a, and 0 where it runs linear. */
export function boundedExpCurvature(a: number): number {
  return a <= EXP_LIMIT ? Math.exp(a) : 0;
}

/**
 * The critical voltage of a junction, where its current-voltage curve bends most sharply (the point
 * of minimum radius of curvature): n·Vt·ln(n·Vt/(√2·I_S)). Steps above it are damped.
 */
export function criticalVoltage(nVt: number, saturationCurrent: number): number {
  return nVt * Math.log(nVt / (Math.SQRT2 * saturationCurrent));
}

/**
 * Logarithmic damping of a junction-voltage step (Vlach & Singhal, Computer Methods for Circuit
 * Analysis and Design, 2nd ed., 1994, ch. 11): above the critical voltage a step of more than 2·n·Vt
 * is replaced by one whose exponential grows only linearly, so that the current of a step follows the
 * Newton tangent instead of overflowing. Returns the voltage to evaluate at; NaN never comes out.
 */
export function limitJunctionStep(vNew: number, vOld: number, nVt: number, vCritical: number): number {
  if (vNew > vCritical && Math.abs(vNew - vOld) > 2 * nVt) {
    if (vOld > 0) {
      const arg = 1 + (vNew - vOld) / nVt;
      return arg > 0 ? vOld + nVt * Math.log(arg) : vCritical;
    }
    return nVt * Math.log(vNew / nVt);
  }
  return vNew;
}

/** Fraction of the junction potential above which the depletion law continues linearly. */
export const DEPLETION_KNEE = 0.5;

/**
 * Depletion capacitance C0/(1 − v/φ)^m, continued by its tangent above v = DEPLETION_KNEE·φ where the
 * law would diverge (a common practice, no single source).
 */
export function depletionCapacitance(c0: number, v: number, potential: number, grading: number): number {
  if (c0 === 0) return 0;
  const knee = DEPLETION_KNEE * potential;
  if (v < knee) return c0 / (1 - v / potential) ** grading;
  const base = 1 - DEPLETION_KNEE;
  return (c0 / base ** (1 + grading)) * (base + (grading * v) / potential - grading * DEPLETION_KNEE);
}
