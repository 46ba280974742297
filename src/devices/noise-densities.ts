/**
 * The noise densities of the device generators, one formula each (docs/noise.md, "Generators").
 * All are one-sided power spectral densities in A²/Hz at absolute temperature T in kelvin.
 */
import { BOLTZMANN, ELEMENTARY_CHARGE } from './junction.js';

/** 4kT/R: the thermal noise current of a resistance R (J. B. Johnson; H. Nyquist, Phys. Rev. 32, 1928). */
export function thermalNoise(temperature: number, resistance: number): number {
  return (4 * BOLTZMANN * temperature) / resistance;
}

/** 2q·|i|: the shot noise of a current i crossing a barrier (W. Schottky, Ann. Phys. 57, 1918). */
export function shotNoise(current: number): number {
  return 2 * ELEMENTARY_CHARGE * Math.abs(current);
}

/** K_f·|i|^a_f: the 1/f noise PSD times f of a current i, by the empirical law with coefficient K_f and exponent a_f. */
export function flickerNoise(coefficient: number, exponent: number, current: number): number {
  return coefficient === 0 ? 0 : coefficient * Math.abs(current) ** exponent;
}

/**
 * The square-law channel's thermal noise: 4kT·(2/3)·β·V_ov·(1 + η + η²)/(1 + η), with η = 1 − v_ds/V_ov
 * in triode and 0 in saturation (Y. Tsividis, Operation and Modeling of the MOS Transistor, 2nd ed.,
 * 1999). It is 4kT·(2/3)·g_m in saturation (λ = 0) and 4kT·β·V_ov, the channel conductance's
 * thermal noise, at v_ds = 0; 0 in cutoff.
 *
 * @param overdrive - V_ov = v_gs − V_th, in V (≤ 0: cutoff)
 * @param drainSource - v_ds ≥ 0 in the frame where the drain is the higher end, in V
 */
export function channelThermalNoise(
  temperature: number,
  beta: number,
  overdrive: number,
  drainSource: number,
): number {
  if (overdrive <= 0) return 0;
  const eta = drainSource >= overdrive ? 0 : 1 - drainSource / overdrive;
  return 4 * BOLTZMANN * temperature * (2 / 3) * beta * overdrive * ((1 + eta + eta * eta) / (1 + eta));
}

/**
 * The charge-based (weak-to-strong inversion) channel's thermal noise in saturation: 4kT·n·g_m·γ with
 * γ = (1/2 + (2/3)·q_s)/(1 + q_s), q_s = √(1/4 + i_f) − 1/2 the normalized inversion charge at the
 * source (C. C. Enz and E. A. Vittoz, Charge-Based MOS Transistor Modeling, 2006): γ tends to 1/2
 * in weak inversion (q_s → 0) and to 2/3 in strong inversion (q_s → ∞).
 *
 * @param slopeFactor - n, the slope factor
 * @param transconductance - g_m = ∂i_d/∂v_gs, in S
 * @param forwardLevel - i_f, the forward inversion coefficient
 */
export function chargeBasedChannelThermalNoise(
  temperature: number,
  slopeFactor: number,
  transconductance: number,
  forwardLevel: number,
): number {
  const qs = Math.sqrt(0.25 + Math.max(forwardLevel, 0)) - 0.5;
  const gamma = (0.5 + (2 / 3) * qs) / (1 + qs);
  return 4 * BOLTZMANN * temperature * slopeFactor * transconductance * gamma;
}
