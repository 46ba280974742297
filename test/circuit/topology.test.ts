import { describe, expect, it } from 'vitest';
import {
  Circuit,
  type DetailsOf,
  type ErrorCode,
  GROUND,
  operatingPoint,
  QuiescentError,
} from '../../src/index.js';

/**
 * Whole-circuit checks that run when an analysis starts. A DC solution is unique only if every node
 * has a DC path to the reference node, no loop is made of voltage sources (inductors are shorts at
 * DC) and no cut set is made of current sources (capacitors are open at DC): L. O. Chua, C. A.
 * Desoer and E. S. Kuh, Linear and Nonlinear Circuits, 1987, ch. 2 and 4 (from memory); the
 * DC-equivalent elements are those of C. K. Alexander and M. N. O. Sadiku, Fundamentals of Electric
 * Circuits, 5th ed., 2013, §6.2 and §6.4 (from memory).
 */

/** The QuiescentError that `operatingPoint(c)` throws, with its code and message names checked. */
function expectRejected(c: Circuit, code: ErrorCode, ...names: string[]): QuiescentError {
  let error: unknown;
  try {
    operatingPoint(c);
  } catch (e) {
    error = e;
  }
  expect(error).toBeInstanceOf(QuiescentError);
  const q = error as QuiescentError;
  expect(q.code, q.message).toBe(code);
  for (const name of names) expect(q.message).toContain(`'${name}'`);
  return q;
}

