/**
 * Random circuits of resistors, sources, diodes, bipolar transistors, MOSFETs and op-amps either
 * solve, with Kirchhoff's current law checked from the terminal currents and no NaN anywhere in the
 * reports and cautions, or fail with a QuiescentError whose details name nodes or elements.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Circuit, operatingPoint, QuiescentError } from '../../src/index.js';
import { worstKcl } from '../support/kcl.js';

const NODES = ['gnd', 'a', 'b', 'c', 'd', 'e'] as const;
const node = fc.constantFrom(...NODES);

const element = fc.oneof(
  fc.record({
    kind: fc.constant('resistor'),
    a: node,
    b: node,
    value: fc.double({ min: 1, max: 6, noNaN: true }),
  }),
  fc.record({
    kind: fc.constant('voltage'),
    a: node,
    b: node,
    value: fc.double({ min: -15, max: 15, noNaN: true }),
  }),
  fc.record({
    kind: fc.constant('current'),
    a: node,
    b: node,
    value: fc.double({ min: -0.01, max: 0.01, noNaN: true }),
  }),
  fc.record({ kind: fc.constant('diode'), a: node, b: node, value: fc.constant(0) }),
  fc.record({ kind: fc.constant('npn'), a: node, b: node, c: node, value: fc.constant(0) }),
  fc.record({
    kind: fc.constant('nmos'),
    a: node,
    b: node,
    c: node,
    value: fc.double({ min: 0, max: 0.05, noNaN: true }),
  }),
  fc.record({ kind: fc.constant('opamp'), a: node, b: node, c: node, value: fc.constant(0) }),
);

type Spec = { kind: string; a: string; b: string; c?: string; value: number };

function build(specs: readonly Spec[]): Circuit {
  const c = new Circuit();
  specs.forEach((s, k) => {
    const v = Math.abs(s.value) < 1e-60 ? 0 : s.value;
    if (s.kind === 'resistor') c.resistor(`R${k}`, s.a, s.b, 10 ** s.value);
    else if (s.kind === 'voltage') c.voltageSource(`source${k}`, s.a, s.b, { dc: v });
    else if (s.kind === 'current') c.currentSource(`feed${k}`, s.a, s.b, { dc: v });
    else if (s.kind === 'diode') c.diode(`D${k}`, s.a, s.b);
    else if (s.kind === 'npn')
      c.bjt(`Q${k}`, { collector: s.a, base: s.b, emitter: s.c! }, { polarity: 'npn' });
    else if (s.kind === 'nmos')
      c.mosfet(
        `channel${k}`,
        { drain: s.a, gate: s.b, source: s.c! },
        { polarity: 'nmos', channelLengthModulation: v },
      );
    else c.opAmp(`U${k}`, { plus: s.a, minus: s.b, output: s.c! });
  });
  return c;
}

function hasNaN(value: unknown): boolean {
  if (typeof value === 'number') return Number.isNaN(value);
  if (value !== null && typeof value === 'object') return Object.values(value).some(hasNaN);
  return false;
}

describe('random circuits', () => {
  it('solve with KCL holding and no NaN, or fail with a code that names nodes or elements', () => {
    let solved = 0;
    fc.assert(
      fc.property(fc.array(element, { minLength: 2, maxLength: 9 }), (specs) => {
        let circuit: Circuit;
        try {
          circuit = build(specs as Spec[]);
        } catch (e) {
          // Builder refusals (an element between a node and itself, say) are fine if they are ours.
          if (!(e instanceof QuiescentError)) throw e;
          return;
        }
        try {
          const op = operatingPoint(circuit);
          solved++;
          const w = worstKcl(circuit, op, 1e-6);
          expect(Math.abs(w.imbalance), `KCL at '${w.node}'`).toBeLessThanOrEqual(1e-6 * w.scale + 1e-12);
          for (const n of op.nodes) expect(Number.isNaN(op.voltage(n))).toBe(false);
          for (const e of circuit.elements) {
            if (e.kind === 'diode' || e.kind === 'bjt' || e.kind === 'mosfet')
              expect(hasNaN(op.device(e.name))).toBe(false);
          }
          expect(hasNaN(op.cautions)).toBe(false);
        } catch (e) {
          if (!(e instanceof QuiescentError)) throw e;
          const d = e.details as {
            nodes?: readonly string[];
            elements?: readonly string[];
            devices?: readonly string[];
          };
          if (e.code === 'no-ground') return;
          if (e.code === 'no-convergence') {
            const details = e.details as { worstResiduals: readonly unknown[]; devices: readonly string[] };
            expect(details.worstResiduals.length).toBeGreaterThan(0);
            expect(details.devices.length).toBeGreaterThan(0);
          } else if (e.code === 'floating-node') {
            expect(d.nodes!.length).toBeGreaterThan(0);
          } else if (e.code === 'singular') {
            expect(d.elements!.length).toBeGreaterThan(0);
          } else if (e.code !== 'unknown-element') {
            throw e;
          }
          expect(e.message).not.toContain('NaN');
        }
      }),
      { seed: 23, numRuns: 400 },
    );
    // The generator must keep exercising the solver, not only the topology checks.
    expect(solved).toBeGreaterThan(40);
  });
});
