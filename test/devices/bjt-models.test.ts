import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import knee from '../reference/bjt-knee.json';
import { expectRelativelyClose } from '../support/close.js';

/** Element values below 1e-60 are refused at the boundary (docs/analyses.md, "Arguments"): draw 0 instead. */
const noSubnormal = (v: number): number => (Math.abs(v) < 1e-30 ? 0 : v);

const T = 298.15;
/** The references have no parallel junction conductance: make the library's negligible. */
const BARE = { temperature: T, junctionConductance: 1e-30 };
const VT = (1.380649e-23 * T) / 1.602176634e-19;

/** The transport model of docs/devices.md ("Bipolar transistor"), npn, written out independently. */
function transport(vbe: number, vbc: number, is: number, betaF: number, betaR: number) {
  const ef = Math.exp(vbe / VT);
  const er = Math.exp(vbc / VT);
  return {
    ic: is * (ef - er) - (is / betaR) * (er - 1),
    ib: (is / betaF) * (ef - 1) + (is / betaR) * (er - 1),
  };
}

describe('bipolar terminal resistances', () => {
  const [rb, rc, re] = [250, 15, 3.3];
  const [VB, VC] = [0.82, 4];
  const model = {
    polarity: 'npn' as const,
    baseResistance: rb,
    collectorResistance: rc,
    emitterResistance: re,
  };
  const circuit = new Circuit()
    .voltageSource('drive', 'b', GROUND, { dc: VB })
    .voltageSource('supply', 'c', GROUND, { dc: VC })
    .bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, model);

  it('solve the internal junctions as an exact Newton solve of the three internal nodes does', () => {
    // Kirchhoff at the internal base, collector and emitter with the transport model (Ebers and Moll,
    // Proc. IRE 42, 1954): (VB − b)/rb = ib, (VC − c)/rc = ic, e/re = ic + ib; solved here by Newton
    // with an analytic Jacobian in the test itself (common practice, no source).
    let [b, c, e] = [0.7, VC, 0];
    for (let k = 0; k < 200; k++) {
      const f = (bb: number, cc: number, ee: number) => {
        const { ic, ib } = transport(bb - ee, bb - cc, 1e-15, 100, 1);
        return [(VB - bb) / rb - ib, (VC - cc) / rc - ic, ee / re - ic - ib];
      };
      const r = f(b, c, e);
      const h = 1e-9;
      const J = [0, 1, 2].map((j) => {
        const p = [b, c, e];
        p[j]! += h;
        const rp = f(p[0]!, p[1]!, p[2]!);
        return rp.map((v, i) => (v - r[i]!) / h);
      });
      // Solve J^T-indexed 3×3 system by Cramer's rule: columns J[j], rows i.
      const m = (i: number, j: number) => J[j]![i]!;
      const det = (a: number[][]) =>
        a[0]![0]! * (a[1]![1]! * a[2]![2]! - a[1]![2]! * a[2]![1]!) -
        a[0]![1]! * (a[1]![0]! * a[2]![2]! - a[1]![2]! * a[2]![0]!) +
        a[0]![2]! * (a[1]![0]! * a[2]![1]! - a[1]![1]! * a[2]![0]!);
      const A = [0, 1, 2].map((i) => [0, 1, 2].map((j) => m(i, j)));
      const d = det(A);
      const step = [0, 1, 2].map(
        (j) => det(A.map((row, i) => row.map((v, jj) => (jj === j ? -r[i]! : v)))) / d,
      );
      b += Math.max(-0.05, Math.min(0.05, step[0]!));
      c += step[1]!;
      e += Math.max(-0.05, Math.min(0.05, step[2]!));
    }
    const report = operatingPoint(circuit, BARE).bjt('Q1');
    const expected = transport(b - e, b - c, 1e-15, 100, 1);
    expectRelativelyClose(report.ic, expected.ic, 1e-9, 'collector current');
    expectRelativelyClose(report.ib, expected.ib, 1e-9, 'base current');
    expectRelativelyClose(report.internalVbe, b - e, 1e-10, 'internal vbe');
    expectRelativelyClose(report.internalVbc, b - c, 1e-10, 'internal vbc');
    expect(report.vbe).toBe(VB);
    expect(report.vce).toBe(VC);
  });

  it('give the small-signal parameters of the internal junctions', () => {
    // The same transistor without resistances, biased at the internal voltages, has the same gm and rpi.
    const op = operatingPoint(circuit, { temperature: T });
    const q = op.bjt('Q1');
    const bare = operatingPoint(
      new Circuit()
        .voltageSource('drive', 'b', GROUND, { dc: q.internalVbe })
        .voltageSource('supply', 'c', GROUND, { dc: q.internalVbe - q.internalVbc })
        .bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, { polarity: 'npn' }),
      { temperature: T },
    ).bjt('Q1');
    expectRelativelyClose(q.gm, bare.gm, 1e-9, 'gm');
    expectRelativelyClose(q.rpi, bare.rpi, 1e-9, 'rpi');
    expectRelativelyClose(q.ic, bare.ic, 1e-9, 'ic');
  });

  it('equal explicit resistors around a resistance-free transistor', () => {
    const explicit = new Circuit()
      .voltageSource('drive', 'b', GROUND, { dc: VB })
      .voltageSource('supply', 'c', GROUND, { dc: VC })
      .resistor('rb', 'b', 'bi', rb)
      .resistor('rc', 'c', 'ci', rc)
      .resistor('re', 'ei', GROUND, re)
      .bjt('Q1', { collector: 'ci', base: 'bi', emitter: 'ei' }, { polarity: 'npn' });
    const a = operatingPoint(circuit, { temperature: T }).bjt('Q1');
    const b = operatingPoint(explicit, { temperature: T }).bjt('Q1');
    expectRelativelyClose(a.ic, b.ic, 1e-9, 'ic');
    expectRelativelyClose(a.internalVbe, b.vbe, 1e-9, 'internal vbe');
  });
});

