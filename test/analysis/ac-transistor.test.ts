/**
 * The small-signal AC analysis on circuits with diodes and transistors, checked against the textbook
 * small-signal formulas evaluated with the operating point's own parameters (g_m, r_π, r_o, g_ds, r_d),
 * and against finite differences of DC solutions.
 */
import Complex from 'complex.js';
import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { dcSweep } from '../../src/analysis/dc-sweep.js';
import { logSweep } from '../../src/analysis/frequency-grid.js';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';

const parallel = (...r: number[]) => 1 / r.reduce((sum, x) => sum + 1 / x, 0);
const EARLY_NPN = { polarity: 'npn', forwardBeta: 100, earlyVoltage: 80 } as const;
const PLAIN_NPN = { polarity: 'npn', forwardBeta: 100 } as const;
const TIGHT = { relativeTolerance: 1e-12, voltageTolerance: 1e-15, currentTolerance: 1e-18 } as const;

describe('acAnalysis on a common-emitter stage', () => {
  it('has the mid-band gain −g_m·(R_C ‖ r_o) from base to collector', () => {
    // Source: hybrid-π model of the grounded-emitter stage, A_v = −g_m(R_C ‖ r_o). A. S. Sedra and
    // K. C. Smith, "Microelectronic Circuits", BJT amplifier chapter (from memory).
    const RC = 5.6e3;
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
      .voltageSource('input', 'b', GROUND, { dc: 0.71, ac: 1 })
      .resistor('RC', 'vcc', 'c', RC)
      .bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, EARLY_NPN);
    const op = operatingPoint(c);
    const q = op.bjt('Q1');
    expect(q.region).toBe('forward-active');
    const gain = acAnalysis(op, { frequencies: [1e3] }).gain('c', 'b')[0]!;
    expectRelativelyClose(gain.re, -q.gm * parallel(RC, q.ro), 1e-7, 'voltage at c/voltage at b');
    expect(Math.abs(gain.im)).toBe(0);
    // r_o is finite and matters here: (V_A + vce)/ic within a percent.
    expectRelativelyClose(q.ro, (80 + q.vce) / q.ic, 1e-2, 'r_o');
  });

  // A divider-biased stage: R_B1 = 68 kΩ, R_B2 = 12 kΩ, R_E = 1 kΩ, R_C = 5.6 kΩ, R_L = 10 kΩ,
  // R_sig = 1 kΩ, V_CC = 12 V. Each capacitor not under test is 1 F, a short at the audio frequencies.
  const RB1 = 68e3;
  const RB2 = 12e3;
  const RE = 1e3;
  const RC = 5.6e3;
  const RL = 10e3;
  const RSIG = 1e3;
  const RB = parallel(RB1, RB2);
  const stage = (caps: { input: number; bypass: number; output: number }, model: typeof PLAIN_NPN) =>
    new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
      .voltageSource('signal', 'sig', GROUND, { ac: 1 })
      .resistor('Rsig', 'sig', 's', RSIG)
      .capacitor('Cin', 's', 'b', caps.input)
      .resistor('RB1', 'vcc', 'b', RB1)
      .resistor('RB2', 'b', GROUND, RB2)
      .bjt('Q1', { collector: 'c', base: 'b', emitter: 'e' }, model)
      .resistor('RE', 'e', GROUND, RE)
      .capacitor('CE', 'e', GROUND, caps.bypass)
      .resistor('RC', 'vcc', 'c', RC)
      .capacitor('Cout', 'c', 'out', caps.output)
      .resistor('RL', 'out', GROUND, RL);
  const sweep = logSweep(0.1, 1e5, 200);

  it('has the overall mid-band gain −(R_B‖r_π)/(R_sig + R_B‖r_π)·g_m·(R_C‖r_o‖R_L)', () => {
    // Source: Sedra and Smith, CE amplifier with source resistance (from memory).
    const op = operatingPoint(stage({ input: 1, bypass: 1, output: 1 }, EARLY_NPN));
    const q = op.bjt('Q1');
    const rin = parallel(RB, q.rpi);
    const expected = (-rin / (RSIG + rin)) * q.gm * parallel(RC, q.ro, RL);
    const gain = acAnalysis(op, { frequencies: [10e3] }).gain('out', 'sig')[0]!;
    expectRelativelyClose(gain.re, expected, 1e-6, 'voltage at out/voltage at sig at 10 kHz');
    expect(Math.abs(gain.im)).toBeLessThan(1e-6 * Math.abs(expected));
  });

  it('puts the input-coupling corner at 1/(2π·C_in·(R_sig + R_B‖r_π))', () => {
    // Source: Sedra and Smith, low-frequency response of the CE amplifier, f_P1 (from memory).
    const op = operatingPoint(stage({ input: 1e-6, bypass: 1, output: 1 }, PLAIN_NPN));
    const q = op.bjt('Q1');
    const expected = 1 / (2 * Math.PI * 1e-6 * (RSIG + parallel(RB, q.rpi)));
    const cutoffs = acAnalysis(op, { frequencies: sweep }).cutoffFrequencies('out', 'sig');
    expect(cutoffs).toHaveLength(1);
    expectRelativelyClose(cutoffs[0]!, expected, 1e-4, 'f_P1');
  });

  it('puts the bypass corner at √(f_P2² − 2·f_Z²), near f_P2 = 1/(2π·C_E·(R_E ‖ (r_π + R_sig‖R_B)/(β + 1)))', () => {
    // Source: Sedra and Smith, f_P2 and the zero f_Z = 1/(2π·C_E·R_E) of the emitter bypass (from memory).
    // With that pole and zero alone, |H/H_mid|² = (f² + f_Z²)/(f² + f_P2²) = ½ gives the exact
    // −3 dB frequency √(f_P2² − 2·f_Z²) (derived here).
    const CE = 100e-6;
    const op = operatingPoint(stage({ input: 1, bypass: CE, output: 1 }, PLAIN_NPN));
    const q = op.bjt('Q1');
    const beta0 = q.gm * q.rpi;
    const fp = 1 / (2 * Math.PI * CE * parallel(RE, (q.rpi + parallel(RSIG, RB)) / (beta0 + 1)));
    const fz = 1 / (2 * Math.PI * CE * RE);
    const cutoffs = acAnalysis(op, { frequencies: sweep }).cutoffFrequencies('out', 'sig');
    expect(cutoffs).toHaveLength(1);
    expectRelativelyClose(cutoffs[0]!, Math.sqrt(fp * fp - 2 * fz * fz), 1e-4, 'exact bypass corner');
    expectRelativelyClose(cutoffs[0]!, fp, 5e-3, 'f_P2');
  });

  it('puts the output-coupling corner at 1/(2π·C_out·(R_C‖r_o + R_L))', () => {
    // Source: Sedra and Smith, f_P3 (from memory).
    const op = operatingPoint(stage({ input: 1, bypass: 1, output: 1e-6 }, PLAIN_NPN));
    const q = op.bjt('Q1');
    const expected = 1 / (2 * Math.PI * 1e-6 * (parallel(RC, q.ro) + RL));
    const cutoffs = acAnalysis(op, { frequencies: sweep }).cutoffFrequencies('out', 'sig');
    expect(cutoffs).toHaveLength(1);
    expectRelativelyClose(cutoffs[0]!, expected, 1e-4, 'f_P3');
  });

  it('has a lower −3 dB frequency between the largest corner and the sum of the corners', () => {
    // Source: Sedra and Smith: f_L ≈ f_P1 + f_P2 + f_P3, and at least the dominant pole (from memory).
    const caps = { input: 1e-6, bypass: 100e-6, output: 1e-6 };
    const op = operatingPoint(stage(caps, PLAIN_NPN));
    const q = op.bjt('Q1');
    const beta0 = q.gm * q.rpi;
    const f1 = 1 / (2 * Math.PI * caps.input * (RSIG + parallel(RB, q.rpi)));
    const f2 = 1 / (2 * Math.PI * caps.bypass * parallel(RE, (q.rpi + parallel(RSIG, RB)) / (beta0 + 1)));
    const f3 = 1 / (2 * Math.PI * caps.output * (parallel(RC, q.ro) + RL));
    const cutoffs = acAnalysis(op, { frequencies: sweep }).cutoffFrequencies('out', 'sig');
    expect(cutoffs).toHaveLength(1);
    expect(cutoffs[0]!).toBeGreaterThan(Math.max(f1, f2, f3));
    expect(cutoffs[0]!).toBeLessThan(f1 + f2 + f3);
  });
});

