/**
 * Properties of the operating point on random diode-resistor networks. Such networks (positive
 * resistors, monotone diodes, one source) have exactly one solution (a monotone resistive network;
 * Duffin, "Nonlinear networks IIa", Bull. AMS 53, 1947), so every answer can be compared with any other.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Circuit, dcSweep, GROUND, operatingPoint } from '../../src/index.js';
import { worstKcl } from '../support/kcl.js';

/** A value the builder would reject as too small (below 1e-60 in magnitude) becomes 0. */
const flushTiny = (v: number): number => (Math.abs(v) < 1e-60 ? 0 : v);

type Part =
  | { kind: 'resistor'; a: number; b: number; resistance: number }
  | { kind: 'diode'; a: number; b: number; saturationCurrent: number; emissionCoefficient: number };

interface Network {
  nodes: number;
  supply: number;
  parts: Part[];
}

const nodeName = (k: number, nodes: number) => (k === nodes ? GROUND : `n${k}`);

/** Node 0 is driven by the source; a resistor chain 0 → 1 → … → ground keeps every node grounded. */
const network: fc.Arbitrary<Network> = fc.integer({ min: 1, max: 7 }).chain((nodes) =>
  fc.record({
    nodes: fc.constant(nodes),
    // Magnitudes below 1e-60 are rejected by the builder (docs/building-circuits.md, "Values"): they read as 0 here.
    supply: fc.double({ min: -20, max: 20, noNaN: true }).map(flushTiny),
    parts: fc
      .tuple(
        fc.array(fc.double({ min: 10, max: 1e5, noNaN: true }), { minLength: nodes, maxLength: nodes }),
        fc.array(
          fc.oneof(
            fc.record({
              kind: fc.constant('resistor' as const),
              a: fc.integer({ min: 0, max: nodes }),
              b: fc.integer({ min: 0, max: nodes }),
              resistance: fc.double({ min: 1, max: 1e6, noNaN: true }),
            }),
            fc.record({
              kind: fc.constant('diode' as const),
              a: fc.integer({ min: 0, max: nodes }),
              b: fc.integer({ min: 0, max: nodes }),
              saturationCurrent: fc.double({ min: 1e-16, max: 1e-9, noNaN: true }),
              emissionCoefficient: fc.double({ min: 1, max: 2, noNaN: true }),
            }),
          ),
          { minLength: 1, maxLength: 12 },
        ),
      )
      .map(([chain, extra]) => [
        ...chain.map((resistance, k): Part => ({ kind: 'resistor', a: k, b: k + 1, resistance })),
        ...extra.filter((p) => p.a !== p.b),
      ]),
  }),
);

/** Build the network, adding the parts in the order given by `order` (indices into parts). */
function build(
  net: Network,
  order: readonly number[] = net.parts.map((_, k) => k),
  supply = net.supply,
): Circuit {
  const c = new Circuit().voltageSource('supply', nodeName(0, net.nodes), GROUND, { dc: supply });
  for (const k of order) {
    const p = net.parts[k]!;
    const a = nodeName(p.a, net.nodes);
    const b = nodeName(p.b, net.nodes);
    if (p.kind === 'resistor') c.resistor(`R${k}`, a, b, p.resistance);
    else
      c.diode(`D${k}`, a, b, {
        saturationCurrent: p.saturationCurrent,
        emissionCoefficient: p.emissionCoefficient,
      });
  }
  return c;
}

/** Equal within the solver's tolerances (relative 1e-6 and 1 nV) with a margin. */
function expectSameVoltage(a: number, b: number, what: string): void {
  expect(Math.abs(a - b), `${what}: ${a} against ${b}`).toBeLessThanOrEqual(
    1e-5 * Math.max(Math.abs(a), Math.abs(b)) + 1e-8,
  );
}

describe('the operating point of random diode-resistor networks', () => {
  it('satisfies KCL at every node, judged from the terminal currents', () => {
    // Source: Kirchhoff's current law (Kirchhoff, 1845).
    fc.assert(
      fc.property(network, (net) => {
        const c = build(net);
        const w = worstKcl(c, operatingPoint(c), 1e-6);
        expect(Math.abs(w.imbalance), `node ${w.node}`).toBeLessThanOrEqual(1e-6 * w.scale + 1e-12);
      }),
      { numRuns: 60 },
    );
  });

  it('does not depend on the order in which the elements were added', () => {
    // The solution is unique (Duffin 1947), so the order of the equations cannot matter.
    fc.assert(
      fc.property(
        network.chain((net) =>
          fc.tuple(
            fc.constant(net),
            fc.shuffledSubarray(
              net.parts.map((_, k) => k),
              { minLength: net.parts.length },
            ),
          ),
        ),
        ([net, order]) => {
          const a = operatingPoint(build(net));
          const b = operatingPoint(build(net, order));
          for (let k = 0; k < net.nodes; k++)
            expectSameVoltage(a.voltage(`n${k}`), b.voltage(`n${k}`), `node n${k}`);
          expectSameVoltage(a.current('supply'), b.current('supply'), 'supply current');
        },
      ),
      { numRuns: 40 },
    );
  });

  it('gives the same answer by continuation as by independent solves at each sweep point', () => {
    // Uniqueness again (Duffin 1947): a warm start cannot lead to another solution.
    fc.assert(
      fc.property(
        network,
        fc.array(fc.double({ min: -20, max: 20, noNaN: true }).map(flushTiny), {
          minLength: 1,
          maxLength: 6,
        }),
        (net, values) => {
          const sweep = dcSweep(build(net), { source: 'supply', values });
          for (let k = 0; k < net.nodes; k++) {
            const swept = sweep.voltage(`n${k}`);
            values.forEach((v, j) => {
              expectSameVoltage(
                swept[j]!,
                operatingPoint(build(net, undefined, v)).voltage(`n${k}`),
                `n${k} at ${v} V`,
              );
            });
          }
        },
      ),
      { numRuns: 30 },
    );
  });
});