describe('the knee current of high injection', () => {
  it('matches the Gummel-Poon forward charge solved offline (emitter-degenerated stage)', () => {
    // Source: test/reference/bjt-knee.py, mpmath.findroot at 50 digits on the equations of
    // docs/devices.md (H. K. Gummel and H. C. Poon, Bell Syst. Tech. J. 49, 1970).
    for (const c of knee.cases) {
      const op = operatingPoint(
        new Circuit()
          .voltageSource('drive', 'b', GROUND, { dc: c.baseVoltage })
          .voltageSource('supply', 'c', GROUND, { dc: knee.supply })
          .resistor('Re', 'e', GROUND, knee.emitterResistance)
          .bjt(
            'Q1',
            { collector: 'c', base: 'b', emitter: 'e' },
            { polarity: 'npn', kneeCurrent: knee.kneeCurrent },
          ),
        BARE,
      );
      const q = op.bjt('Q1');
      expectRelativelyClose(q.ic, c.collectorCurrent, 1e-9, `ic at VB = ${c.baseVoltage}`);
      expectRelativelyClose(q.ib, c.baseCurrent, 1e-9, `ib at VB = ${c.baseVoltage}`);
      expectRelativelyClose(q.ic / q.ib, c.beta, 1e-9, `beta at VB = ${c.baseVoltage}`);
    }
    // β falls from about 100 to well below it above the knee.
    expect(knee.cases[knee.cases.length - 1]!.beta).toBeLessThan(30);
  });
});

describe('the temperature exponent of β', () => {
  it('scales βF by (T/Tref)^exponent', () => {
    // docs/devices.md, "Bipolar transistor": βF(T) = βF·(T/Tref)^exponent; at 360 K with exponent 1.5.
    const bias = (temperature: number) =>
      operatingPoint(
        new Circuit()
          .voltageSource('drive', 'b', GROUND, { dc: 0.6 })
          .voltageSource('supply', 'c', GROUND, { dc: 0.6 })
          .bjt(
            'Q1',
            { collector: 'c', base: 'b', emitter: GROUND },
            {
              polarity: 'npn',
              betaTemperatureExponent: 1.5,
              reverseBeta: 2,
              referenceTemperature: 300,
            },
          ),
        { temperature, junctionConductance: 1e-30 },
      ).bjt('Q1');
    // With vbc = 0 the reverse terms vanish: ic/ib = βF(T)·(e_f − 1)/(e_f − 1) exactly.
    expectRelativelyClose(bias(300).ic / bias(300).ib, 100, 1e-12, 'β at Tref');
    expectRelativelyClose(bias(360).ic / bias(360).ib, 100 * 1.2 ** 1.5, 1e-12, 'β at 360 K');
  });
});

