import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, type OperatingPoint, operatingPoint } from '../../src/index.js';

/** A value the builder would reject as too small (below 1e-60 in magnitude) becomes 0. */
const flushTiny = (v: number): number => (Math.abs(v) < 1e-60 ? 0 : v);

/**
 * Laws every DC solution of a random connected resistor network with sources must obey, whatever
 * its values: Kirchhoff's current law at every node and Tellegen's theorem (the branch powers sum to
 * zero when every branch takes the passive sign convention) — B. D. H. Tellegen, "A general network
 * theorem, with applications", Philips Research Reports 7, 1952, pp. 259–269, and C. A. Desoer and
 * E. S. Kuh, Basic Circuit Theory, 1969, ch. 9 (from memory). The solution is a property of the
 * network, not of the order its elements were listed in or of its JSON form (common practice, no
 * source).
 */

/** One element of a random network, in the form the builder takes. */
type Branch =
  | { kind: 'resistor'; name: string; a: string; b: string; value: number }
  | { kind: 'voltage-source'; name: string; a: string; b: string; value: number }
  | { kind: 'current-source'; name: string; a: string; b: string; value: number };

/** Node k of a network with `count` nodes; node 0 is ground. */
const nodeName = (k: number): string => (k === 0 ? GROUND : `n${k}`);

/**
 * A connected network on 2 to 7 nodes: a spanning tree of resistors (so every node has a DC path to
 * ground), extra resistors, voltage sources placed so that no loop is made of sources alone, and
 * current sources anywhere.
 */
const network: fc.Arbitrary<Branch[]> = fc
  .integer({ min: 2, max: 7 })
  .chain((count) => {
    const node = fc.integer({ min: 0, max: count - 1 });
    const resistance = fc.double({ min: 1, max: 5, noNaN: true }).map((e) => 10 ** e); // 10 Ω … 100 kΩ
    // Magnitudes below 1e-60 are rejected by the builder (docs/building-circuits.md, "Values"): they read as 0 here.
    const volts = fc.double({ min: -20, max: 20, noNaN: true, noDefaultInfinity: true }).map(flushTiny);
    const amps = fc.double({ min: -0.01, max: 0.01, noNaN: true, noDefaultInfinity: true }).map(flushTiny);
    const edge = fc.tuple(node, node).filter(([a, b]) => a !== b);
    return fc.record({
      count: fc.constant(count),
      // tree[k − 1] is the parent of node k among nodes 0 … k − 1
      tree: fc.tuple(...Array.from({ length: count - 1 }, (_, i) => fc.integer({ min: 0, max: i }))),
      treeResistances: fc.array(resistance, { minLength: count - 1, maxLength: count - 1 }),
      extraResistors: fc.array(fc.tuple(edge, resistance), { maxLength: 6 }),
      voltageSources: fc.array(fc.tuple(edge, volts), { minLength: 1, maxLength: 3 }),
      currentSources: fc.array(fc.tuple(edge, amps), { maxLength: 3 }),
    });
  })
  .map(({ count, tree, treeResistances, extraResistors, voltageSources, currentSources }) => {
    const branches: Branch[] = [];
    tree.forEach((parent, i) => {
      branches.push({
        kind: 'resistor',
        name: `Rt${i}`,
        a: nodeName(i + 1),
        b: nodeName(parent),
        value: treeResistances[i]!,
      });
    });
    extraResistors.forEach(([[a, b], r], i) => {
      branches.push({ kind: 'resistor', name: `Rx${i}`, a: nodeName(a), b: nodeName(b), value: r });
    });
    // A voltage source that would close a loop of sources is left out (union-find over nodes).
    const root = Array.from({ length: count }, (_, k) => k);
    const find = (k: number): number => (root[k] === k ? k : find(root[k]!));
    voltageSources.forEach(([[a, b], v], i) => {
      const [ra, rb] = [find(a), find(b)];
      if (ra === rb) return;
      root[ra] = rb;
      branches.push({ kind: 'voltage-source', name: `source${i}`, a: nodeName(a), b: nodeName(b), value: v });
    });
    currentSources.forEach(([[a, b], i0], i) => {
      branches.push({ kind: 'current-source', name: `feed${i}`, a: nodeName(a), b: nodeName(b), value: i0 });
    });
    return branches;
  });

