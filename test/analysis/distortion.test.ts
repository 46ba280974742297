/**
 * The distortion estimate (method of nonlinear currents; Bussgang, Ehrman & Graham, Proc. IEEE 62(8),
 * 1974; Wambacq & Sansen, Distortion Analysis of Analog Integrated Circuits, 1998) against the exact
 * large-signal harmonics of a diode attenuator (Lambert W, test/reference/diode-harmonics.py), against
 * the quasi-static large-signal check on transistor stages, and against closed forms.
 */
import Complex from 'complex.js';
import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { distortion } from '../../src/analysis/distortion.js';
import { linearity } from '../../src/analysis/linearity.js';
import { checkDistortion } from '../../src/analysis/quasi-static.js';
import { Circuit, GROUND, operatingPoint, QuiescentError } from '../../src/index.js';
import reference from '../reference/diode-harmonics.json';
import { expectRelativelyClose, relativeError } from '../support/close.js';

/** The reference circuit of diode-harmonics.py: bias through R into a diode (r_d ≈ 16 Ω vs R = 20 Ω). */
function diodeAttenuator(amplitude: number): Circuit {
  return new Circuit()
    .voltageSource('drive', 'in', GROUND, { dc: reference.bias, ac: amplitude })
    .resistor('R1', 'in', 'a', reference.resistance)
    .diode('D1', 'a', GROUND, { saturationCurrent: reference.saturationCurrent });
}

/** Tolerances of the brief for the leading-order estimate while x ≤ 0.3. */
const SECOND_TOLERANCE = 0.1;
const THIRD_TOLERANCE = 0.2;