describe('topology checks before solving', () => {
  describe('no-ground', () => {
    it('rejects a circuit where nothing touches ground', () => {
      // Alexander & Sadiku, 5th ed., 2013, §3.2 (from memory): nodal analysis needs a reference node
      const c = new Circuit().voltageSource('supply', 'a', 'b', { dc: 1 }).resistor('R1', 'a', 'b', 1e3);
      expectRejected(c, 'no-ground', GROUND);
    });

    it('rejects an empty circuit', () => {
      // common practice, no source: an empty circuit has no reference node
      expectRejected(new Circuit(), 'no-ground');
    });
  });

  describe('floating-node', () => {
    it('rejects nodes reached only through a capacitor, naming each of them and no other', () => {
      // Alexander & Sadiku, 5th ed., 2013, §6.2 (from memory): a capacitor is an open circuit at DC
      const c = new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: 5 })
        .resistor('R1', 'in', GROUND, 1e3)
        .capacitor('C1', 'in', 'x', 1e-6)
        .resistor('R2', 'x', 'y', 1e3);
      const error = expectRejected(c, 'floating-node', 'x', 'y');
      expect(error.message).not.toContain("'in'");
      expect(error.details).toEqual({ code: 'floating-node', nodes: ['x', 'y'] });
    });

    it('rejects a node reached only through a current source', () => {
      // Chua, Desoer & Kuh, 1987 (from memory): a current source fixes a current, not a potential
      const c = new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: 5 })
        .resistor('R1', 'in', GROUND, 1e3)
        .currentSource('bias', 'in', 'x', { dc: 1e-3 });
      const error = expectRejected(c, 'floating-node', 'x');
      expect(error.details).toEqual({ code: 'floating-node', nodes: ['x'] });
    });

    it('rejects a node reached only through the output of a voltage-controlled current source', () => {
      // a vccs output is a current source (Alexander & Sadiku, 5th ed., 2013, §2.2, from memory)
      const c = new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: 1 })
        .vccs('transconductor', [GROUND, 'x'], ['in', GROUND], 1e-3);
      expectRejected(c, 'floating-node', 'x');
    });

    it('reports a cut set of current sources and capacitors as the nodes it cuts off', () => {
      // Chua, Desoer & Kuh, 1987 (from memory): a cut set of current sources (capacitors open at
      // DC) leaves the potential of one side undetermined; docs/building-circuits.md, "Errors", reports it
      // as floating-node, which comes before singular
      const c = new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: 5 })
        .resistor('R1', 'in', 'a', 1e3)
        .resistor('R2', 'a', GROUND, 1e3)
        .currentSource('bias', 'a', 'x', { dc: 1e-3 })
        .capacitor('C1', 'x', GROUND, 1e-9)
        .currentSource('sink', 'y', 'in', { dc: 1e-3 })
        .resistor('R3', 'x', 'y', 1e3);
      const error = expectRejected(c, 'floating-node', 'x', 'y');
      expect(error.details).toEqual({ code: 'floating-node', nodes: ['x', 'y'] });
    });

    it('accepts the same circuit once a resistor gives the cut-off nodes a DC path', () => {
      // Chua, Desoer & Kuh, 1987 (from memory): a conducting branch across the cut set removes it
      const c = new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: 5 })
        .resistor('R1', 'in', GROUND, 1e3)
        .capacitor('C1', 'in', 'x', 1e-6)
        .resistor('R2', 'x', 'y', 1e3)
        .resistor('R4', 'y', GROUND, 1e3);
      expect(() => operatingPoint(c)).not.toThrow();
    });
  });

  describe('singular', () => {
    it('rejects two voltage sources in parallel, naming both and their nodes', () => {
      // Chua, Desoer & Kuh, 1987 (from memory): a loop of voltage sources
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 1 })
        .voltageSource('backup', 'a', GROUND, { dc: 2 })
        .resistor('R1', 'a', GROUND, 1e3);
      const error = expectRejected(c, 'singular', 'supply', 'backup', 'a');
      expect(error.details).toMatchObject({ code: 'singular', reason: 'voltage-loop' });
      const details = error.details as DetailsOf<'singular'>;
      expect([...details.elements].sort()).toEqual(['backup', 'supply']);
    });

    it('names exactly the sources of a three-source loop, not the other sources', () => {
      // Kirchhoff's voltage law around the loop supply, backup, bridge (Alexander & Sadiku, 5th ed., 2013, §2.4)
      const c = new Circuit()
        .voltageSource('standalone', 'z', GROUND, { dc: 1 })
        .voltageSource('supply', 'a', GROUND, { dc: 1 })
        .voltageSource('backup', 'b', 'a', { dc: 2 })
        .voltageSource('bridge', 'b', GROUND, { dc: 3 })
        .resistor('R1', 'a', 'z', 1e3);
      const error = expectRejected(c, 'singular', 'supply', 'backup', 'bridge');
      const details = error.details as DetailsOf<'singular'>;
      expect([...details.elements].sort()).toEqual(['backup', 'bridge', 'supply']);
      expect(error.message).not.toContain("'standalone'");
    });

    it('rejects an inductor across a voltage source, an inductor being a short at DC', () => {
      // Alexander & Sadiku, 5th ed., 2013, §6.4 (from memory): an inductor is a short circuit at DC
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 1 })
        .inductor('L1', 'a', GROUND, 1e-3)
        .resistor('R1', 'a', GROUND, 1e3);
      expectRejected(c, 'singular', 'L1', 'supply');
    });

    it('rejects a loop of inductors alone', () => {
      // Chua, Desoer & Kuh, 1987 (from memory): the DC current around an inductor loop is undetermined
      const c = new Circuit()
        .currentSource('bias', GROUND, 'a', { dc: 1e-3 })
        .inductor('L1', 'a', GROUND, 1e-3)
        .inductor('L2', 'a', GROUND, 2e-3);
      expectRejected(c, 'singular', 'L1', 'L2');
    });

    it('rejects a voltage source whose two terminals are one node', () => {
      // Kirchhoff's voltage law: v(a) − v(a) = 0 cannot equal a non-zero source (common practice, no source)
      const c = new Circuit().voltageSource('supply', 'a', 'a', { dc: 1 }).resistor('R1', 'a', GROUND, 1e3);
      expectRejected(c, 'singular', 'supply');
    });

    it('rejects two ideal op-amps driving one output', () => {
      // an ideal op-amp output is a voltage source to ground (Sedra & Smith, Microelectronic Circuits,
      // 7th ed., 2015, §2.1, from memory)
      const c = new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: 1 })
        .opAmp('U1', { plus: 'in', minus: 'out', output: 'out' })
        .opAmp('U2', { plus: 'in', minus: 'out', output: 'out' });
      expectRejected(c, 'singular', 'U1', 'U2');
    });

    it('rejects an ideal op-amp with no feedback, naming it', () => {
      // Sedra & Smith, 7th ed., 2015, §2.1 (from memory): infinite gain needs negative feedback to
      // fix the output; without it the equations have no unique solution
      const c = new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: 1 })
        .opAmp('U1', { plus: 'in', minus: 'x', output: 'out' })
        .resistor('R1', 'out', GROUND, 1e3)
        .resistor('R2', 'x', GROUND, 1e3);
      expectRejected(c, 'singular', 'U1');
    });
  });

  describe('unknown-element', () => {
    it('rejects a ccvs whose controlling element is not in the circuit, naming both', () => {
      // docs/building-circuits.md, introduction: controlling elements are checked when an analysis starts
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 1 })
        .resistor('R1', 'a', GROUND, 1e3)
        .ccvs('senseAmp', ['b', GROUND], 'sense', 100)
        .resistor('R2', 'b', GROUND, 1e3);
      const error = expectRejected(c, 'unknown-element', 'sense', 'senseAmp');
      expect(error.details).toMatchObject({ code: 'unknown-element', element: 'sense' });
    });

    it('rejects a cccs whose controlling element is not in the circuit', () => {
      // docs/building-circuits.md, introduction
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 1 })
        .resistor('R1', 'a', GROUND, 1e3)
        .cccs('mirror', [GROUND, 'b'], 'sense', 2)
        .resistor('R2', 'b', GROUND, 1e3);
      expectRejected(c, 'unknown-element', 'sense', 'mirror');
    });

    it.each([
      ['a resistor', (c: Circuit) => c.resistor('candidate', 'a', GROUND, 1e3)],
      ['a current source', (c: Circuit) => c.currentSource('candidate', GROUND, 'a', { dc: 1e-3 })],
      ['a capacitor', (c: Circuit) => c.capacitor('candidate', 'a', GROUND, 1e-9)],
      ['an op-amp', (c: Circuit) => c.opAmp('candidate', { plus: GROUND, minus: 'o', output: 'o' })],
    ])('rejects %s as the controlling element, as it has no current unknown', (_, add) => {
      // docs/building-circuits.md, "Elements": the controlling element is a voltage source, an inductor, a vcvs or a ccvs
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 1 })
        .resistor('R1', 'a', GROUND, 1e3);
      add(c);
      c.cccs('mirror', [GROUND, 'b'], 'candidate', 2).resistor('R2', 'b', GROUND, 1e3);
      expectRejected(c, 'unknown-element', 'candidate', 'mirror');
    });
  });

  describe('order of precedence: no-ground, then floating-node, then singular', () => {
    // docs/building-circuits.md, "Errors": where several apply, the first in this order is reported

    it('reports no-ground when the circuit also floats and has a voltage loop', () => {
      const c = new Circuit()
        .voltageSource('supply', 'a', 'b', { dc: 1 })
        .voltageSource('backup', 'a', 'b', { dc: 2 })
        .capacitor('C1', 'a', 'c', 1e-9);
      expectRejected(c, 'no-ground');
    });

    it('reports floating-node when the circuit also has a voltage loop', () => {
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 1 })
        .voltageSource('backup', 'a', GROUND, { dc: 2 })
        .capacitor('C1', 'a', 'c', 1e-9);
      expectRejected(c, 'floating-node', 'c');
    });

    it('reports floating-node when the loop comes before the floating node in the circuit', () => {
      const c = new Circuit()
        .inductor('L1', 'a', GROUND, 1e-3)
        .voltageSource('supply', 'a', GROUND, { dc: 1 })
        .currentSource('bias', 'a', 'c', { dc: 1e-3 });
      expectRejected(c, 'floating-node', 'c');
    });

    it('reports singular once the circuit is grounded and nothing floats', () => {
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 1 })
        .voltageSource('backup', 'a', GROUND, { dc: 2 })
        .capacitor('C1', 'a', 'c', 1e-9)
        .resistor('R1', 'c', GROUND, 1e3);
      expectRejected(c, 'singular', 'supply', 'backup');
    });
  });
});
