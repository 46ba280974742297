/**
 * Invariants of the noise analysis on random circuits: the contributions' powers add up to the
 * total (uncorrelated generators, docs/noise.md "Assumptions"), and the transfer the one transposed
 * solve gives each generator equals the response of a direct solve with that generator alone (the
 * adjoint identity cᵀ·A⁻¹·b = (A⁻ᵀ·c)ᵀ·b; e.g. S. W. Director and R. A. Rohrer, "The generalized
 * adjoint network and network sensitivities", IEEE Trans. Circuit Theory 16, 1969).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Probe } from '../../src/analysis/ac-analysis.js';
import { AcWorkspace } from '../../src/analysis/ac-workspace.js';
import { probeReader } from '../../src/analysis/distortion-probe.js';
import { Circuit, GROUND, noise, type OperatingPoint, operatingPoint } from '../../src/index.js';

/** A random network: a chain of nodes with random resistors, capacitors, a diode, an op-amp and a bipolar stage. */
const circuitCase = fc
  .record({
    nodes: fc.integer({ min: 2, max: 7 }),
    resistors: fc.array(fc.tuple(fc.nat(), fc.nat(), fc.double({ min: 10, max: 1e6, noNaN: true })), {
      minLength: 1,
      maxLength: 10,
    }),
    capacitors: fc.array(fc.tuple(fc.nat(), fc.nat(), fc.double({ min: 1e-12, max: 1e-6, noNaN: true })), {
      maxLength: 4,
    }),
    withDiode: fc.boolean(),
    withOpAmp: fc.boolean(),
    withTransistor: fc.boolean(),
    output: fc.nat(),
    currentOutput: fc.boolean(),
  })
  .map((spec) => {
    const name = (k: number) => (k % (spec.nodes + 1) === spec.nodes ? GROUND : `n${k % (spec.nodes + 1)}`);
    const c = new Circuit().voltageSource('supply', 'n0', GROUND, { dc: 3, ac: 1 });
    // A chain to ground keeps every node on a DC path.
    for (let k = 0; k < spec.nodes; k++)
      c.resistor(`chain${k}`, `n${k}`, k + 1 === spec.nodes ? GROUND : `n${k + 1}`, 1e3 * (k + 1));
    spec.resistors.forEach(([a, b, r], k) => {
      if (name(a) !== name(b)) c.resistor(`R${k}`, name(a), name(b), r);
    });
    spec.capacitors.forEach(([a, b, value], k) => {
      if (name(a) !== name(b)) c.capacitor(`C${k}`, name(a), name(b), value);
    });
    if (spec.withDiode) c.diode('D1', 'n1', GROUND, { flickerCoefficient: 1e-15, seriesResistance: 20 });
    if (spec.withOpAmp) {
      c.opAmp(
        'U1',
        { plus: 'n1', minus: 'fb', output: 'amp' },
        {
          openLoopGain: 1e4,
          gainBandwidth: 1e6,
          inputNoiseVoltage: 5e-9,
          inputNoiseCurrent: 1e-12,
          voltageNoiseCorner: 30,
        },
      );
      c.resistor('Rf', 'amp', 'fb', 10e3).resistor('Rg', 'fb', GROUND, 1e3);
    }
    if (spec.withTransistor) {
      c.voltageSource('rail', 'vcc', GROUND, { dc: 9 })
        .resistor('Rb', 'vcc', 'base', 1e6)
        .resistor('Rc', 'vcc', 'coll', 4.7e3)
        .capacitor('Ccouple', 'n1', 'base', 1e-6)
        .bjt(
          'Q1',
          { collector: 'coll', base: 'base', emitter: GROUND },
          { polarity: 'npn', flickerCoefficient: 1e-14 },
        );
    }
    const nodeOutput = name(spec.output) === GROUND ? 'n1' : name(spec.output);
    const output: Probe = spec.currentOutput ? { element: 'chain0' } : nodeOutput;
    return { circuit: c, output };
  });

const FREQUENCIES = [3, 1e3, 2e5];

/** The output density² of each generator, found with one direct solve per generator. */
function directPowers(op: OperatingPoint, output: Probe, f: number): Map<string, number> {
  const system = op.system;
  const n = system.n;
  const workspace = new AcWorkspace(op);
  workspace.factorAt(f);
  const omega = 2 * Math.PI * f;
  const read = probeReader(system, op, output, false);
  const xr = new Float64Array(n + 1);
  const xi = new Float64Array(n + 1);
  const offset = new Float64Array(2);
  read(xr, xi, omega, offset); // an element's reading with no excitation at all (a source's own value)
  const value = new Float64Array(2);
  const weight = new Float64Array(2);
  const powers = new Map<string, number>();
  const outputElement = typeof output === 'object' && 'element' in output ? output.element : undefined;
  for (const device of system.devices) {
    for (const g of device.noiseGenerators?.(op.x, op.conditions) ?? []) {
      xr.fill(0);
      xi.fill(0);
      g.weightAt?.(omega, weight);
      const [wr, wi] = g.weightAt === undefined ? [1, 0] : [weight[0]!, weight[1]!];
      xr[g.from]! -= wr;
      xi[g.from]! -= wi;
      xr[g.to]! += wr;
      xi[g.to]! += wi;
      workspace.solve(xr, xi);
      read(xr, xi, omega, value);
      let re = value[0]! - offset[0]!;
      const im = value[1]! - offset[1]!;
      if (g.ownCurrent === true && device.name === outputElement) re += 1;
      const key = `${device.name}/${g.mechanism}/${g.terminal ?? ''}`;
      powers.set(key, (re * re + im * im) * (g.white + g.flicker / f));
    }
  }
  return powers;
}

describe('noise on random circuits', () => {
  it('has contributions whose powers add up to the total at every frequency', () => {
    fc.assert(
      fc.property(circuitCase, ({ circuit, output }) => {
        const nz = noise(operatingPoint(circuit), { output, frequencies: FREQUENCIES });
        FREQUENCIES.forEach((_, k) => {
          let sum = 0;
          for (const c of nz.contributions) sum += c.density[k]! ** 2;
          const total = nz.outputDensity[k]! ** 2;
          expect(Math.abs(sum - total)).toBeLessThanOrEqual(1e-12 * total);
        });
        // Ranked by total power over the analysed frequencies.
        const totals = nz.contributions.map((c) => c.density.reduce((s, d) => s + d * d, 0));
        for (let i = 1; i < totals.length; i++) expect(totals[i]!).toBeLessThanOrEqual(totals[i - 1]!);
      }),
      { numRuns: 40, seed: 1313 },
    );
  });

  it('gives each generator the transfer a direct solve with that generator alone gives', () => {
    fc.assert(
      fc.property(circuitCase, ({ circuit, output }) => {
        const op = operatingPoint(circuit);
        const nz = noise(op, { output, frequencies: FREQUENCIES });
        FREQUENCIES.forEach((f, k) => {
          const direct = directPowers(op, output, f);
          expect(direct.size).toBe(nz.contributions.length);
          const scale = nz.outputDensity[k]! ** 2;
          for (const c of nz.contributions) {
            const expected = direct.get(`${c.element}/${c.mechanism}/${c.terminal ?? ''}`)!;
            expect(Math.abs(c.density[k]! ** 2 - expected)).toBeLessThanOrEqual(
              1e-9 * Math.max(expected, 1e-6 * scale),
            );
          }
        });
      }),
      { numRuns: 40, seed: 2626 },
    );
  });
});
