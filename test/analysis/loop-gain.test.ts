/**
 * The loop gain at a loop probe: a follower whose single-pole op-amp drives an RC load (a two-pole
 * loop, crossover and phase margin in closed form), a loop of three equal poles (finite gain margin in
 * closed form), and a loop whose feedback network loads the amplifier (signal passes both ways)
 * against Bode's return ratio worked out from the nodal equations by hand.
 */
import Complex from 'complex.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, logSweep, loopGain, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { expectQuiescentError } from '../support/quiescent-error.js';
import { threePoleLoop } from '../support/three-pole-loop.js';

const DEG = 180 / Math.PI;

/**
 * A unity-gain follower: a single-pole op-amp (gain A0, pole fp) drives the load capacitor through
 * an isolating resistor; the probe sits between the load and the inverting input.
 */
function follower(a0: number, gbw: number, isolation: number, load: number): Circuit {
  return new Circuit()
    .voltageSource('signal', 'in', GROUND, { ac: 1 })
    .opAmp('U1', { plus: 'in', minus: 'fb', output: 'amp' }, { openLoopGain: a0, gainBandwidth: gbw })
    .resistor('isolation', 'amp', 'out', isolation)
    .capacitor('load', 'out', GROUND, load)
    .loopProbe('loopBreak', 'out', 'fb');
}

/**
 * Crossover and phase margin of T = A0/((1 + s·τp)(1 + s·τL)): |T(jω)| = 1 is a quadratic in ω²,
 * and the phase margin is 180° − atan(ω·τp) − atan(ω·τL). Source: the two-pole loop of any control
 * text, e.g. S. Franco, "Design with Operational Amplifiers and Analog Integrated Circuits", 3rd ed.,
 * 2002, ch. 8 (stability with capacitive loads).
 */
function twoPoleMargins(a0: number, tauP: number, tauL: number): { crossover: number; margin: number } {
  const a = tauP * tauP * tauL * tauL;
  const b = tauP * tauP + tauL * tauL;
  const c = 1 - a0 * a0;
  const x = (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a);
  const omega = Math.sqrt(x);
  return {
    crossover: omega / (2 * Math.PI),
    margin: 180 - DEG * (Math.atan(omega * tauP) + Math.atan(omega * tauL)),
  };
}

describe('loopGain on a follower driving an RC load', () => {
  const a0 = 1e5;
  const gbw = 1e6;
  const isolation = 100;
  const load = 10e-9;
  const op = operatingPoint(follower(a0, gbw, isolation, load));
  const loop = loopGain(op, { probe: 'loopBreak', frequencies: logSweep(1, 1e8, 200) });
  const tauP = a0 / (2 * Math.PI * gbw);
  const tauL = isolation * load;
  const expected = twoPoleMargins(a0, tauP, tauL);

  it('gives T = A0/((1 + jωτp)(1 + jωτL)) at every frequency', () => {
    // Source: the loop's two cascaded poles (the op-amp's and the load's), each first order.
    loop.frequencies.forEach((f, k) => {
      const s = new Complex(0, 2 * Math.PI * f);
      const t = new Complex(a0).div(s.mul(tauP).add(1).mul(s.mul(tauL).add(1)));
      expect(loop.gain[k]!.sub(t).abs() / t.abs(), `T at ${f} Hz`).toBeLessThan(1e-9);
    });
  });

  it('finds the crossover and phase margin of the closed form', () => {
    // Interpolation over 200 points per decade: the figures agree to a few parts in 10⁵.
    expectRelativelyClose(loop.crossoverFrequency!, expected.crossover, 1e-4, 'crossover (closed form)');
    expect(Math.abs(loop.phaseMargin! - expected.margin)).toBeLessThan(0.01);
    // About 383 kHz and 22.5°: the load makes this follower ring.
    expect(expected.margin).toBeGreaterThan(20);
    expect(expected.margin).toBeLessThan(25);
  });

  it('reports no gain margin: two poles never reach −180°', () => {
    expect(loop.gainMargin).toBeNull();
    expect(loop.phaseCrossoverFrequency).toBeNull();
  });

  it('writes the margins and T into its JSON', () => {
    const json = JSON.parse(JSON.stringify(loop));
    expect(json.probe).toBe('loopBreak');
    expect(json.crossoverFrequency).toBe(loop.crossoverFrequency);
    expect(json.gain.re[0]).toBe(loop.gain[0]!.re);
    expect(json.gainMargin).toBeNull();
  });

  it('matches the two-pole closed form for any gain and load (property)', () => {
    // Source: as twoPoleMargins above.
    fc.assert(
      fc.property(
        fc.double({ min: 3, max: 5, noNaN: true }),
        fc.double({ min: 1, max: 4, noNaN: true }),
        (gainExponent, loadExponent) => {
          const a = 10 ** gainExponent;
          const c = 10 ** -loadExponent * 1e-6;
          const l = loopGain(operatingPoint(follower(a, gbw, isolation, c)), {
            probe: 'loopBreak',
            frequencies: logSweep(1, 1e9, 100),
          });
          const want = twoPoleMargins(a, a / (2 * Math.PI * gbw), isolation * c);
          expectRelativelyClose(l.crossoverFrequency!, want.crossover, 3e-4, 'crossover (property)');
          expect(Math.abs(l.phaseMargin! - want.margin)).toBeLessThan(0.05);
        },
      ),
      { seed: 15, numRuns: 20 },
    );
  });
});

