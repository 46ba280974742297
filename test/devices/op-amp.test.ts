import { describe, expect, it } from 'vitest';
import { acAnalysis, Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

// DC error formulas: S. Franco, Design with Operational Amplifiers and Analog Integrated Circuits,
// 3rd ed., 2002, ch. 5 ("Static op amp limitations": input bias and offset currents, input offset
// voltage); the plus input draws I_P = I_B + I_OS/2 and the minus input I_N = I_B − I_OS/2.
const VOS = 1.5e-3;
const IB = 80e-9;
const IOS = 12e-9;
const IP = IB + IOS / 2;
const IN = IB - IOS / 2;
const ERRORS = { inputOffsetVoltage: VOS, inputBiasCurrent: IB, inputOffsetCurrent: IOS };

describe('an op-amp with input offset voltage and bias currents', () => {
  it('holds a unity-gain follower with a grounded input at +inputOffsetVoltage', () => {
    // docs/devices.md, "Op-amp": the offset is a source in series with the plus input.
    const c = new Circuit()
      .opAmp('U1', { plus: GROUND, minus: 'out', output: 'out' }, { inputOffsetVoltage: VOS })
      .resistor('load', 'out', GROUND, '10k');
    expectRelativelyClose(operatingPoint(c).voltage('out'), VOS, 1e-12, 'follower output');
  });

  it('gives an inverting amplifier the output error Vos·(1 + Rf/Ri) + I_N·Rf − I_P·Rp·(1 + Rf/Ri)', () => {
    // Franco 2002, ch. 5: output error of the inverting and non-inverting configurations.
    const [ri, rf, rp] = [10e3, 220e3, 4.7e3];
    const vin = 0.1;
    const c = new Circuit()
      .voltageSource('sense', 'in', GROUND, { dc: vin })
      .resistor('Ri', 'in', 'minus', ri)
      .resistor('Rf', 'minus', 'out', rf)
      .resistor('Rp', 'plus', GROUND, rp)
      .opAmp('U1', { plus: 'plus', minus: 'minus', output: 'out' }, ERRORS);
    const noise = 1 + rf / ri;
    const expected = -(rf / ri) * vin + VOS * noise + IN * rf - IP * rp * noise;
    expectRelativelyClose(operatingPoint(c).voltage('out'), expected, 1e-10, 'inverting output');
  });

  it('gives a non-inverting amplifier the output (1 + Rf/Ri)·(vin + Vos − I_P·Rs) + I_N·Rf', () => {
    // Franco 2002, ch. 5.
    const [ri, rf, rs] = [2.2e3, 47e3, 10e3];
    const vin = 0.05;
    const c = new Circuit()
      .voltageSource('sensor', 'src', GROUND, { dc: vin })
      .resistor('Rs', 'src', 'plus', rs)
      .resistor('Ri', 'minus', GROUND, ri)
      .resistor('Rf', 'minus', 'out', rf)
      .opAmp('U1', { plus: 'plus', minus: 'minus', output: 'out' }, ERRORS);
    const expected = (1 + rf / ri) * (vin + VOS - IP * rs) + IN * rf;
    expectRelativelyClose(operatingPoint(c).voltage('out'), expected, 1e-10, 'non-inverting output');
  });

  it('settles an integrator with a reset resistor at Vos·(1 + Rf/Ri) − I_OS·Rf when Rp = Ri ∥ Rf', () => {
    // Franco 2002, ch. 5: the capacitor is open at DC, the reset resistor Rf closes the loop, and the
    // bias-compensating resistor Rp = Ri ∥ Rf leaves only the offset current's error.
    const [ri, rf] = [100e3, 10e6];
    const rp = (ri * rf) / (ri + rf);
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { dc: 0 })
      .resistor('Ri', 'in', 'minus', ri)
      .capacitor('Cint', 'minus', 'out', '100n')
      .resistor('Rreset', 'minus', 'out', rf)
      .resistor('Rp', 'plus', GROUND, rp)
      .opAmp('U1', { plus: 'plus', minus: 'minus', output: 'out' }, ERRORS);
    const expected = VOS * (1 + rf / ri) - IOS * rf;
    expectRelativelyClose(operatingPoint(c).voltage('out'), expected, 1e-9, 'integrator output');
  });

  it('adds the finite-gain error 1/(1 + 1/(A·b)) of the feedback factor b = Ri/(Ri + Rf)', () => {
    // Franco 2002, ch. 1: closed-loop gain A/(1 + A·b) of a negative-feedback amplifier.
    const [ri, rf, a] = [1e3, 99e3, 2e4];
    const b = ri / (ri + rf);
    const c = new Circuit()
      .voltageSource('sensor', 'plus', GROUND, { dc: 0.01 })
      .resistor('Ri', 'minus', GROUND, ri)
      .resistor('Rf', 'minus', 'out', rf)
      .opAmp(
        'U1',
        { plus: 'plus', minus: 'minus', output: 'out' },
        { openLoopGain: a, inputOffsetVoltage: VOS },
      );
    const expected = ((0.01 + VOS) * a) / (1 + a * b);
    expectRelativelyClose(operatingPoint(c).voltage('out'), expected, 1e-10, 'finite-gain output');
  });
});