describe('acAnalysis on a common-source MOSFET stage', () => {
  it('has the gain −g_m·(R_D ‖ 1/g_ds)', () => {
    // Source: small-signal model of the saturated MOSFET, A_v = −g_m(R_D ‖ r_o), r_o = 1/g_ds (Sedra and
    // Smith, MOSFET amplifier chapter, from memory).
    const RD = 10e3;
    const c = new Circuit()
      .voltageSource('supply', 'vdd', GROUND, { dc: 10 })
      .voltageSource('input', 'g', GROUND, { dc: 1.5, ac: 1 })
      .resistor('RD', 'vdd', 'd', RD)
      .mosfet(
        'amplifier',
        { drain: 'd', gate: 'g', source: GROUND },
        { polarity: 'nmos', channelLengthModulation: 0.02 },
      );
    const op = operatingPoint(c);
    const m = op.mosfet('amplifier');
    expect(m.region).toBe('saturation');
    // Square law: gm = β·V_ov·(1 + λ·vds), gds = ½·β·V_ov²·λ (Shichman and Hodges 1968).
    expectRelativelyClose(m.gm, 1e-3 * 0.8 * (1 + 0.02 * m.vds), 1e-9, 'gm');
    expectRelativelyClose(m.gds, 0.5 * 1e-3 * 0.64 * 0.02, 1e-6, 'gds');
    const gain = acAnalysis(op, { frequencies: [0, 1e4] }).gain('d', 'g');
    for (const g of gain)
      expectRelativelyClose(g.re, -m.gm * parallel(RD, 1 / m.gds), 1e-8, 'voltage at d/voltage at g');
  });

  it('adds the Miller feed-forward of C_gd: H = −(g_m − jωC_gd)/(G_D + g_ds + jωC_gd)', () => {
    // Source: nodal analysis of the hybrid-π MOSFET stage driven by an ideal source (Sedra and Smith,
    // high-frequency response, from memory).
    const RD = 10e3;
    const cgd = 2e-12;
    const c = new Circuit()
      .voltageSource('supply', 'vdd', GROUND, { dc: 10 })
      .voltageSource('input', 'g', GROUND, { dc: 1.5, ac: 1 })
      .resistor('RD', 'vdd', 'd', RD)
      .mosfet(
        'amplifier',
        { drain: 'd', gate: 'g', source: GROUND },
        {
          polarity: 'nmos',
          channelLengthModulation: 0.02,
          gateSourceCapacitance: 5e-12,
          gateDrainCapacitance: cgd,
        },
      );
    const op = operatingPoint(c);
    const m = op.mosfet('amplifier');
    expectRelativelyClose(m.cgd, cgd, 1e-12, 'cgd');
    const f = 20e6;
    const w = 2 * Math.PI * f;
    const expected = new Complex(-m.gm, w * cgd).div(new Complex(1 / RD + m.gds, w * cgd));
    const gain = acAnalysis(op, { frequencies: [f] }).gain('d', 'g')[0]!;
    expect(gain.sub(expected).abs()).toBeLessThan(1e-7 * expected.abs());
  });
});

