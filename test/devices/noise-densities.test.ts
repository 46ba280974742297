/**
 * The generator formulas of docs/noise.md, "Generators", at their limits.
 */
import { describe, expect, it } from 'vitest';
import {
  channelThermalNoise,
  chargeBasedChannelThermalNoise,
  flickerNoise,
  shotNoise,
  thermalNoise,
} from '../../src/devices/noise-densities.js';
import { BOLTZMANN, ELEMENTARY_CHARGE } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';

const T = 300;
const fourKT = 4 * BOLTZMANN * T;

describe('noise densities', () => {
  it('are 4kT/R, 2q|I| and K_f·|I|^a_f (Johnson 1928; Nyquist 1928; Schottky 1918; van der Ziel 1986)', () => {
    expectRelativelyClose(thermalNoise(T, 1e3), fourKT / 1e3, 1e-15, 'thermal');
    expectRelativelyClose(shotNoise(-1e-3), 2 * ELEMENTARY_CHARGE * 1e-3, 1e-15, 'shot');
    expectRelativelyClose(flickerNoise(1e-15, 1.5, -4e-4), 1e-15 * 8e-6, 1e-12, 'flicker');
    expect(flickerNoise(0, 1, 1)).toBe(0);
  });

  // Y. Tsividis, Operation and Modeling of the MOS Transistor, 2nd ed., 1999: (2/3)·g_m in
  // saturation, g_d0 = β·V_ov at v_DS = 0, and the (1 + η + η²)/(1 + η) law between them.
  it('give the square-law channel 4kT·(2/3)·β·V_ov in saturation and 4kT·β·V_ov at v_DS = 0', () => {
    const beta = 2e-3;
    expectRelativelyClose(
      channelThermalNoise(T, beta, 0.5, 1),
      fourKT * (2 / 3) * beta * 0.5,
      1e-15,
      'saturation',
    );
    expectRelativelyClose(channelThermalNoise(T, beta, 0.5, 0), fourKT * beta * 0.5, 1e-15, 'v_DS = 0');
    const eta = 0.5; // v_DS = V_ov/2
    expectRelativelyClose(
      channelThermalNoise(T, beta, 0.5, 0.25),
      fourKT * (2 / 3) * beta * 0.5 * ((1 + eta + eta * eta) / (1 + eta)),
      1e-15,
      'triode',
    );
    expect(channelThermalNoise(T, beta, -0.1, 1)).toBe(0);
  });

  // C. C. Enz and E. A. Vittoz, Charge-Based MOS Transistor Modeling, 2006: 4kT·n·g_m·γ with γ from
  // 1/2 in weak inversion to 2/3 in strong inversion.
  it('give the charge-based channel 4kT·n·g_m/2 in weak and 4kT·n·g_m·2/3 in strong inversion', () => {
    expectRelativelyClose(
      chargeBasedChannelThermalNoise(T, 1.3, 1e-4, 1e-8),
      fourKT * 1.3 * 1e-4 * 0.5,
      1e-6,
      'weak',
    );
    expectRelativelyClose(
      chargeBasedChannelThermalNoise(T, 1.3, 1e-4, 1e10),
      fourKT * 1.3 * 1e-4 * (2 / 3),
      1e-4,
      'strong',
    );
  });
});
