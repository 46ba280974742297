/**
 * The convergence set (test/support/hard-circuits.ts): each circuit either solves, judged from outside
 * the solver by Kirchhoff's current law on the terminal currents, or fails with the code its fault
 * deserves and a message that names the cause. The slow ones (500 to 10,000 inverters) run in
 * bench/convergence.ts.
 */
import { describe, expect, it } from 'vitest';
import { operatingPoint, QuiescentError } from '../../src/index.js';
import { HARD_CIRCUITS, inverterChain } from '../support/hard-circuits.js';
import { worstKcl } from '../support/kcl.js';

/** The error thrown by `run`, or a failure of the test when nothing is thrown. */
function thrown(run: () => unknown): QuiescentError {
  try {
    run();
  } catch (e) {
    if (e instanceof QuiescentError) return e;
    throw e;
  }
  throw new Error('expected a QuiescentError');
}

describe('the operating-point search on the convergence set', () => {
  for (const hard of HARD_CIRCUITS.filter((h) => !h.slow)) {
    it(`${hard.expect === 'solves' ? 'solves' : `fails with ${hard.expect} on`} ${hard.name}`, () => {
      const circuit = hard.build();
      const options = hard.temperature === undefined ? {} : { temperature: hard.temperature };
      if (hard.expect === 'solves') {
        const op = operatingPoint(circuit, options);
        // Kirchhoff's current law from the element currents (Kirchhoff, 1845), within the solver's
        // own tolerances: 1e-6 of the largest current at the node plus 1 pA.
        const w = worstKcl(circuit, op, 1e-6);
        expect(Math.abs(w.imbalance), `KCL at '${w.node}'`).toBeLessThanOrEqual(1e-6 * w.scale + 1e-12);
        for (const node of op.nodes) expect(Number.isFinite(op.voltage(node))).toBe(true);
      } else {
        const e = thrown(() => operatingPoint(circuit, options));
        expect(e.code).toBe(hard.expect);
        expect(e.message).not.toContain('NaN');
      }
    });
  }
});

describe('three CMOS inverters (λ = 0) driven near their switching point', () => {
  it('solve for every input from 2.40 V to 2.50 V in steps of 1 mV', () => {
    // These inputs put the first stage where both transistors saturate; with λ = 0 its output is
    // held only by the junction conductances, and the gain of each stage is about 1e9.
    for (let k = 0; k <= 100; k++) {
      const input = 2.4 + k * 0.001;
      const circuit = inverterChain(3, 0, input);
      const op = operatingPoint(circuit);
      const w = worstKcl(circuit, op, 1e-6);
      expect(Math.abs(w.imbalance), `input ${input} V, KCL at '${w.node}'`).toBeLessThanOrEqual(
        1e-6 * w.scale + 1e-12,
      );
    }
  });
});

describe('a long inverter chain', () => {
  it('solves 500 stages (λ = 0.05, input 0 V) with outputs alternating between the rails', () => {
    // A chain reported singular before the search grew its budget: a singular Jacobian at one
    // iterate ended the search.
    const circuit = inverterChain(500, 0.05, 0);
    const op = operatingPoint(circuit);
    for (let k = 1; k <= 500; k++) {
      const expected = k % 2 === 1 ? 5 : 0;
      expect(op.voltage(`s${k}`)).toBeCloseTo(expected, 3);
    }
  });
});
