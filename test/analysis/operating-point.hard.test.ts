/**
 * Circuits that defeat a plain undamped Newton iteration: long junction chains, circuits where most
 * junctions are off, high-gain loops and a circuit with more than one solution. Each must converge,
 * and the answer is judged from outside the solver by Kirchhoff's current law on the terminal currents.
 */
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, type OperatingPoint, operatingPoint, QuiescentError } from '../../src/index.js';
import { crossCoupledBistable } from '../support/bistable.js';
import { worstKcl } from '../support/kcl.js';

const NPN = { polarity: 'npn', forwardBeta: 100, earlyVoltage: 80 } as const;
const PNP = { polarity: 'pnp', forwardBeta: 50, earlyVoltage: 60 } as const;

/** KCL at every node within 1e-6 of the largest current there plus 1 pA (the solver's own tolerances). */
function expectKcl(circuit: Circuit, op: OperatingPoint): void {
  // Source: Kirchhoff's current law (Kirchhoff, 1845).
  const w = worstKcl(circuit, op, 1e-6);
  expect(
    Math.abs(w.imbalance),
    `KCL at node '${w.node}': imbalance ${w.imbalance} A against currents of ${w.scale} A`,
  ).toBeLessThanOrEqual(1e-6 * w.scale + 1e-12);
}

describe('operatingPoint on hard circuits', () => {
  it('converges on twenty diodes in series across a 20 V supply', () => {
    const c = new Circuit()
      .voltageSource('supply', 'n0', GROUND, { dc: 20 })
      .resistor('R1', 'n0', 'n1', '10k');
    for (let k = 1; k <= 20; k++) c.diode(`D${k}`, `n${k}`, k === 20 ? GROUND : `n${k + 1}`);
    const op = operatingPoint(c);
    expectKcl(c, op);
    // Every diode carries the loop current and drops the same voltage (identical parts in series).
    const i = op.current('R1');
    const vd = op.diode('D1').voltage;
    for (let k = 1; k <= 20; k++) {
      expect(op.diode(`D${k}`).current).toBeCloseTo(i, 12);
      expect(op.diode(`D${k}`).voltage).toBeCloseTo(vd, 9);
    }
    // Kirchhoff's voltage law round the loop: 20 V = i·R + 20·v_D. Source: Kirchhoff (1845).
    expect(20 - i * 10e3 - 20 * vd).toBeCloseTo(0, 6);
    // Silicon junctions near a milliamp sit at 0.6–0.7 V (common practice, no source).
    expect(vd).toBeGreaterThan(0.6);
    expect(vd).toBeLessThan(0.7);
  });

  it('finds the DC state of a bridge rectifier: two diodes conduct, two block', () => {
    const c = new Circuit()
      .voltageSource('supply', 'ac1', 'ac2', { dc: 10 })
      .resistor('Rg', 'ac2', GROUND, 1)
      .diode('D1', 'ac1', 'p')
      .diode('D2', 'ac2', 'p')
      .diode('D3', 'm', 'ac1')
      .diode('D4', 'm', 'ac2')
      .resistor('Rload', 'p', 'm', '1k');
    const op = operatingPoint(c);
    expectKcl(c, op);
    // Common practice, no source: the load sees the supply less two diode drops; D2 and D3 block.
    const vout = op.voltage('p', 'm');
    expect(vout).toBeCloseTo(10 - op.diode('D1').voltage - op.diode('D4').voltage, 9);
    expect(op.diode('D1').voltage).toBeGreaterThan(0.6);
    expect(op.diode('D4').voltage).toBeGreaterThan(0.6);
    expect(op.diode('D2').voltage).toBeLessThan(-8);
    expect(op.diode('D3').voltage).toBeLessThan(-8);
    expect(Math.abs(op.diode('D2').current)).toBeLessThan(1e-9);
  });

  it('converges on a Darlington pair, whose current gain is about β²', () => {
    const model = { polarity: 'npn', forwardBeta: 100 } as const;
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
      .voltageSource('input', 'in', GROUND, { dc: 3 })
      .resistor('Rb', 'in', 'b1', '1M')
      .bjt('Q1', { collector: 'vcc', base: 'b1', emitter: 'b2' }, model)
      .bjt('Q2', { collector: 'vcc', base: 'b2', emitter: 'e' }, model)
      .resistor('Re', 'e', GROUND, '100');
    const op = operatingPoint(c);
    expectKcl(c, op);
    const q1 = op.bjt('Q1');
    const q2 = op.bjt('Q2');
    expect(q1.region).toBe('forward-active');
    expect(q2.region).toBe('forward-active');
    // Q1's emitter current is Q2's base current.
    expect(q2.ib).toBeCloseTo(q1.ie, 12);
    // Darlington pair: I_E2 = (β+1)²·I_B1 (Sedra & Smith, Microelectronic Circuits, from memory).
    expect(q2.ie / q1.ib).toBeCloseTo(101 * 101, -1);
  });

  it('converges on a differential pair with a current-mirror load', () => {
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 10 })
      .voltageSource('negativeSupply', 'vee', GROUND, { dc: -10 })
      .voltageSource('inputPlus', 'inp', GROUND, { dc: 0 })
      .voltageSource('inputMinus', 'inm', GROUND, { dc: 0 })
      .bjt('Q1', { collector: 'mirror', base: 'inp', emitter: 'tail' }, NPN)
      .bjt('Q2', { collector: 'out', base: 'inm', emitter: 'tail' }, NPN)
      .bjt('Q3', { collector: 'mirror', base: 'mirror', emitter: 'vcc' }, PNP)
      .bjt('Q4', { collector: 'out', base: 'mirror', emitter: 'vcc' }, PNP)
      .resistor('Rtail', 'tail', 'vee', '9.3k')
      .resistor('Rload', 'out', GROUND, '1M');
    const op = operatingPoint(c);
    expectKcl(c, op);
    for (const q of ['Q1', 'Q2', 'Q3', 'Q4']) expect(op.bjt(q).region).toBe('forward-active');
    // The tail carries about (0 − 0.7 − (−10))/9.3k ≈ 1 mA, split between the halves
    // (common practice, no source).
    const tail = op.current('Rtail');
    expect(tail).toBeGreaterThan(0.9e-3);
    expect(tail).toBeLessThan(1.05e-3);
    expect(op.bjt('Q1').ic / op.bjt('Q2').ic).toBeCloseTo(1, 1);
  });

  it('converges on a two-stage amplifier with negative feedback from the output emitter to the input base', () => {
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 15 })
      .resistor('Rc1', 'vcc', 'c1', '22k')
      .resistor('Rf', 'e2', 'b1', '47k')
      .resistor('Rb', 'b1', GROUND, '10k')
      .bjt('Q1', { collector: 'c1', base: 'b1', emitter: 'e1' }, NPN)
      .resistor('Re1', 'e1', GROUND, '1k')
      .bjt('Q2', { collector: 'c2', base: 'c1', emitter: 'e2' }, NPN)
      .resistor('Re2', 'e2', GROUND, '4.7k')
      .resistor('Rc2', 'vcc', 'c2', '2.2k');
    const op = operatingPoint(c);
    expectKcl(c, op);
    expect(op.bjt('Q1').region).toBe('forward-active');
    expect(op.bjt('Q2').region).toBe('forward-active');
    // The divider Rf–Rb sets the input base from the output emitter, less the base current through
    // Rf‖Rb (superposition on a linear divider; common practice, no source).
    const parallel = (47e3 * 10e3) / 57e3;
    const expected = (op.voltage('e2') * 10e3) / 57e3 - op.bjt('Q1').ib * parallel;
    expect(op.voltage('b1')).toBeCloseTo(expected, 6);
  });

  it('settles a bistable (two cross-coupled transistors) at a solution with a tiny KCL residual', () => {
    const c = crossCoupledBistable(NPN);
    // Any of its three solutions is accepted; an initial guess that tips it one way must land there.
    expectKcl(c, operatingPoint(c));
    const tipped = operatingPoint(c, { initialGuess: { b1: 0.8, b2: 0 } });
    expectKcl(c, tipped);
    expect(tipped.bjt('Q1').region).toBe('saturation');
    expect(tipped.bjt('Q2').region).toBe('cutoff');
  });

  it('converges on a CMOS inverter at its switching threshold, where both channels saturate', () => {
    const c = new Circuit()
      .voltageSource('supply', 'vdd', GROUND, { dc: 5 })
      .voltageSource('input', 'in', GROUND, { dc: 2.5 })
      .mosfet(
        'pullUp',
        { drain: 'out', gate: 'in', source: 'vdd' },
        { polarity: 'pmos', channelLengthModulation: 0.02 },
      )
      .mosfet(
        'pullDown',
        { drain: 'out', gate: 'in', source: GROUND },
        { polarity: 'nmos', channelLengthModulation: 0.02 },
      );
    const op = operatingPoint(c);
    expectKcl(c, op);
    // A symmetric inverter switches at half the supply (Sedra & Smith, from memory).
    expect(op.voltage('out')).toBeCloseTo(2.5, 6);
  });
});

