/**
 * The small-signal AC analysis on op-amp circuits: a Sallen-Key Butterworth low-pass against scipy
 * reference values, a non-inverting amplifier with a single-pole op-amp, open-loop unity-gain
 * frequency, and phase unwrapping past −180° on a buffered third-order RC ladder.
 */
import Complex from 'complex.js';
import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { logSweep } from '../../src/analysis/frequency-grid.js';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import reference from '../reference/sallen-key.json';
import { expectRelativelyClose } from '../support/close.js';

const DEG = 180 / Math.PI;

describe('acAnalysis on a unity-gain Sallen-Key Butterworth low-pass', () => {
  // Source: test/reference/sallen-key.json, written offline by sallen-key.py with scipy.signal.freqs
  // (denominator checked against scipy.signal.butter); circuit of Sallen and Kearns, IRE Trans.
  // Circuit Theory 2(1), 1955.
  const { R1, R2, C1, C2 } = reference.components;
  const circuit = new Circuit()
    .voltageSource('input', 'in', GROUND, { ac: 1 })
    .resistor('R1', 'in', 'a', R1)
    .resistor('R2', 'a', 'b', R2)
    .capacitor('C1', 'a', 'out', C1)
    .capacitor('C2', 'b', GROUND, C2)
    .opAmp('U1', { plus: 'b', minus: 'out', output: 'out' });
  const ac = acAnalysis(operatingPoint(circuit), { frequencies: reference.frequencies });

  it('matches the reference magnitude and unwrapped phase at the output', () => {
    const db = ac.magnitudeDb('out', 'in');
    const phase = ac.phaseDegrees('out', 'in');
    reference.frequencies.forEach((f, k) => {
      expect(Math.abs(db[k]! - reference.output.magnitudeDb[k]!), `dB at ${f} Hz`).toBeLessThan(1e-9);
      expect(Math.abs(phase[k]! - reference.output.phaseDeg[k]!), `phase at ${f} Hz`).toBeLessThan(1e-9);
    });
    // The sweep ends two decades past f0, where the phase has nearly reached −180°.
    expect(phase[phase.length - 1]!).toBeLessThan(-170);
  });

  it('matches the reference response at the node between the resistors', () => {
    const bode = ac.bode('a', 'in');
    reference.frequencies.forEach((f, k) => {
      expect(Math.abs(bode.magnitudeDb[k]! - reference.nodeA.magnitudeDb[k]!), `dB at ${f} Hz`).toBeLessThan(
        1e-9,
      );
      expect(Math.abs(bode.phaseDegrees[k]! - reference.nodeA.phaseDeg[k]!), `phase at ${f} Hz`).toBeLessThan(
        1e-9,
      );
      expectRelativelyClose(bode.magnitude[k]!, 10 ** (bode.magnitudeDb[k]! / 20), 1e-12, 'magnitude vs dB');
    });
    expect(Array.from(bode.frequencies)).toEqual(reference.frequencies);
  });

  it('is −3.0103 dB and −90° at f0, which is its cutoff frequency', () => {
    const f0 = reference.naturalFrequency;
    const atF0 = acAnalysis(operatingPoint(circuit), { frequencies: [f0] });
    expect(
      Math.abs(atF0.magnitudeDb('out', 'in')[0]! - reference.atNaturalFrequency.magnitudeDb),
    ).toBeLessThan(1e-9);
    expect(Math.abs(atF0.phaseDegrees('out', 'in')[0]! - reference.atNaturalFrequency.phaseDeg)).toBeLessThan(
      1e-9,
    );
    const dense = acAnalysis(operatingPoint(circuit), { frequencies: logSweep(10, 1e5, 200) });
    const cutoffs = dense.cutoffFrequencies('out', 'in');
    expect(cutoffs).toHaveLength(1);
    expectRelativelyClose(cutoffs[0]!, f0, 1e-4, 'Butterworth −3 dB frequency = f0');
  });
});

describe('acAnalysis on a non-inverting amplifier with a single-pole op-amp', () => {
  // A0 = 1e5, GBW = 1 MHz (open-loop pole fp = 10 Hz); R1 = 1 kΩ to ground, R2 = 9 kΩ feedback: β = 0.1.
  const A0 = 1e5;
  const GBW = 1e6;
  const fp = GBW / A0;
  const beta = 0.1;
  const circuit = new Circuit()
    .voltageSource('input', 'in', GROUND, { ac: 1 })
    .opAmp('U1', { plus: 'in', minus: 'fb', output: 'out' }, { openLoopGain: A0, gainBandwidth: GBW })
    .resistor('R2', 'out', 'fb', 9e3)
    .resistor('R1', 'fb', GROUND, 1e3);
  const op = operatingPoint(circuit);

  it('follows the exact single-pole closed-loop response A/(1 + Aβ)', () => {
    // Source: negative-feedback gain A/(1 + Aβ) with A(jf) = A0/(1 + jf/fp), e.g. Sedra and Smith,
    // "Microelectronic Circuits", feedback and op-amp frequency response chapters (from memory).
    const frequencies = [0, 1, 1e3, 1e5, 1e6, 1e7];
    const h = acAnalysis(op, { frequencies }).gain('out', 'in');
    frequencies.forEach((f, k) => {
      const a = new Complex(A0).div(new Complex(1, f / fp));
      const expected = a.div(a.mul(beta).add(1));
      expect(h[k]!.sub(expected).abs(), `H at ${f} Hz`).toBeLessThan(1e-12 * expected.abs());
    });
  });

  it('has a −3 dB bandwidth fp·(1 + A0β), close to GBW/(1 + R2/R1)', () => {
    // Source: the single-pole closed-loop bandwidth ω_p(1 + A0β), which is GBW·β for A0β ≫ 1 (Sedra and
    // Smith, from memory).
    const ac = acAnalysis(op, { frequencies: logSweep(1e3, 1e7, 400) });
    // The mid-band level given explicitly: the sweep's own maximum, at 1 kHz, already lies 4e-4 dB
    // below it, which would move the crossing by 1e-4.
    const passband = 20 * Math.log10(A0 / (1 + A0 * beta));
    const cutoffs = ac.cutoffFrequencies('out', 'in', { referenceDb: passband });
    expect(cutoffs).toHaveLength(1);
    expectRelativelyClose(cutoffs[0]!, fp * (1 + A0 * beta), 1e-6, 'exact closed-loop bandwidth');
    expectRelativelyClose(cutoffs[0]!, GBW / (1 + 9), 2e-4, 'GBW/(1 + R2/R1)');
    // With the default reference (the sweep's largest level) the sweep must reach into the flat band.
    const wide = acAnalysis(op, { frequencies: logSweep(10, 1e7, 400) }).cutoffFrequencies('out', 'in');
    expectRelativelyClose(wide[0]!, fp * (1 + A0 * beta), 1e-6, 'bandwidth with the default reference');
  });
});