describe('the ideal/finite rule of the op-amp', () => {
  const follower = (options?: object) =>
    new Circuit()
      .voltageSource('sensor', 'in', GROUND, { dc: 1 })
      .opAmp('U1', { plus: 'in', minus: 'out', output: 'out' }, options)
      .resistor('load', 'out', GROUND, '1k');

  it('keeps an empty options object, or one with only input errors, ideal: the inputs meet exactly', () => {
    // docs/devices.md, "Op-amp": ideal unless a finite-model option is given.
    expect(operatingPoint(follower({})).voltage('out')).toBe(1);
    expect(operatingPoint(follower({ inputBiasCurrent: 1e-9 })).opAmp('U1').differentialInput).toBe(0);
  });

  it('makes the op-amp finite-gain when only an output limit is given (default gain 1e5)', () => {
    // Follower with A = 1e5: v(out) = A/(1 + A) of the input (common practice, no source).
    const out = operatingPoint(follower({ outputHigh: 12 })).voltage('out');
    expectRelativelyClose(out, 1e5 / (1 + 1e5), 1e-12, 'finite follower');
  });

  it('reports the terminal differential input, the output voltage and the linear region', () => {
    const op = operatingPoint(follower({ openLoopGain: 1e3, outputResistance: 50 }));
    const report = op.opAmp('U1');
    expect(report.kind).toBe('op-amp');
    expect(report.region).toBe('linear');
    expectRelativelyClose(report.outputVoltage, op.voltage('out'), 0, 'output voltage');
    expectRelativelyClose(report.differentialInput, 1 - op.voltage('out'), 1e-12, 'differential input');
  });

  it('rejects output limits that leave no room between them', () => {
    expectQuiescentError(
      () =>
        new Circuit().opAmp('U1', { plus: 'a', minus: 'b', output: 'c' }, { outputHigh: 1, outputLow: 1 }),
      'invalid-value',
      'outputHigh',
    );
  });
});

describe('an op-amp at its output limits', () => {
  const inverting = (vin: number) =>
    new Circuit()
      .voltageSource('sensor', 'in', GROUND, { dc: vin })
      .resistor('Ri', 'in', 'minus', '1k')
      .resistor('Rf', 'minus', 'out', '10k')
      .opAmp('U1', { plus: GROUND, minus: 'minus', output: 'out' }, { outputHigh: 4.5, outputLow: -3.5 });

  it('holds the output within 10 mV of the limit it is driven past, and reports that limit', () => {
    // docs/devices.md, "Op-amp": within 10 mV of a limit once the linear value is 1 V beyond it.
    const low = operatingPoint(inverting(1)).opAmp('U1');
    expect(low.region).toBe('limited-low');
    expect(Math.abs(low.outputVoltage + 3.5)).toBeLessThan(0.01);
    expect(
      operatingPoint(inverting(1)).warnings.some((w) => w.includes("op-amp 'U1'") && w.includes('lower')),
    ).toBe(true);
    expect(operatingPoint(inverting(0.1)).warnings).toEqual([]);
    const high = operatingPoint(inverting(-1)).opAmp('U1');
    expect(high.region).toBe('limited-high');
    expect(Math.abs(high.outputVoltage - 4.5)).toBeLessThan(0.01);
  });

  it('stays linear, within 1 mV of −(Rf/Ri)·vin, while the output is more than 50 mV inside the limits', () => {
    for (const vin of [-0.44, -0.2, 0, 0.2, 0.34]) {
      const out = operatingPoint(inverting(vin)).voltage('out');
      expect(Math.abs(out - -10 * vin * (1e5 / (1e5 + 11)))).toBeLessThan(1e-3);
    }
  });

  it('passes almost no small signal once limited', () => {
    const ac = acAnalysis(operatingPoint(inverting(1).voltageSource('tone', 'tone', GROUND, { ac: 1 })), {
      frequencies: [1e3],
    });
    expect(ac.voltage('out')[0]!.abs()).toBeLessThan(1e-6);
  });

  it('finds the linear solution from an initial guess on the opposite limit', () => {
    const c = new Circuit()
      .voltageSource('sensor', 'in', GROUND, { dc: 0 })
      .opAmp('U1', { plus: 'in', minus: 'out', output: 'out' }, { outputHigh: 5, outputLow: -5 })
      .resistor('load', 'out', GROUND, '1k');
    const op = operatingPoint(c, { initialGuess: { out: 5 } });
    expect(Math.abs(op.voltage('out'))).toBeLessThan(1e-9);
    expect(op.opAmp('U1').region).toBe('linear');
  });
});