describe('operatingPoint when it truly cannot converge', () => {
  it('throws no-convergence with the strategies, worst residuals and devices, never NaN', () => {
    const c = new Circuit()
      .voltageSource('supply', 'a', GROUND, { dc: 5 })
      .resistor('R1', 'a', 'k', '1k')
      .diode('D1', 'k', GROUND);
    let error: unknown;
    try {
      operatingPoint(c, { maxIterations: 1 });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(QuiescentError);
    const e = error as QuiescentError;
    expect(e.code).toBe('no-convergence');
    if (e.details.code !== 'no-convergence') throw new Error('wrong details');
    expect(e.details.strategies.map((s) => s.strategy)).toEqual([
      'newton',
      'conductance-stepping',
      'source-ramping',
      'pseudo-transient',
    ]);
    expect(e.details.strategies.every((s) => !s.converged)).toBe(true);
    expect(e.details.devices).toContain('D1');
    expect(e.details.worstResiduals.length).toBeGreaterThan(0);
    expect(e.details.worstResiduals[0]!.name).toBe('k');
    for (const r of e.details.worstResiduals) expect(Number.isFinite(r.residual)).toBe(true);
    expect(Number.isFinite(e.details.lastUpdateNorm)).toBe(true);
    expect(Number.isFinite(e.details.lastResidualNorm)).toBe(true);
    expect(e.message).toContain('D1');
    expect(e.message).not.toContain('NaN');
  });
});
