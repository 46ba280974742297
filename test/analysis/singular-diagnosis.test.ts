/**
 * A singular circuit is explained by its cause: structural (an equation with no partner, named),
 * or numerical (too ill-conditioned for double precision, with the estimate), never a topology fault
 * blamed on innocent elements.
 */
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint, QuiescentError } from '../../src/index.js';
import { inverterChain } from '../support/hard-circuits.js';
import { worstKcl } from '../support/kcl.js';

function thrown(run: () => unknown): QuiescentError {
  try {
    run();
  } catch (e) {
    if (e instanceof QuiescentError) return e;
    throw e;
  }
  throw new Error('expected a QuiescentError');
}

describe('a singular circuit', () => {
  it('blames a vcvs that drives its own control node, and only it', () => {
    // v(a) − 1·v(a) = 0 says nothing: the structure has no equation left for the vcvs's current.
    const circuit = new Circuit()
      .voltageSource('supply', 'in', GROUND, { dc: 1 })
      .resistor('feed', 'in', 'a', '1k')
      .vcvs('follower', ['a', GROUND], ['a', GROUND], 1);
    const e = thrown(() => operatingPoint(circuit));
    expect(e.code).toBe('singular');
    if (e.details.code !== 'singular') throw new Error('wrong details');
    expect(e.details.reason).toBe('structural');
    expect(e.details.elements).toEqual(['follower']);
    expect(e.message).toContain("'follower'");
    expect(e.message).not.toContain("'supply'");
    expect(e.message).toContain('whatever the element values');
  });

  it('calls a 300 dB gain chain ill-conditioned, with the estimate, not a topology fault', () => {
    const circuit = new Circuit().voltageSource('supply', 's0', GROUND, { dc: 1e-3 });
    for (let k = 0; k < 15; k++) {
      circuit
        .vcvs(`stage${k}`, [`s${k + 1}`, GROUND], [`s${k}`, GROUND], 10)
        .resistor(`load${k}`, `s${k + 1}`, GROUND, '1k');
    }
    circuit.resistor('back', 's15', 's0', 1);
    const e = thrown(() => operatingPoint(circuit));
    if (e.details.code !== 'singular') throw new Error(`expected singular, got ${e.code}`);
    expect(e.details.reason).toBe('ill-conditioned');
    // Fifteen stages of ten make 1e15; 1/(1e15·1e-16) leaves under one digit (Higham, "Accuracy
    // and Stability of Numerical Algorithms", 2002, §7.1: relative error ≈ κ·u).
    expect(e.details.conditionEstimate).toBeGreaterThan(1e13);
    expect(e.message).toContain('condition number about');
    expect(e.message).toContain('not a fault of the topology');
  });

  it('is not reported for a long inverter chain whose Jacobian is singular at the starting guess', () => {
    // At 0 V every transistor is off, so the first Jacobian is singular; the circuit is not.
    const op = operatingPoint(inverterChain(40, 0, 0));
    expect(op.voltage('s40')).toBeCloseTo(0, 3);
  });
});

describe('no-convergence', () => {
  it('always names nodes and devices, even when every residual is within tolerance', () => {
    const circuit = inverterChain(3, 0, 2.5);
    const e = thrown(() => operatingPoint(circuit, { maxIterations: 2 }));
    expect(e.code).toBe('no-convergence');
    if (e.details.code !== 'no-convergence') throw new Error('wrong details');
    expect(e.details.worstResiduals.length).toBeGreaterThan(0);
    expect(e.details.devices.length).toBeGreaterThan(0);
    expect(e.details.strategies.map((s) => s.strategy)).toContain('pseudo-transient');
    expect(e.message).not.toContain('no node');
  });
});

describe('iterative refinement', () => {
  it('solves an op-amp follower behind a 1e-15 Ω link, checked by KCL from outside the solver', () => {
    const circuit = new Circuit()
      .voltageSource('reference', 'in', GROUND, { dc: 1.25 })
      .resistor('link', 'in', 'x', 1e-15)
      .opAmp('buffer', { plus: 'x', minus: 'out', output: 'out' })
      .resistor('load', 'out', GROUND, '1k');
    const op = operatingPoint(circuit);
    const w = worstKcl(circuit, op, 1e-6);
    expect(Math.abs(w.imbalance)).toBeLessThanOrEqual(1e-6 * w.scale + 1e-12);
    // An ideal follower copies its input (common practice, no source): 1.25 V across 1 kΩ.
    expect(op.voltage('out')).toBeCloseTo(1.25, 12);
    expect(op.current('load')).toBeCloseTo(1.25e-3, 15);
  });

  it('calls an inverting amplifier with a 1e-15 Ω input resistor ill-conditioned, not structurally singular', () => {
    // 1e15 S and 1e-3 S meet at the summing node: row-scaled, 1e-18 of the row is all that fixes
    // the output, beyond the 16 digits of double precision.
    const circuit = new Circuit()
      .voltageSource('reference', 'in', GROUND, { dc: 1 })
      .resistor('input', 'in', 'sum', 1e-15)
      .opAmp('U1', { plus: GROUND, minus: 'sum', output: 'out' })
      .resistor('feedback', 'out', 'sum', '1k');
    const e = thrown(() => operatingPoint(circuit));
    if (e.details.code !== 'singular') throw new Error(`expected singular, got ${e.code}`);
    expect(e.details.reason).toBe('ill-conditioned');
    expect(e.details.conditionEstimate).toBeGreaterThan(1e13);
  });

  it('says when values too far apart in size made the equations dependent', () => {
    // 1e15 S beside 1e-3 S: the sum is 1e15 exactly in double precision, and the 1 kΩ is lost.
    const circuit = new Circuit()
      .voltageSource('reference', 'in', GROUND, { dc: 1 })
      .resistor('source', 'in', 'p', '1k')
      .resistor('bridge', 'p', 'm', 1e-15)
      .opAmp('U1', { plus: 'p', minus: 'm', output: 'out' })
      .resistor('feedback', 'out', 'm', '1k')
      .resistor('load', 'out', GROUND, '1k');
    const e = thrown(() => operatingPoint(circuit));
    if (e.details.code !== 'singular') throw new Error(`expected singular, got ${e.code}`);
    expect(e.details.valueRange).toBeGreaterThan(1e17);
    expect(e.message).toContain('beyond the 16 digits of double precision');
  });
});