describe('the diffusion capacitance cpi', () => {
  it('is never negative in any region (property)', () => {
    // docs/devices.md: cpi = Cbe(vbe) + τF·∂(I_S·e_f/q_h)/∂vbe, non-negative by construction.
    fc.assert(
      fc.property(
        fc.double({ min: -3, max: 1.1, noNaN: true }).map(noSubnormal),
        fc.double({ min: -3, max: 1.1, noNaN: true }).map(noSubnormal),
        fc.double({ min: 1e-12, max: 1e-8, noNaN: true }),
        fc.constantFrom(Number.POSITIVE_INFINITY, 1e-3, 0.1),
        fc.constantFrom(Number.POSITIVE_INFINITY, 5, 50),
        fc.constantFrom<'npn' | 'pnp'>('npn', 'pnp'),
        (vbe, vbc, tau, kneeCurrent, earlyVoltage, polarity) => {
          const s = polarity === 'npn' ? 1 : -1;
          const q = operatingPoint(
            new Circuit()
              .voltageSource('drive', 'b', GROUND, { dc: s * vbe })
              .voltageSource('supply', 'c', GROUND, { dc: s * (vbe - vbc) })
              .bjt(
                'Q1',
                { collector: 'c', base: 'b', emitter: GROUND },
                {
                  polarity,
                  forwardTransitTime: tau,
                  kneeCurrent,
                  earlyVoltage,
                  baseEmitterCapacitance: '1p',
                },
              ),
          ).bjt('Q1');
          return q.cpi >= 0;
        },
      ),
      { seed: 1616, numRuns: 150 },
    );
  });

  it('equals τF times the slope of the forward transport current I_S·e_f/q_h', () => {
    // Central difference of I_S·e_f/q_h at vbe = 0.75 V, knee 2 mA, in saturation (vbc = 0.6 V) where
    // the old τF·gm rule failed (common practice, no source).
    const [is, ik, tau] = [1e-15, 2e-3, 1e-9];
    const forward = (v: number) => {
      const e = Math.exp(v / VT);
      return (is * e) / (0.5 * (1 + Math.sqrt(1 + (4 * is * (e - 1)) / ik)));
    };
    const h = 1e-6;
    const expected = (tau * (forward(0.75 + h) - forward(0.75 - h))) / (2 * h);
    const q = operatingPoint(
      new Circuit()
        .voltageSource('drive', 'b', GROUND, { dc: 0.75 })
        .voltageSource('supply', 'c', GROUND, { dc: 0.15 })
        .bjt(
          'Q1',
          { collector: 'c', base: 'b', emitter: GROUND },
          {
            polarity: 'npn',
            forwardTransitTime: tau,
            kneeCurrent: ik,
            earlyVoltage: 20,
          },
        ),
      { temperature: T },
    ).bjt('Q1');
    expect(q.region).toBe('saturation');
    expectRelativelyClose(q.cpi, expected, 1e-7, 'cpi in saturation');
  });
});

describe('the knee current in the nonlinear currents', () => {
  it('gives the exact second and third derivatives of the collector current in vbe', () => {
    // Central differences of ic(vbe) at vbc = −2 V, V_A = 40 V, knee 1 mA near the knee (common
    // practice, no source): five-point stencils, step 0.5 mV (second) and 2 mV (third).
    const collector = (vbe: number) => operatingPoint(stage(vbe), BARE).bjt('Q1').ic;
    const stage = (vbe: number) =>
      new Circuit()
        .voltageSource('drive', 'b', GROUND, { dc: vbe })
        .voltageSource('supply', 'c', GROUND, { dc: vbe + 2 })
        .bjt(
          'Q1',
          { collector: 'c', base: 'b', emitter: GROUND },
          { polarity: 'npn', kneeCurrent: 1e-3, earlyVoltage: 40 },
        );
    const v = 0.75;
    const op = operatingPoint(stage(v), BARE);
    const currents = op.system.deviceByName.get('Q1')!.nonlinearCurrents!(op.x, op.conditions);
    // Collector-to-emitter currents are the forward (0) and reverse (2) transport; their uu entries.
    const second = currents[0]!.second[0]! + currents[2]!.second[0]!;
    const third = currents[0]!.third[0]! + currents[2]!.third[0]!;
    const h2 = 5e-4;
    const f = (k: number, h: number) => collector(v + k * h);
    const d2 = (-f(2, h2) + 16 * f(1, h2) - 30 * f(0, h2) + 16 * f(-1, h2) - f(-2, h2)) / (12 * h2 * h2);
    const h3 = 2e-3;
    const d3 =
      (-f(3, h3) + 8 * f(2, h3) - 13 * f(1, h3) + 13 * f(-1, h3) - 8 * f(-2, h3) + f(-3, h3)) / (8 * h3 ** 3);
    expectRelativelyClose(second, d2, 1e-5, '∂²ic/∂vbe²');
    expectRelativelyClose(third, d3, 1e-3, '∂³ic/∂vbe³');
  });
});