describe('AcAnalysis.unityGainFrequency', () => {
  it('finds where an open-loop single-pole op-amp gain falls to 1: fp·√(A0² − 1) ≈ GBW', () => {
    // Source: |A0/(1 + jf/fp)| = 1 at f = fp·√(A0² − 1) (Sedra and Smith, from memory).
    const circuit = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .opAmp('U1', { plus: 'in', minus: GROUND, output: 'out' }, { openLoopGain: 2e5, gainBandwidth: 3e6 })
      .resistor('RL', 'out', GROUND, 10e3);
    const op = operatingPoint(circuit);
    const ac = acAnalysis(op, { frequencies: logSweep(1, 1e8, 50) });
    const fp = 3e6 / 2e5;
    const expected = fp * Math.sqrt(2e5 ** 2 - 1);
    // Far above the pole the gain falls as a straight line in dB against log f, so interpolation is exact
    // to rounding there.
    expectRelativelyClose(ac.unityGainFrequency('out', 'in')!, expected, 1e-9, 'unity-gain frequency');
    expectRelativelyClose(
      ac.unityGainFrequency('out')!,
      expected,
      1e-9,
      'unity-gain frequency of voltage at out',
    );
    // A sweep that stops below it has no crossing.
    expect(acAnalysis(op, { frequencies: logSweep(1, 1e6, 10) }).unityGainFrequency('out', 'in')).toBeNull();
  });

  it('is null for a divider whose gain never reaches 1', () => {
    // Source: a resistive divider's gain R2/(R1 + R2) < 1 at every frequency (common practice, no source).
    const circuit = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .resistor('R1', 'in', 'out', 1e3)
      .resistor('R2', 'out', GROUND, 1e3)
      .capacitor('C1', 'out', GROUND, 1e-9);
    const ac = acAnalysis(operatingPoint(circuit), { frequencies: logSweep(1, 1e9, 10) });
    expect(ac.unityGainFrequency('out', 'in')).toBeNull();
  });
});

describe('AcAnalysis.phaseDegrees on a buffered third-order RC ladder', () => {
  // Three RC sections (R = 10 kΩ, C = 10 nF) separated by ideal followers: H = 1/(1 + jωRC)³.
  const R = 10e3;
  const C = 10e-9;
  const fc0 = 1 / (2 * Math.PI * R * C);
  const circuit = new Circuit().voltageSource('input', 'in', GROUND, { ac: 1 });
  for (let k = 1; k <= 3; k++) {
    const from = k === 1 ? 'in' : `buf${k - 1}`;
    circuit
      .resistor(`R${k}`, from, `rc${k}`, R)
      .capacitor(`C${k}`, `rc${k}`, GROUND, C)
      .opAmp(`U${k}`, { plus: `rc${k}`, minus: `buf${k}`, output: `buf${k}` });
  }
  const op = operatingPoint(circuit);

  it('unwraps the phase −3·atan(ωRC) continuously past −180° down towards −270°', () => {
    // Source: the phase of a cascade is the sum of the phases of its stages; each first-order low-pass
    // contributes −atan(ωRC) (Sedra and Smith, from memory).
    const frequencies = logSweep(fc0 / 100, fc0 * 100, 20);
    const ac = acAnalysis(op, { frequencies });
    const phase = ac.phaseDegrees('buf3', 'in');
    frequencies.forEach((f, k) => {
      const u = f / fc0;
      expect(Math.abs(phase[k]! + 3 * Math.atan(u) * DEG), `phase at ${f} Hz`).toBeLessThan(1e-9);
    });
    expect(phase[phase.length - 1]!).toBeLessThan(-265);
    for (let k = 1; k < phase.length; k++) expect(phase[k]!).toBeLessThan(phase[k - 1]!);
  });

  it('is at −180° with gain 1/8 where ωRC = √3', () => {
    // Source: (1 + j√3)³ = −8, the classic result for three isolated RC sections (phase-shift
    // oscillator, from memory).
    const ac = acAnalysis(op, { frequencies: [fc0 / 10, Math.sqrt(3) * fc0] });
    const h = ac.gain('buf3', 'in')[1]!;
    expectRelativelyClose(h.re, -1 / 8, 1e-12, 'Re H at ωRC = √3');
    expect(Math.abs(h.im)).toBeLessThan(1e-14);
    expect(Math.abs(ac.phaseDegrees('buf3', 'in')[1]! + 180)).toBeLessThan(1e-9);
  });
});