describe('the distortion estimate of a diode attenuator', () => {
  it('matches the exact large-signal harmonics within 10 % (2nd) and 20 % (3rd) while x ≤ 0.3', () => {
    // Source: exact Lambert-W solution at each phase (Banwell & Jayakumar, Electronics Letters 36(4),
    // 2000), harmonics by a 256-point DFT at 50 digits: test/reference/diode-harmonics.py.
    let checked = 0;
    for (const c of reference.cases) {
      const ac = acAnalysis(operatingPoint(diodeAttenuator(c.amplitude)), { frequencies: [0] });
      const x = linearity(ac).junctions[0]!.normalized;
      if (x > 0.3) continue;
      checked++;
      const [point] = distortion(ac, { output: 'a' }).points;
      const [h1, h2, h3] = c.junctionHarmonics as [number, number, number];
      expectRelativelyClose(point!.secondRatio, Math.abs(h2 / h1), SECOND_TOLERANCE, `2nd at x = ${x}`);
      expectRelativelyClose(point!.thirdRatio, Math.abs(h3 / h1), THIRD_TOLERANCE, `3rd at x = ${x}`);
      // The leading terms are exact as x → 0: the error is of relative order x².
      expect(relativeError(point!.secondRatio, Math.abs(h2 / h1))).toBeLessThanOrEqual(x * x);
      expect(relativeError(point!.thirdRatio, Math.abs(h3 / h1))).toBeLessThanOrEqual(2 * x * x);
      // With a cosine drive every phasor is real; the signs match the reference coefficients.
      expect(Math.abs(point!.second.im)).toBeLessThanOrEqual(1e-12 * Math.abs(h2));
      expect(Math.sign(point!.second.re)).toBe(Math.sign(h2));
      expect(Math.sign(point!.third.re)).toBe(Math.sign(h3));
      expectRelativelyClose(point!.meanShift, c.junctionMeanShift, x * x + 1e-6, `mean shift at x = ${x}`);
    }
    expect(checked).toBeGreaterThanOrEqual(4);
  });

  it('flags the junction outside the budget wherever estimate and exact answer part', () => {
    // Source: test/reference/diode-harmonics.py (exact) against the linearity report's verdict. The
    // largest drives must part (x ≈ 1.7 and 3.4), so that the check is not vacuous.
    let parted = 0;
    for (const c of reference.cases) {
      const ac = acAnalysis(operatingPoint(diodeAttenuator(c.amplitude)), { frequencies: [0] });
      const junction = linearity(ac).junctions[0]!;
      const [point] = distortion(ac, { output: 'a' }).points;
      const [h1, h2, h3] = c.junctionHarmonics as [number, number, number];
      const apart =
        relativeError(point!.secondRatio, Math.abs(h2 / h1)) > SECOND_TOLERANCE ||
        relativeError(point!.thirdRatio, Math.abs(h3 / h1)) > THIRD_TOLERANCE;
      if (apart) {
        parted++;
        expect(junction.withinBudget, `x = ${junction.normalized}`).toBe(false);
      }
      if (junction.withinBudget) {
        expect(relativeError(point!.secondRatio, Math.abs(h2 / h1))).toBeLessThan(0.01);
      }
    }
    expect(parted).toBeGreaterThanOrEqual(2);
  });

  it('splits the junction’s own x/4 between the 2nd harmonic of its voltage and of its current', () => {
    // Derivation (leading order, diode of small-signal conductance g₁ fed from conductance G = 1/R):
    // the nonlinear current I = g₂·V₁²/2 at 2f, with g₂ = g₁/(2·n·Vt) for an exponential, sees G + g₁,
    // so the junction voltage at 2f is −I/(G + g₁) and the junction current g₁·v₂ + I = I·G/(G + g₁).
    // Relative to the fundamentals V₁ and g₁·V₁, with I/(g₁·V₁) = V₁/(4·n·Vt) = x/4:
    //   H2(voltage) = (x/4)·g₁/(G + g₁),   H2(current) = (x/4)·G/(G + g₁),   sum = x/4,
    // the leading term of the junction's own I₂(x)/I₁(x) = x/4 − x³/96 + … (A&S 9.6.10).
    for (const amplitude of [0.0005, 0.002, 0.006]) {
      const ac = acAnalysis(operatingPoint(diodeAttenuator(amplitude)), { frequencies: [1e3] });
      const junction = linearity(ac).junctions[0]!;
      const voltage = distortion(ac, { output: 'a' }).points[0]!.secondRatio;
      const current = distortion(ac, { output: { element: 'R1' } }).points[0]!.secondRatio;
      const x = junction.normalized;
      expectRelativelyClose(voltage + current, x / 4, 1e-9, 'voltage share + current share');
      expectRelativelyClose(voltage + current, junction.secondHarmonic, x * x, 'against I₂(x)/I₁(x)');
      // Comparable source resistance: neither share is negligible.
      expect(Math.min(voltage, current)).toBeGreaterThan(0.3 * (x / 4));
    }
  });

  it('sees a shunt capacitor at 2f, not at f, when it solves for the 2nd harmonic', () => {
    // Source: the nonlinear-current algebra worked by hand for one node (Wambacq & Sansen, 1998, ch. 3):
    // with Y(ω) = G + g₁ + jωC, V₁ = G·A/Y(ω), the current g₂·V₁²/2 (g₂ = I_S·e^{v/nVt}/(2·(nVt)²))
    // drives the node at 2f through Y(2ω): V₂ = −g₂·V₁²/(2·Y(2ω)).
    const amplitude = 0.001;
    const circuit = diodeAttenuator(amplitude).capacitor('C1', 'a', GROUND, '1u');
    const op = operatingPoint(circuit);
    const f = 5e3;
    const [point] = distortion(acAnalysis(op, { frequencies: [f] }), { output: 'a' }).points;
    const nVt = op.thermalVoltage;
    const d = op.diode('D1');
    const g2 = (d.current + reference.saturationCurrent) / (2 * nVt * nVt);
    const G = 1 / reference.resistance;
    const admittance = (w: number) => new Complex(G + d.conductance, w * 1e-6);
    const v1 = new Complex(G * amplitude, 0).div(admittance(2 * Math.PI * f));
    const v2 = v1
      .mul(v1)
      .mul(-g2 / 2)
      .div(admittance(4 * Math.PI * f));
    expect(point!.fundamental.sub(v1).abs()).toBeLessThanOrEqual(1e-9 * v1.abs());
    expect(point!.second.sub(v2).abs()).toBeLessThanOrEqual(1e-6 * v2.abs());
  });

  it('scales the 2nd harmonic as s² and the 3rd as s³ with the drive', () => {
    // Source: the Volterra series (Bussgang et al., 1974): the n-th order response is homogeneous of
    // degree n in the drive.
    const ac = acAnalysis(operatingPoint(diodeAttenuator(0.001)), { frequencies: [10] });
    const one = distortion(ac, { output: 'a' }).points[0]!;
    const three = distortion(ac, { output: 'a', scale: 3 }).points[0]!;
    expectRelativelyClose(three.fundamental.abs(), 3 * one.fundamental.abs(), 1e-12, 'fundamental');
    expectRelativelyClose(three.second.abs(), 9 * one.second.abs(), 1e-12, '2nd');
    expectRelativelyClose(three.third.abs(), 27 * one.third.abs(), 1e-12, '3rd');
  });
});

