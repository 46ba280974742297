/**
 * Impedances: `portImpedance` (every independent source zeroed, 1 A driven into the port) and
 * `AcAnalysis.sourceImpedance` (what a driving source sees), against closed forms.
 */
import Complex from 'complex.js';
import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { portImpedance } from '../../src/analysis/port-impedance.js';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

const parallel = (...r: number[]) => 1 / r.reduce((sum, x) => sum + 1 / x, 0);

function expectComplexClose(actual: Complex, expected: Complex, tolerance: number, what: string): void {
  const error = actual.sub(expected).abs() / expected.abs();
  expect(error, `${what}: got ${actual}, expected ${expected}`).toBeLessThanOrEqual(tolerance);
}

describe('portImpedance on RC networks', () => {
  // R1 = 2.2 kΩ from a driven input to node x, C1 = 33 nF from x to ground, R2 = 10 kΩ from x to y,
  // C2 = 4.7 nF from y to ground.
  const circuit = new Circuit()
    .voltageSource('input', 'in', GROUND, { dc: 3, ac: 1 })
    .resistor('R1', 'in', 'x', 2.2e3)
    .capacitor('C1', 'x', GROUND, 33e-9)
    .resistor('R2', 'x', 'y', 10e3)
    .capacitor('C2', 'y', GROUND, 4.7e-9);
  const op = operatingPoint(circuit);
  const frequencies = [0, 100, 2.2e3, 1e5];

  it('zeroes the driving source: Z(y) = 1/(jωC2) ‖ (R2 + R1 ‖ 1/(jωC1))', () => {
    // Source: series and parallel combination of impedances, the driving source replaced by a short
    // (Thévenin's theorem; any circuits text, e.g. Nilsson and Riedel, from memory).
    const z = portImpedance(op, { plus: 'y' }, { frequencies: frequencies.slice(1) });
    frequencies.slice(1).forEach((f, k) => {
      const w = 2 * Math.PI * f;
      const zc1 = new Complex(0, -1 / (w * 33e-9));
      const zc2 = new Complex(0, -1 / (w * 4.7e-9));
      const inner = zc1.mul(2.2e3).div(zc1.add(2.2e3)).add(10e3);
      const expected = inner.mul(zc2).div(inner.add(zc2));
      expectComplexClose(z[k]!, expected, 1e-12, `Z(y) at ${f} Hz`);
    });
  });

  it('gives the resistance R1 + R2 between y and the shorted input at 0 Hz', () => {
    // Source: the capacitors are open at 0 Hz and the zeroed source a short (common practice, no source).
    const z = portImpedance(op, { plus: 'y', minus: 'in' }, { frequencies: [0] })[0]!;
    expectRelativelyClose(z.re, 12.2e3, 1e-12, 'Z(y, in) at 0 Hz');
    expect(z.im).toBe(0);
    // A port between two nodes that the zeroed source joins is a short.
    expect(portImpedance(op, { plus: 'in' }, { frequencies: [10] })[0]!.abs()).toBeLessThan(1e-12);
  });

  it('is symmetric in its terminals: Z(a, b) = Z(b, a)', () => {
    // Source: the port voltage per ampere does not depend on which terminal is named first when the
    // current is reversed too (common practice, no source).
    const ab = portImpedance(op, { plus: 'x', minus: 'y' }, { frequencies });
    const ba = portImpedance(op, { plus: 'y', minus: 'x' }, { frequencies });
    for (const [k, z] of ab.entries()) expectComplexClose(z, ba[k]!, 1e-12, `at ${frequencies[k]} Hz`);
  });

  it('refuses a port whose terminals coincide, unknown nodes and bad frequencies', () => {
    expectQuiescentError(
      () => portImpedance(op, { plus: 'x', minus: 'x' }, { frequencies }),
      'invalid-value',
      'x',
    );
    expectQuiescentError(() => portImpedance(op, { plus: GROUND }, { frequencies }), 'invalid-value', 'gnd');
    expectQuiescentError(
      () => portImpedance(op, { plus: 'nowhere' }, { frequencies }),
      'unknown-node',
      'nowhere',
    );
    expectQuiescentError(
      () => portImpedance(op, { plus: 'x' }, { frequencies: [-5] }),
      'invalid-value',
      'frequencies',
    );
  });

  it('sees a capacitor in parallel with the resistive path around it: 1/(jωC) ‖ (R1 + R2)', () => {
    // Source: parallel combination of impedances (any circuits text, from memory).
    const c = new Circuit()
      .currentSource('drive', GROUND, 'x', { ac: 1 })
      .resistor('R1', 'x', GROUND, 1e3)
      .capacitor('C1', 'x', 'y', 1e-9)
      .resistor('R2', 'y', GROUND, 1e3);
    const z = portImpedance(operatingPoint(c), { plus: 'x', minus: 'y' }, { frequencies: [1e3] })[0]!;
    const zc = new Complex(0, -1 / (2 * Math.PI * 1e3 * 1e-9));
    expectComplexClose(z, zc.mul(2e3).div(zc.add(2e3)), 1e-12, 'Z across C1');
  });

  it('reports singular where no finite impedance exists: a lossless LC tank at resonance', () => {
    // Source: jωC + 1/(jωL) = 0 at ω = 1/√(LC) (any circuits text). L = C = 1/(2π) puts it at exactly
    // 1 Hz in floating point.
    const value = 1 / (2 * Math.PI);
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .resistor('R1', 'in', 'tank', 1e3)
      .inductor('L1', 'tank', GROUND, value)
      .capacitor('C1', 'tank', 'in', value);
    const op = operatingPoint(c);
    // With the source zeroed, R1, L1 and C1 all sit between 'tank' and ground: the tank is lossless
    // only without R1, so the port across it is R1 ‖ (an open) = R1 at resonance.
    expectRelativelyClose(
      portImpedance(op, { plus: 'tank' }, { frequencies: [1] })[0]!.re,
      1e3,
      1e-9,
      'R1 at f0',
    );
    const lossless = new Circuit()
      .currentSource('drive', GROUND, 'tank', { ac: 1 })
      .inductor('L1', 'tank', GROUND, value)
      .capacitor('C1', 'tank', GROUND, value);
    expectQuiescentError(
      () => portImpedance(operatingPoint(lossless), { plus: 'tank' }, { frequencies: [2, 1] }),
      'singular',
      '1 Hz',
    );
  });
});