describe('loopGain on a loop of three equal poles', () => {
  // Three buffered RC sections and an inverting gain K (test/support/three-pole-loop.ts): T = K/(1 + sτ)³.
  const gain = 4;
  const r = 1e3;
  const c = 1e-9;
  const tau = r * c;
  const circuit = threePoleLoop(gain, r, c);
  const loop = loopGain(operatingPoint(circuit), {
    probe: 'loopBreak',
    frequencies: logSweep(1e3, 1e8, 400),
  });

  it('reaches −180° at ω = √3/τ, where |T| = K/8: a gain margin of 20·log10(8/K)', () => {
    // Source: each pole gives −60° at ωτ = √3 and |1 + j√3| = 2 (the phase-shift oscillator's
    // condition; e.g. A. S. Sedra and K. C. Smith, "Microelectronic Circuits", 7th ed., 2015, §18.2).
    expectRelativelyClose(loop.phaseCrossoverFrequency!, Math.sqrt(3) / (2 * Math.PI * tau), 1e-4, 'ω180');
    expect(Math.abs(loop.gainMargin! - 20 * Math.log10(8 / gain))).toBeLessThan(1e-3);
  });

  it('crosses 0 dB at ωτ = √(K^(2/3) − 1) with the phase margin 180° − 3·atan(ωτ)', () => {
    // Source: |T| = K/(1 + (ωτ)²)^(3/2) = 1.
    const x = Math.sqrt(gain ** (2 / 3) - 1);
    expectRelativelyClose(loop.crossoverFrequency!, x / (2 * Math.PI * tau), 1e-4, 'crossover');
    expect(Math.abs(loop.phaseMargin! - (180 - 3 * DEG * Math.atan(x)))).toBeLessThan(0.01);
  });
});

describe('loopGain on a loop that passes signal both ways', () => {
  // An inverting amplifier of gain A with output resistance; its feedback divider (with a
  // capacitor) loads the output, and the load resistor loads it too.
  const A = 50;
  const Ro = 2e3;
  const RL = 3e3;
  const Rf = 10e3;
  const Rg = 4e3;
  const Cg = 1e-9;
  const circuit = new Circuit()
    .vcvs('amp', ['int', GROUND], [GROUND, 'm'], A)
    .resistor('outputResistance', 'int', 'out', Ro)
    .resistor('load', 'out', GROUND, RL)
    .loopProbe('loopBreak', 'out', 'top')
    .resistor('feedback', 'top', 'm', Rf)
    .resistor('ground', 'm', GROUND, Rg)
    .capacitor('shunt', 'm', GROUND, Cg);
  const frequencies = logSweep(100, 1e7, 5);
  const loop = loopGain(operatingPoint(circuit), { probe: 'loopBreak', frequencies });

  it("equals Bode's return ratio of the amplifier, from the nodal equations", () => {
    // Source: H. W. Bode, "Network Analysis and Feedback Amplifier Design", 1945: with the
    // amplifier's source replaced by 1 V, the return ratio is −(what it would then produce) =
    // A·v(m). Nodal analysis by hand: the output node sees Ro from the 1 V source, the load and the
    // divider Rf + Zg; v(m) = v(out)·Zg/(Rf + Zg), with Zg = Rg ∥ 1/(sC).
    frequencies.forEach((f, k) => {
      const s = new Complex(0, 2 * Math.PI * f);
      const zg = new Complex(1 / Rg).add(s.mul(Cg)).inverse();
      const divider = zg.add(Rf);
      const zOut = new Complex(1 / RL).add(divider.inverse()).inverse();
      const vOut = zOut.div(zOut.add(Ro));
      const returnRatio = vOut.mul(zg).div(divider).mul(A);
      expect(loop.gain[k]!.sub(returnRatio).abs() / returnRatio.abs(), `T at ${f} Hz`).toBeLessThan(1e-9);
    });
  });
});

describe('loopGain refuses', () => {
  const op = operatingPoint(follower(1e5, 1e6, 100, 1e-9));
  it('a probe that is not a loop probe, naming it', () => {
    expectQuiescentError(
      () => loopGain(op, { probe: 'load', frequencies: [1, 10] }),
      'unknown-element',
      'load',
    );
    expectQuiescentError(
      () => loopGain(op, { probe: 'nowhere', frequencies: [1, 10] }),
      'unknown-element',
      'nowhere',
    );
  });
  it('frequencies that do not ascend', () => {
    expectQuiescentError(
      () => loopGain(op, { probe: 'loopBreak', frequencies: [10, 1] }),
      'invalid-value',
      'greater than the frequency before it',
    );
  });
});

describe('loopGain around an ideal op-amp', () => {
  it('refuses: its loop gain is infinite, and says why', () => {
    // An ideal op-amp holds its inputs equal whatever its output: 1/(1 + T) = 0.
    const circuit = new Circuit()
      .voltageSource('signal', 'in', GROUND, { ac: 1 })
      .opAmp('U1', { plus: 'in', minus: 'fb', output: 'out' })
      .loopProbe('loopBreak', 'out', 'fb')
      .resistor('load', 'out', GROUND, 1e3);
    expectQuiescentError(
      () => loopGain(operatingPoint(circuit), { probe: 'loopBreak', frequencies: [1, 10] }),
      'invalid-value',
      'an ideal amplifier in the loop',
    );
  });
});