/** A common-emitter stage driven at the base: without degeneration, or with emitter resistor RE. */
function commonEmitter(amplitude: number, degeneration: number): Circuit {
  const c = new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 10 })
    .voltageSource('baseDrive', 'b', GROUND, { dc: 0.65 + 1e-3 * degeneration, ac: amplitude })
    .resistor('RC', 'vcc', 'c', '4.7k')
    .bjt('Q1', { collector: 'c', base: 'b', emitter: 'e' }, { polarity: 'npn', earlyVoltage: 50 });
  return degeneration > 0 ? c.resistor('RE', 'e', GROUND, degeneration) : c.resistor('RE', 'e', GROUND, 1e-6);
}

describe('the distortion estimate of transistor stages against the quasi-static check', () => {
  for (const [label, degeneration, amplitudes] of [
    ['without emitter degeneration', 0, [0.0005, 0.002, 0.0075]],
    ['with 100 Ω emitter degeneration', 100, [0.002, 0.01, 0.02]],
  ] as const) {
    it(`agrees within 10 % (2nd) and 20 % (3rd) for a common-emitter stage ${label} while x ≤ 0.3`, () => {
      // Source: large-signal check (the full Ebers-Moll circuit solved by Newton at 64 phases, DFT),
      // independent of the Volterra algebra it judges.
      for (const amplitude of amplitudes) {
        const result = checkDistortion(commonEmitter(amplitude, degeneration), { output: 'c' });
        const be = linearity(result.ac).junctions.find((j) => j.junction === 'base-emitter')!;
        expect(be.normalized).toBeLessThanOrEqual(0.3);
        expectRelativelyClose(
          result.estimate.secondRatio,
          result.check.secondRatio,
          SECOND_TOLERANCE,
          `2nd, ${amplitude} V`,
        );
        expectRelativelyClose(
          result.estimate.thirdRatio,
          result.check.thirdRatio,
          THIRD_TOLERANCE,
          `3rd, ${amplitude} V`,
        );
        // The base-emitter junction makes nearly all of it; the reverse-biased collector junction almost none.
        const shares = result.estimate.contributions;
        const fromBe = shares.find((s) => s.junction === 'base-emitter')!;
        const fromBc = shares.find((s) => s.junction === 'base-collector')!;
        expect(fromBe.secondRatio).toBeGreaterThan(0.99 * result.estimate.secondRatio);
        expect(fromBc.secondRatio).toBeLessThan(1e-6 * result.estimate.secondRatio);
        // Superposition: the shares add up to the total phasor.
        const sum = shares.reduce((acc, s) => acc.add(s.second), shares[0]!.second.mul(0));
        expect(sum.sub(result.estimate.second).abs()).toBeLessThanOrEqual(
          1e-12 * result.estimate.second.abs(),
        );
      }
    });
  }

  it('shows degeneration lowering the 2nd harmonic at the same collector signal', () => {
    // Source: feedback reduces 2nd-order distortion by about the loop gain 1 + gm·RE (Wambacq & Sansen,
    // 1998, ch. 6); here checked against the quasi-static check, not the formula.
    const plain = checkDistortion(commonEmitter(0.002, 0), { output: 'c' });
    const target = plain.estimate.fundamental.abs();
    const probe = checkDistortion(commonEmitter(0.001, 100), { output: 'c' });
    const amplitude = (0.001 * target) / probe.estimate.fundamental.abs();
    const degenerated = checkDistortion(commonEmitter(amplitude, 100), { output: 'c' });
    expectRelativelyClose(degenerated.check.fundamental, target, 0.05, 'same output swing');
    expect(degenerated.check.secondRatio).toBeLessThan(0.5 * plain.check.secondRatio);
    expectRelativelyClose(
      degenerated.estimate.secondRatio,
      degenerated.check.secondRatio,
      SECOND_TOLERANCE,
      'estimate',
    );
  });

  it('gives a MOSFET common-source stage the square law’s 2nd harmonic x/4 and no 3rd', () => {
    // Source: square law (Shichman & Hodges, 1968): id = ½β(V_ov + v̂ cos θ)², so the drain current and
    // the drain voltage −RD·id carry a 2nd harmonic of exactly x/4 and none of 3rd order (λ = 0).
    for (const amplitude of [0.03, 0.1, 0.3]) {
      const c = new Circuit()
        .voltageSource('supply', 'vdd', GROUND, { dc: 10 })
        .voltageSource('gateDrive', 'g', GROUND, { dc: 1.7, ac: amplitude })
        .resistor('RD', 'vdd', 'd', '5k')
        .mosfet('amplifier', { drain: 'd', gate: 'g', source: GROUND }, { polarity: 'nmos' });
      const result = checkDistortion(c, { output: 'd' });
      const x = amplitude / 1.0;
      expectRelativelyClose(result.estimate.secondRatio, x / 4, 1e-9, 'x/4');
      expect(result.estimate.thirdRatio).toBe(0);
      expectRelativelyClose(result.estimate.secondRatio, result.check.secondRatio, SECOND_TOLERANCE, 'check');
      expect(result.check.thirdRatio).toBeLessThan(1e-6);
    }
  });

  it('follows channel-length modulation into a 3rd harmonic through the 2nd-order response', () => {
    // Source: quasi-static check. With λ > 0 the drain voltage feeds back on the channel current, so
    // the 3rd harmonic comes from the interaction term ½·f_ab·V_a·W_b alone (the square law has no
    // cubic term).
    const c = nmosCommonSource(1.7, 0.1, 0.05);
    const result = checkDistortion(c, { output: 'd' });
    expect(result.check.thirdRatio).toBeGreaterThan(1e-5);
    expectRelativelyClose(result.estimate.thirdRatio, result.check.thirdRatio, THIRD_TOLERANCE, '3rd');
    expectRelativelyClose(result.estimate.secondRatio, result.check.secondRatio, SECOND_TOLERANCE, '2nd');
  });

  const mosfetStages: readonly [string, Circuit][] = [
    [
      'a pmos stage with channel-length modulation',
      new Circuit()
        .voltageSource('negativeSupply', 'vss', GROUND, { dc: -10 })
        .voltageSource('gateDrive', 'g', GROUND, { dc: -1.7, ac: 0.1 })
        .resistor('RD', 'd', 'vss', '5k')
        .mosfet(
          'amplifier',
          { drain: 'd', gate: 'g', source: GROUND },
          { polarity: 'pmos', channelLengthModulation: 0.05 },
        ),
    ],
    [
      'an nmos stage with source degeneration and body effect',
      new Circuit()
        .voltageSource('supply', 'vdd', GROUND, { dc: 10 })
        .voltageSource('gateDrive', 'g', GROUND, { dc: 2.5, ac: 0.05 })
        .resistor('RD', 'vdd', 'd', '5k')
        .resistor('RS', 's', GROUND, '1k')
        .mosfet(
          'amplifier',
          { drain: 'd', gate: 'g', source: 's', body: GROUND },
          { polarity: 'nmos', bodyEffect: 0.5, channelLengthModulation: 0.02 },
        ),
    ],
    ['an nmos stage in the triode region', nmosCommonSource(3, 0.05, 0.02)],
  ];
  for (const [label, circuit] of mosfetStages) {
    it(`agrees with the quasi-static check on ${label}`, () => {
      // Source: large-signal check (the full square-law circuit solved at 64 phases, DFT).
      const result = checkDistortion(circuit, { output: 'd' });
      expectRelativelyClose(result.estimate.secondRatio, result.check.secondRatio, 0.01, '2nd');
      expectRelativelyClose(result.estimate.thirdRatio, result.check.thirdRatio, 0.02, '3rd');
    });
  }

  it('handles a pnp stage as the mirror of the npn one', () => {
    // Source: the mirror symmetry of the transport model (docs/devices.md, "Bipolar transistor": a
    // pnp obeys the npn equations in the mirrored voltages), checked by the quasi-static check.
    const c = new Circuit()
      .voltageSource('negativeSupply', 'vee', GROUND, { dc: -10 })
      .voltageSource('baseDrive', 'b', GROUND, { dc: -0.65, ac: 0.003 })
      .resistor('RC', 'c', 'vee', '4.7k')
      .bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, { polarity: 'pnp', earlyVoltage: 50 });
    const result = checkDistortion(c, { output: 'c' });
    expectRelativelyClose(result.estimate.secondRatio, result.check.secondRatio, SECOND_TOLERANCE, '2nd');
    expectRelativelyClose(result.estimate.thirdRatio, result.check.thirdRatio, THIRD_TOLERANCE, '3rd');
  });
});