describe('portImpedance of transistor and op-amp outputs', () => {
  it("gives an emitter follower's output impedance R_E ‖ r_o ‖ (R_s + r_π)/(1 + g_m·r_π)", () => {
    // Source: hybrid-π analysis of the common-collector stage; approximately (R_s/(β + 1) + 1/g_m) ‖ R_E.
    // A. S. Sedra and K. C. Smith, "Microelectronic Circuits", emitter follower (from memory).
    const sourceResistance = 1e3;
    const RE = 2.2e3;
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
      .voltageSource('input', 'in', GROUND, { dc: 6, ac: 1 })
      .resistor('Rs', 'in', 'b', sourceResistance)
      .bjt(
        'Q1',
        { collector: 'vcc', base: 'b', emitter: 'e' },
        { polarity: 'npn', forwardBeta: 120, earlyVoltage: 70 },
      )
      .resistor('RE', 'e', GROUND, RE);
    const op = operatingPoint(c);
    const q = op.bjt('Q1');
    const beta0 = q.gm * q.rpi;
    const z = portImpedance(op, { plus: 'e' }, { frequencies: [1e3] })[0]!;
    expectRelativelyClose(
      z.re,
      parallel(RE, q.ro, (sourceResistance + q.rpi) / (1 + beta0)),
      1e-6,
      'exact Z_out',
    );
    expect(Math.abs(z.im)).toBe(0);
    expectRelativelyClose(
      z.re,
      parallel(sourceResistance / (beta0 + 1) + 1 / q.gm, RE),
      2e-2,
      'textbook Z_out',
    );
    // The same stage seen from its driving source: R_s + r_π + (β0 + 1)·(R_E ‖ r_o) (same source).
    const zin = acAnalysis(op, { frequencies: [1e3] }).sourceImpedance('input')[0]!;
    expectRelativelyClose(
      zin.re,
      sourceResistance + q.rpi + (beta0 + 1) * parallel(RE, q.ro),
      1e-6,
      'Z_in seen by input',
    );
  });

  it("divides an op-amp's output resistance by the loop gain: R_out/(1 + Aβ + R_out/(R1 + R2))", () => {
    // Source: series-shunt feedback lowers the output resistance by 1 + Aβ (Sedra and Smith, feedback
    // chapter, from memory); the exact form with the divider's load is derived by nodal analysis.
    const A0 = 2e5;
    const GBW = 1e6;
    const ROUT = 75;
    const [R1, R2] = [1e3, 4e3];
    const beta = R1 / (R1 + R2);
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .opAmp(
        'U1',
        { plus: 'in', minus: 'fb', output: 'out' },
        { openLoopGain: A0, gainBandwidth: GBW, outputResistance: ROUT },
      )
      .resistor('R2', 'out', 'fb', R2)
      .resistor('R1', 'fb', GROUND, R1);
    const op = operatingPoint(c);
    const frequencies = [0, 100, 1e4, 1e6];
    const z = portImpedance(op, { plus: 'out' }, { frequencies });
    frequencies.forEach((f, k) => {
      const a = new Complex(A0).div(new Complex(1, (f * A0) / GBW));
      const expected = new Complex(ROUT).div(a.mul(beta).add(1 + ROUT / (R1 + R2)));
      expectComplexClose(z[k]!, expected, 1e-9, `Z_out at ${f} Hz`);
    });
  });
});