describe('acAnalysis on a diode attenuator', () => {
  it('divides by r_d/(R + r_d) with r_d the dynamic resistance at the operating point', () => {
    // Source: small-signal diode model, v_d/v_s = r_d/(R + r_d) (Sedra and Smith, diode chapter, from memory).
    const R = 4.7e3;
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { dc: 5, ac: 1 })
      .resistor('R1', 'in', 'a', R)
      .diode('D1', 'a', GROUND);
    const op = operatingPoint(c);
    const rd = op.diode('D1').resistance;
    // r_d ≈ n·Vt/I_D (Shockley, 1949).
    expectRelativelyClose(rd, op.thermalVoltage / op.diode('D1').current, 1e-6, 'r_d');
    const gain = acAnalysis(op, { frequencies: [0, 1e6] }).gain('a', 'in');
    for (const g of gain) expectRelativelyClose(g.re, rd / (R + rd), 1e-12, 'voltage at a/voltage at in');
  });

  it('adds the series resistance and the junction capacitance: Z_D = R_S + 1/(g + jωC)', () => {
    // Source: the diode small-signal model with series resistance and junction capacitance (Sedra and
    // Smith, from memory): H = Z_D/(R + Z_D).
    const R = 4.7e3;
    const seriesResistance = 5;
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { dc: 5, ac: 1 })
      .resistor('R1', 'in', 'a', R)
      .diode('D1', 'a', GROUND, { seriesResistance, junctionCapacitance: 4e-12, transitTime: 1e-9 });
    const op = operatingPoint(c);
    const d = op.diode('D1');
    const f = 3e6;
    const zd = new Complex(d.conductance, 2 * Math.PI * f * d.capacitance).inverse().add(seriesResistance);
    const expected = zd.div(zd.add(R));
    const gain = acAnalysis(op, { frequencies: [f] }).gain('a', 'in')[0]!;
    expect(gain.sub(expected).abs()).toBeLessThan(1e-10 * expected.abs());
    // The diffusion capacitance τ·g dominates the 4 pF junction here: the response is not flat.
    expect(d.capacitance).toBeGreaterThan(1e-9 * d.conductance);
  });
});