describe('distortion arguments', () => {
  const ac = acAnalysis(operatingPoint(diodeAttenuator(0.001)), { frequencies: [10, 100] });

  it('estimates at every analysed frequency, or at one asked for', () => {
    // Source: the options' definition (common practice, no source).
    expect(distortion(ac, { output: 'a' }).points.map((p) => p.frequency)).toEqual([10, 100]);
    expect(distortion(ac, { output: 'a', frequency: 100 }).points.map((p) => p.frequency)).toEqual([100]);
  });

  for (const [what, options, code] of [
    ['a frequency that was not analysed', { output: 'a', frequency: 50 }, 'invalid-value'],
    ['a scale of 0', { output: 'a', scale: 0 }, 'invalid-value'],
    ['an unknown node', { output: 'nowhere' }, 'unknown-node'],
    ['an unknown element', { output: { element: 'R9' } }, 'unknown-element'],
    [
      'a nonlinear element, whose harmonic current is not estimated',
      { output: { element: 'D1' } },
      'unknown-element',
    ],
    ['a malformed probe', { output: 42 }, 'invalid-value'],
  ] as const) {
    it(`refuses ${what} with ${code}`, () => {
      // Source: docs/linearity.md, "The distortion estimate (method of nonlinear currents)".
      try {
        distortion(ac, options as never);
        expect.unreachable('distortion accepted a bad argument');
      } catch (error) {
        expect(error).toBeInstanceOf(QuiescentError);
        expect((error as QuiescentError).code).toBe(code);
      }
    });
  }
});

/** An nmos common-source stage: 10 V supply, 5 kΩ drain load, the gate driven at `gate` V ± `swing` V. */
function nmosCommonSource(gate: number, swing: number, channelLengthModulation: number): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vdd', GROUND, { dc: 10 })
    .voltageSource('gateDrive', 'g', GROUND, { dc: gate, ac: swing })
    .resistor('RD', 'vdd', 'd', '5k')
    .mosfet(
      'amplifier',
      { drain: 'd', gate: 'g', source: GROUND },
      { polarity: 'nmos', channelLengthModulation },
    );
}