/** Build the circuit, adding the branches in the order given. */
function build(branches: readonly Branch[]): Circuit {
  const c = new Circuit();
  for (const e of branches) {
    if (e.kind === 'resistor') c.resistor(e.name, e.a, e.b, e.value);
    else if (e.kind === 'voltage-source') c.voltageSource(e.name, e.a, e.b, { dc: e.value });
    else c.currentSource(e.name, e.a, e.b, { dc: e.value });
  }
  return c;
}

/** The largest branch current, as the scale for absolute tolerances on sums of currents. */
function currentScale(op: OperatingPoint, branches: readonly Branch[]): number {
  return Math.max(1e-6, ...branches.map((e) => Math.abs(op.current(e.name))));
}

/** The largest node voltage, as the scale for voltage comparisons. */
function voltageScale(op: OperatingPoint, c: Circuit): number {
  return Math.max(1e-3, ...c.nodes.map((n) => Math.abs(op.voltage(n))));
}

const RUNS = { numRuns: 100 };

describe('random linear resistor networks with sources', () => {
  it('obey Kirchhoff’s current law at every node, from the element currents', () => {
    // Kirchhoff's current law; every element current flows from its first node to its second
    // (docs/building-circuits.md, "Sign conventions")
    fc.assert(
      fc.property(network, (branches) => {
        const c = build(branches);
        const op = operatingPoint(c);
        const scale = currentScale(op, branches);
        for (const node of c.nodes) {
          let leaving = 0;
          for (const e of branches) {
            if (e.a === node) leaving += op.current(e.name);
            if (e.b === node) leaving -= op.current(e.name);
          }
          expect(Math.abs(leaving), `KCL at ${node}`).toBeLessThan(1e-9 * scale);
        }
      }),
      RUNS,
    );
  });

  it('obey Tellegen’s theorem: the sum of v·i over all elements is zero', () => {
    // Tellegen, 1952; every element current here follows the passive sign convention
    // (docs/building-circuits.md, "Sign conventions")
    fc.assert(
      fc.property(network, (branches) => {
        const c = build(branches);
        const op = operatingPoint(c);
        let power = 0;
        let magnitude = 0;
        for (const e of branches) {
          const p = op.voltage(e.a, e.b) * op.current(e.name);
          power += p;
          magnitude += Math.abs(p);
        }
        expect(Math.abs(power)).toBeLessThanOrEqual(1e-9 * Math.max(magnitude, 1e-12));
      }),
      RUNS,
    );
  });

  it('have a solution independent of the order the elements were added in', () => {
    // common practice, no source: the equations are the same up to a permutation
    fc.assert(
      fc.property(
        network.chain((branches) =>
          fc.tuple(fc.constant(branches), fc.shuffledSubarray(branches, { minLength: branches.length })),
        ),
        ([branches, shuffled]) => {
          const c = build(branches);
          const a = operatingPoint(c);
          const b = operatingPoint(build(shuffled));
          const vScale = voltageScale(a, c);
          for (const node of c.nodes) {
            expect(Math.abs(b.voltage(node) - a.voltage(node)), `v(${node})`).toBeLessThan(1e-9 * vScale);
          }
          const iScale = currentScale(a, branches);
          for (const e of branches) {
            expect(Math.abs(b.current(e.name) - a.current(e.name)), `i(${e.name})`).toBeLessThan(
              1e-9 * iScale,
            );
          }
        },
      ),
      RUNS,
    );
  });

  it('have the same solution after a JSON round trip', () => {
    // ECMA-404, 2017: JSON numbers carry doubles exactly through JSON.stringify and JSON.parse
    fc.assert(
      fc.property(network, (branches) => {
        const c = build(branches);
        const rebuilt = Circuit.fromJSON(JSON.parse(JSON.stringify(c.toJSON())));
        expect(rebuilt.toJSON()).toEqual(c.toJSON());
        const a = operatingPoint(c);
        const b = operatingPoint(rebuilt);
        for (const node of c.nodes) expect(b.voltage(node)).toBe(a.voltage(node));
        for (const e of branches) expect(b.current(e.name)).toBe(a.current(e.name));
      }),
      RUNS,
    );
  });
});