describe('acAnalysis at 0 Hz', () => {
  // Source for this block: the small-signal solution at 0 Hz is the derivative of the DC solution with
  // respect to the source (linearization, common practice, no source); checked by central differences
  // (error O(h²)) of operating points solved to tight tolerances.
  const h = 1e-4;

  it('equals the derivative of a diode circuit DC sweep', () => {
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { dc: 2, ac: 1 })
      .resistor('R1', 'in', 'a', 1e3)
      .diode('D1', 'a', 'k', { seriesResistance: 10 })
      .resistor('R2', 'k', GROUND, 220)
      .capacitor('C1', 'a', GROUND, 1e-6);
    const sweep = dcSweep(c, { source: 'input', values: [2 - h, 2, 2 + h], ...TIGHT });
    const va = sweep.voltage('a');
    const vk = sweep.voltage('k');
    const ac = acAnalysis(sweep.points[1]!, { frequencies: [0] });
    expectRelativelyClose(ac.voltage('a')[0]!.re, (va[2]! - va[0]!) / (2 * h), 1e-6, 'dv(a)/dVin');
    expectRelativelyClose(ac.voltage('k')[0]!.re, (vk[2]! - vk[0]!) / (2 * h), 1e-6, 'dv(k)/dVin');
    const i = sweep.current('R1');
    expectRelativelyClose(ac.current('R1')[0]!.re, (i[2]! - i[0]!) / (2 * h), 1e-6, 'di(R1)/dVin');
  });

  it('equals the derivative of a two-transistor amplifier DC solution', () => {
    // An emitter-degenerated stage feeding an emitter follower, directly coupled.
    const build = (vin: number) =>
      new Circuit()
        .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
        .voltageSource('input', 'in', GROUND, { dc: vin, ac: 1 })
        .resistor('RS', 'in', 'b1', 2.2e3)
        .bjt('Q1', { collector: 'c1', base: 'b1', emitter: 'e1' }, EARLY_NPN)
        .resistor('RE1', 'e1', GROUND, 1e3)
        .resistor('RC1', 'vcc', 'c1', 4.7e3)
        .capacitor('CE1', 'e1', GROUND, 10e-6)
        .bjt('Q2', { collector: 'vcc', base: 'c1', emitter: 'out' }, EARLY_NPN)
        .resistor('RE2', 'out', GROUND, 2.2e3);
    const vin = 2;
    const [low, mid, high] = [vin - h, vin, vin + h].map((v) => operatingPoint(build(v), TIGHT));
    const derivative = (high!.voltage('out') - low!.voltage('out')) / (2 * h);
    const ac = acAnalysis(mid!, { frequencies: [0, 1e3] });
    expectRelativelyClose(ac.voltage('out')[0]!.re, derivative, 1e-6, 'dv(out)/dVin');
    expect(ac.voltage('out')[0]!.im).toBe(0);
    // The bypass capacitor raises the gain at 1 kHz well above the degenerated DC gain.
    expect(ac.voltage('out')[1]!.abs()).toBeGreaterThan(10 * Math.abs(derivative));
  });
});
