/**
 * The small-signal AC analysis on passive circuits, checked against the closed forms of circuit theory:
 * first-order RC filters, series and parallel RLC resonance, element currents, reciprocity, and the
 * checks on the frequencies and on singular small-signal circuits.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { logSweep } from '../../src/analysis/frequency-grid.js';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

const DEG = 180 / Math.PI;

describe('acAnalysis on first-order RC filters', () => {
  // R = 1.5 kΩ, C = 47 nF: f_c = 1/(2πRC) ≈ 2.258 kHz.
  const R = 1.5e3;
  const C = 47e-9;
  const fc0 = 1 / (2 * Math.PI * R * C);
  const frequencies = [fc0 / 10, fc0, 10 * fc0];

  it('gives a low-pass magnitude 1/√(1+u²) and phase −atan(u) at f_c/10, f_c and 10·f_c', () => {
    // Source: H(jω) = 1/(1 + jωRC), e.g. A. S. Sedra and K. C. Smith, "Microelectronic Circuits",
    // single-time-constant networks (from memory).
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .resistor('R1', 'in', 'out', R)
      .capacitor('C1', 'out', GROUND, C);
    const ac = acAnalysis(operatingPoint(c), { frequencies });
    const db = ac.magnitudeDb('out', 'in');
    const phase = ac.phaseDegrees('out', 'in');
    [0.1, 1, 10].forEach((u, k) => {
      expectRelativelyClose(db[k]!, -10 * Math.log10(1 + u * u), 1e-12, `low-pass dB at u = ${u}`);
      expectRelativelyClose(phase[k]!, -Math.atan(u) * DEG, 1e-12, `low-pass phase at u = ${u}`);
    });
    // The named values at the corner: −3.0103 dB and −45°.
    expect(db[1]!).toBeCloseTo(-3.0103, 4);
    expect(phase[1]!).toBeCloseTo(-45, 10);
  });

  it('gives a high-pass magnitude u/√(1+u²) and phase 90° − atan(u)', () => {
    // Source: H(jω) = jωRC/(1 + jωRC), same reference as the low-pass.
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .capacitor('C1', 'in', 'out', C)
      .resistor('R1', 'out', GROUND, R);
    const ac = acAnalysis(operatingPoint(c), { frequencies });
    const db = ac.magnitudeDb('out', 'in');
    const phase = ac.phaseDegrees('out', 'in');
    [0.1, 1, 10].forEach((u, k) => {
      const expectedDb = 20 * Math.log10(u) - 10 * Math.log10(1 + u * u);
      expectRelativelyClose(db[k]!, expectedDb, 1e-12, `high-pass dB at u = ${u}`);
      expectRelativelyClose(phase[k]!, 90 - Math.atan(u) * DEG, 1e-12, `high-pass phase at u = ${u}`);
    });
  });

  it('reads the source amplitude and phase as a peak phasor', () => {
    // Source: phasor of a source of magnitude M and phase φ is M·e^{jφ} (docs/building-circuits.md, "Sources and
    // their AC excitation": peak phasors, degrees); the divider H = 1/(1 + jωRC) then scales it.
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: { magnitude: 2.5, phase: 30 } })
      .resistor('R1', 'in', 'out', R)
      .capacitor('C1', 'out', GROUND, C);
    const ac = acAnalysis(operatingPoint(c), { frequencies: [fc0] });
    const vin = ac.voltage('in')[0]!;
    expectRelativelyClose(vin.abs(), 2.5, 1e-14, '|voltage at in|');
    expectRelativelyClose(vin.arg() * DEG, 30, 1e-13, 'arg voltage at in');
    const vout = ac.voltage('out')[0]!;
    expectRelativelyClose(vout.abs(), 2.5 / Math.SQRT2, 1e-13, '|voltage at out| at f_c');
    expectRelativelyClose(vout.arg() * DEG, -15, 1e-12, 'arg voltage at out at f_c');
  });

  it('finds the −3 dB frequency of the low-pass by interpolation', () => {
    // Source: f_c = 1/(2πRC) (Sedra and Smith, from memory). The accessor interpolates linearly in dB
    // against log f, so on 100 points per decade it lands within 1e-4 of f_c.
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .resistor('R1', 'in', 'out', R)
      .capacitor('C1', 'out', GROUND, C);
    const ac = acAnalysis(operatingPoint(c), { frequencies: logSweep(10, 1e6, 100) });
    const cutoffs = ac.cutoffFrequencies('out', 'in');
    expect(cutoffs).toHaveLength(1);
    expectRelativelyClose(cutoffs[0]!, fc0, 1e-4, 'low-pass cutoff');
    // A level the response never reaches inside the sweep gives an empty list.
    expect(ac.cutoffFrequencies('out', 'in', { dropDb: 200 })).toEqual([]);
  });
});

describe('acAnalysis on RLC resonance', () => {
  // Source for this block: resonance f0 = 1/(2π√(LC)); series Q = √(L/C)/R; parallel Q = R·√(C/L);
  // half-power bandwidth f0/Q with half-power frequencies f0·(√(1 + 1/(4Q²)) ± 1/(2Q)).
  // J. W. Nilsson and S. A. Riedel, "Electric Circuits", chapter on resonant circuits (from memory).
  const L = 10e-3;
  const C = 100e-9;
  const f0 = 1 / (2 * Math.PI * Math.sqrt(L * C));
  const halfPower = (q: number) => {
    const a = Math.sqrt(1 + 1 / (4 * q * q));
    return [f0 * (a - 1 / (2 * q)), f0 * (a + 1 / (2 * q))] as const;
  };

  it('puts a series RLC band-pass peak at f0 with bandwidth f0/Q', () => {
    const R = 50; // Q = √(L/C)/R = 316.2/50 ≈ 6.32
    const q = Math.sqrt(L / C) / R;
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .inductor('L1', 'in', 'a', L)
      .capacitor('C1', 'a', 'out', C)
      .resistor('R1', 'out', GROUND, R);
    const ac = acAnalysis(operatingPoint(c), { frequencies: logSweep(f0 / 10, f0 * 10, 2000) });
    // At resonance the reactances cancel: the whole source appears across R, with zero phase.
    const atF0 = acAnalysis(operatingPoint(c), { frequencies: [f0] });
    expectRelativelyClose(atF0.gain('out', 'in')[0]!.abs(), 1, 1e-12, '|H(f0)|');
    expect(Math.abs(atF0.phaseDegrees('out', 'in')[0]!)).toBeLessThan(1e-9);
    // The loop current is v/R at f0 and flows through every element alike.
    expectRelativelyClose(atF0.current('L1')[0]!.abs(), 1 / R, 1e-12, '|current in L1| at f0');
    const cutoffs = ac.cutoffFrequencies('out', 'in');
    const [low, high] = halfPower(q);
    expect(cutoffs).toHaveLength(2);
    expectRelativelyClose(cutoffs[0]!, low, 1e-5, 'lower half-power frequency');
    expectRelativelyClose(cutoffs[1]!, high, 1e-5, 'upper half-power frequency');
    expectRelativelyClose(cutoffs[1]! - cutoffs[0]!, f0 / q, 1e-4, 'bandwidth f0/Q');
    expectRelativelyClose(Math.sqrt(cutoffs[0]! * cutoffs[1]!), f0, 1e-5, 'geometric mean = f0');
  });

  it('puts a parallel RLC impedance peak R at f0 with bandwidth f0/Q', () => {
    const R = 20e3; // Q = R·√(C/L) ≈ 63.2
    const q = R * Math.sqrt(C / L);
    const c = new Circuit()
      .currentSource('drive', GROUND, 'top', { ac: 1 })
      .resistor('R1', 'top', GROUND, R)
      .inductor('L1', 'top', GROUND, L)
      .capacitor('C1', 'top', GROUND, C);
    const op = operatingPoint(c);
    const atF0 = acAnalysis(op, { frequencies: [f0] });
    const z = atF0.sourceImpedance('drive')[0]!;
    expectRelativelyClose(z.re, R, 1e-10, 'Re Z(f0) = R');
    expect(Math.abs(z.im)).toBeLessThan(1e-8 * R);
    // At f0 the inductor and capacitor carry equal and opposite currents Q times the source current.
    const iL = atF0.current('L1')[0]!;
    const iC = atF0.current('C1')[0]!;
    expectRelativelyClose(iL.abs(), q, 1e-10, '|current in L1| = Q·I at f0');
    expect(iL.add(iC).abs()).toBeLessThan(1e-9 * q);
    const ac = acAnalysis(op, { frequencies: logSweep(f0 / 2, f0 * 2, 20000) });
    const cutoffs = ac.cutoffFrequencies('top');
    const [low, high] = halfPower(q);
    expect(cutoffs).toHaveLength(2);
    expectRelativelyClose(cutoffs[0]!, low, 1e-6, 'lower half-power frequency');
    expectRelativelyClose(cutoffs[1]!, high, 1e-6, 'upper half-power frequency');
    expectRelativelyClose(cutoffs[1]! - cutoffs[0]!, f0 / q, 1e-4, 'bandwidth f0/Q');
  });
});

describe('acAnalysis element currents', () => {
  it('gives a capacitor current jωC·v and an inductor current v/(jωL)', () => {
    // Source: the element laws i = C·dv/dt and v = L·di/dt in phasor form, and Kirchhoff's current law
    // (any circuits text, e.g. Nilsson and Riedel, from memory).
    const omega = 2 * Math.PI * 1e3;
    const [G, C, L] = [1 / 220, 1e-6, 5e-3];
    const c = new Circuit()
      .currentSource('drive', GROUND, 'top', { ac: 2e-3 })
      .resistor('R1', 'top', GROUND, 1 / G)
      .capacitor('C1', 'top', GROUND, C)
      .inductor('L1', 'top', GROUND, L);
    const ac = acAnalysis(operatingPoint(c), { frequencies: [1e3] });
    // v = I/(G + j(ωC − 1/(ωL))).
    const b = omega * C - 1 / (omega * L);
    const d = G * G + b * b;
    const v = ac.voltage('top')[0]!;
    expectRelativelyClose(v.re, (2e-3 * G) / d, 1e-12, 'Re voltage at top');
    expectRelativelyClose(v.im, (-2e-3 * b) / d, 1e-12, 'Im voltage at top');
    const iC = ac.current('C1')[0]!;
    const iL = ac.current('L1')[0]!;
    const iR = ac.current('R1')[0]!;
    expect(iC.sub(v.mul(0, omega * C)).abs()).toBeLessThan(1e-14);
    expect(iL.sub(v.div(0, omega * L)).abs()).toBeLessThan(1e-14);
    expect(iR.sub(v.mul(G)).abs()).toBeLessThan(1e-14);
    expect(iC.add(iL).add(iR).sub(2e-3).abs()).toBeLessThan(1e-15);
    // The current source reports its own set value.
    expect(ac.current('drive')[0]!.sub(2e-3).abs()).toBe(0);
  });

  it('shorts an inductor and opens a capacitor at 0 Hz', () => {
    // Source: the DC limits of jωL and 1/(jωC) (any circuits text).
    const c = new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .resistor('R1', 'in', 'a', 100)
      .inductor('L1', 'a', 'b', 1e-3)
      .resistor('R2', 'b', GROUND, 300)
      .capacitor('C1', 'b', GROUND, 1e-6);
    const ac = acAnalysis(operatingPoint(c), { frequencies: [0] });
    expectRelativelyClose(ac.voltage('b')[0]!.re, 0.75, 1e-14, 'voltage at b at 0 Hz: 300/(100 + 300)');
    expect(ac.voltage('a', 'b')[0]!.abs()).toBe(0);
    expect(ac.current('C1')[0]!.abs()).toBe(0);
  });
});

describe('acAnalysis on passive networks (property)', () => {
  it('gives a symmetric transfer impedance Z12 = Z21 for random RLC networks', () => {
    // Source: the reciprocity theorem for networks of R, L and C, e.g. C. A. Desoer and E. S. Kuh,
    // "Basic Circuit Theory", McGraw-Hill, 1969 (from memory).
    const element = fc.record({
      kind: fc.constantFrom('r', 'rl', 'c'),
      a: fc.integer({ min: 0, max: 5 }),
      b: fc.integer({ min: 0, max: 5 }),
      value: fc.double({ min: 0, max: 3, noNaN: true }),
    });
    const network = fc.record({
      elements: fc.array(element, { minLength: 1, maxLength: 12 }),
      ports: fc.tuple(fc.integer({ min: 1, max: 5 }), fc.integer({ min: 1, max: 5 })),
      frequency: fc.double({ min: 1, max: 1e6, noNaN: true }),
    });
    type Network = {
      elements: { kind: 'r' | 'rl' | 'c'; a: number; b: number; value: number }[];
      ports: [number, number];
      frequency: number;
    };
    const nodeName = (k: number) => (k === 0 ? GROUND : `n${k}`);
    const build = (net: Network, drive: number) => {
      const c = new Circuit();
      // A resistor chain to ground keeps every node on a DC path.
      for (let k = 1; k <= 5; k++) c.resistor(`Rg${k}`, nodeName(k), nodeName(k - 1), 1e3);
      net.elements.forEach((e, k) => {
        if (e.a === e.b) return;
        const scale = 10 ** e.value;
        if (e.kind === 'r') c.resistor(`R${k}`, nodeName(e.a), nodeName(e.b), 10 * scale);
        else if (e.kind === 'rl') {
          // An inductor with its winding resistance, so that inductors never close a loop on their own.
          c.inductor(`L${k}`, nodeName(e.a), `m${k}`, 1e-4 * scale);
          c.resistor(`RL${k}`, `m${k}`, nodeName(e.b), 1);
        } else c.capacitor(`C${k}`, nodeName(e.a), nodeName(e.b), 1e-9 * scale);
      });
      c.currentSource('drive', GROUND, nodeName(drive), { ac: 1 });
      return c;
    };
    fc.assert(
      fc.property(network, (net) => {
        const [p, q] = net.ports;
        const zqp = acAnalysis(operatingPoint(build(net, p)), { frequencies: [net.frequency] }).voltage(
          nodeName(q),
        )[0]!;
        const zpq = acAnalysis(operatingPoint(build(net, q)), { frequencies: [net.frequency] }).voltage(
          nodeName(p),
        )[0]!;
        const scale = Math.max(zqp.abs(), zpq.abs());
        expect(zqp.sub(zpq).abs()).toBeLessThanOrEqual(1e-9 * scale + 1e-12);
      }),
      { numRuns: 60 },
    );
  });
});

describe('acAnalysis input checks', () => {
  const rc = () =>
    operatingPoint(
      new Circuit()
        .voltageSource('input', 'in', GROUND, { ac: 1 })
        .resistor('R1', 'in', 'out', 1e3)
        .capacitor('C1', 'out', GROUND, 1e-6),
    );

  it('accepts 0 Hz, any order and a Float64Array, keeping the order given', () => {
    // Source: H(0) = 1 for the RC low-pass (common practice, no source).
    const ac = acAnalysis(rc(), { frequencies: Float64Array.of(1e3, 0, 10) });
    expect(Array.from(ac.frequencies)).toEqual([1e3, 0, 10]);
    expect(ac.gain('out', 'in')[1]!.re).toBe(1);
    expect(ac.gain('out', 'in')[1]!.im).toBe(0);
  });

  it('refuses negative, NaN, infinite and missing frequencies with invalid-value', () => {
    const op = rc();
    expectQuiescentError(() => acAnalysis(op, { frequencies: [10, -1] }), 'invalid-value', 'frequencies');
    expectQuiescentError(() => acAnalysis(op, { frequencies: [Number.NaN] }), 'invalid-value', 'frequencies');
    expectQuiescentError(() => acAnalysis(op, { frequencies: [Infinity] }), 'invalid-value', 'frequencies');
    expectQuiescentError(() => acAnalysis(op, { frequencies: [] }), 'invalid-value', 'frequencies');
    expectQuiescentError(
      () => acAnalysis(op, {} as unknown as { frequencies: number[] }),
      'invalid-value',
      'frequencies',
    );
  });

  it('refuses unknown nodes and elements and bad probes', () => {
    const ac = acAnalysis(rc(), { frequencies: [1] });
    expectQuiescentError(() => ac.voltage('nowhere'), 'unknown-node', 'nowhere');
    expectQuiescentError(() => ac.current('R9'), 'unknown-element', 'R9');
    expectQuiescentError(() => ac.response({} as unknown as string), 'invalid-value', 'probe');
  });

  it('refuses crossings on a sweep that is not ascending', () => {
    const ac = acAnalysis(rc(), { frequencies: [100, 10] });
    expectQuiescentError(() => ac.cutoffFrequencies('out'), 'invalid-value', 'frequencies');
    expectQuiescentError(() => ac.unityGainFrequency('out'), 'invalid-value', 'frequencies');
  });

  it('reports singular for an LC tank without loss driven by a current at its resonance', () => {
    // Source: the admittance jωC + 1/(jωL) of a lossless tank vanishes at ω = 1/√(LC) (any circuits
    // text). With L = C = 1/(2π) that is 1 Hz, where ωC and ωL are exactly 1 in floating point.
    const value = 1 / (2 * Math.PI);
    const c = new Circuit()
      .currentSource('drive', GROUND, 'tank', { ac: 1 })
      .inductor('L1', 'tank', GROUND, value)
      .capacitor('C1', 'tank', GROUND, value);
    const op = operatingPoint(c);
    expect(2 * Math.PI * value).toBe(1);
    expectQuiescentError(() => acAnalysis(op, { frequencies: [0.5, 1] }), 'singular', '1 Hz');
    expect(acAnalysis(op, { frequencies: [0.5, 2] }).voltage('tank')).toHaveLength(2);
  });
});