describe('AcAnalysis.sourceImpedance', () => {
  it('sees R + 1/(jωC) through a series RC, and an infinite impedance at 0 Hz', () => {
    // Source: series impedance; a capacitor is open at 0 Hz (any circuits text, from memory).
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { dc: 1, ac: 1 })
      .resistor('R1', 'in', 'out', 1e3)
      .capacitor('C1', 'out', GROUND, 1e-6);
    const frequencies = [0, 10, 159, 1e4];
    const z = acAnalysis(operatingPoint(c), { frequencies }).sourceImpedance('input');
    expect(z[0]!.isInfinite()).toBe(true);
    frequencies.slice(1).forEach((f, k) => {
      const expected = new Complex(1e3, -1 / (2 * Math.PI * f * 1e-6));
      expectComplexClose(z[k + 1]!, expected, 1e-12, `Z at ${f} Hz`);
    });
  });

  it('sees v/i for a current source, and includes the other sources as they are', () => {
    // Source: a current source into R ‖ C (Z = R/(1 + jωRC)); a second, independent current source
    // adds its own voltage, which sourceImpedance (unlike portImpedance) keeps (superposition).
    const R = 10e3;
    const C = 1e-9;
    const f = 20e3;
    const base = new Circuit()
      .currentSource('drive', GROUND, 'x', { ac: 1e-3 })
      .resistor('R1', 'x', GROUND, R)
      .capacitor('C1', 'x', GROUND, C);
    const expected = new Complex(R).div(new Complex(1, 2 * Math.PI * f * R * C));
    const alone = acAnalysis(operatingPoint(base), { frequencies: [f] }).sourceImpedance('drive')[0]!;
    expectComplexClose(alone, expected, 1e-12, 'Z seen by drive');
    const withSecond = base.currentSource('secondDrive', GROUND, 'x', { ac: 1e-3 });
    const op = operatingPoint(withSecond);
    expectComplexClose(
      acAnalysis(op, { frequencies: [f] }).sourceImpedance('drive')[0]!,
      expected.mul(2),
      1e-12,
      'with a second equal source',
    );
    expectComplexClose(portImpedance(op, { plus: 'x' }, { frequencies: [f] })[0]!, expected, 1e-12, 'port');
  });

  it('refuses elements that are not sources and sources without AC excitation', () => {
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .resistor('R1', 'in', 'vcc', 1e3);
    const ac = acAnalysis(operatingPoint(c), { frequencies: [1] });
    expectQuiescentError(() => ac.sourceImpedance('R1'), 'unknown-element', 'R1');
    expectQuiescentError(() => ac.sourceImpedance('nothing'), 'unknown-element', 'nothing');
    expectQuiescentError(() => ac.sourceImpedance('supply'), 'invalid-value', 'supply');
    expectRelativelyClose(
      ac.sourceImpedance('input')[0]!.re,
      1e3,
      1e-12,
      'input sees R1 to the shorted supply',
    );
  });
});
