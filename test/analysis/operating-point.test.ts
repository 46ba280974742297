import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { crossCoupledBistable } from '../support/bistable.js';
import { thrown } from '../support/quiescent-error.js';

function diodeChain(count: number): Circuit {
  const c = new Circuit().voltageSource('supply', 'n0', GROUND, { dc: 20 }).resistor('R1', 'n0', 'n1', '10k');
  for (let k = 1; k <= count; k++) c.diode(`D${k}`, `n${k}`, k === count ? GROUND : `n${k + 1}`);
  return c;
}

describe('operatingPoint strategies', () => {
  it('solves a linear circuit in one step', () => {
    // Ohm's law: a 1 k / 3 k divider across 8 V gives 6 V.
    const c = new Circuit()
      .voltageSource('supply', 'a', GROUND, { dc: 8 })
      .resistor('R1', 'a', 'b', '1k')
      .resistor('R2', 'b', GROUND, '3k');
    const op = operatingPoint(c);
    expect(op.strategy).toBe('linear');
    expect(op.iterations).toBe(1);
    expect(op.voltage('b')).toBeCloseTo(6, 12);
  });

  it('records plain Newton when it succeeds', () => {
    // Source: the strategy names and attempts of docs/analyses.md, "Strategies".
    const op = operatingPoint(diodeChain(3));
    expect(op.strategy).toBe('newton');
    expect(op.attempts).toEqual([{ strategy: 'newton', iterations: op.iterations, converged: true }]);
  });

  it('falls back to a homotopy when plain Newton runs out of iterations, and reaches the same answer', () => {
    // Common practice, no source: the answer does not depend on the path taken to it.
    const reference = operatingPoint(diodeChain(20));
    const op = operatingPoint(diodeChain(20), { maxIterations: 6 });
    expect(op.attempts[0]).toMatchObject({ strategy: 'newton', converged: false });
    expect(op.attempts[op.attempts.length - 1]!.converged).toBe(true);
    expect(op.strategy).not.toBe('newton');
    expect(op.iterations).toBe(op.attempts.reduce((sum, a) => sum + a.iterations, 0));
    expect(op.voltage('n1')).toBeCloseTo(reference.voltage('n1'), 5);
  });

  it('starts from the initial guess given per node', () => {
    // The bistable of the hard-circuit tests settles on the side the guess favours; a saturated
    // transistor's collector sits a few hundred mV above its emitter (from memory).
    const npn = { polarity: 'npn' } as const;
    const c = crossCoupledBistable(npn);
    const left = operatingPoint(c, { initialGuess: { b1: 0.8 } });
    const right = operatingPoint(c, { initialGuess: { b2: 0.8 } });
    expect(left.voltage('c1')).toBeLessThan(0.5);
    expect(right.voltage('c2')).toBeLessThan(0.5);
  });
});

describe('operatingPoint options and accessors', () => {
  it('rejects bad options with invalid-value, and a guess for a missing node with unknown-node', () => {
    const c = diodeChain(2);
    for (const options of [
      { maxIterations: 0 },
      { maxIterations: 2.5 },
      { temperature: -1 },
      { relativeTolerance: Number.NaN },
      { junctionConductance: 0 },
      { initialGuess: { n1: Number.POSITIVE_INFINITY } },
    ]) {
      expect(thrown(() => operatingPoint(c, options)).code).toBe('invalid-value');
    }
    const e = thrown(() => operatingPoint(c, { initialGuess: { nowhere: 1 } }));
    expect(e.code).toBe('unknown-node');
    expect(e.message).toContain('nowhere');
  });

  it('answers unknown-node and unknown-element by name', () => {
    const c = diodeChain(1).bjt('Q1', { collector: 'n0', base: 'n1', emitter: GROUND }, { polarity: 'npn' });
    const op = operatingPoint(c);
    expect(thrown(() => op.voltage('x')).code).toBe('unknown-node');
    expect(thrown(() => op.current('Q1')).code).toBe('unknown-element');
    expect(thrown(() => op.device('R1')).code).toBe('unknown-element');
    const wrongKind = thrown(() => op.diode('Q1'));
    expect(wrongKind.code).toBe('unknown-element');
    expect(wrongKind.message).toContain('Q1');
    expect(op.device('Q1').kind).toBe('bjt');
  });
});
