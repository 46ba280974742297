/**
 * Poles and zeros of linearized circuits against closed forms and scipy: an RC section, a series RLC
 * (ω0 and Q), a unity-gain Sallen-Key low-pass, a third-order Butterworth ladder (poles from
 * scipy.signal.butter), a follower with a capacitive load; the zeros of a twin-T notch, of an emitter
 * bypass network and of a high-pass (at the origin).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint, poles, type Root, zeros } from '../../src/index.js';
import butterworth from '../reference/butterworth-poles.json';
import { expectRelativelyClose } from '../support/close.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

const TWO_PI = 2 * Math.PI;

/** Expect `root` at s = re + j·im (rad/s), within `tolerance` of |s|. */
function expectRootAt(root: Root, re: number, im: number, tolerance: number, what: string): void {
  const scale = Math.hypot(re, im);
  const error = Math.hypot(root.real * TWO_PI - re, root.imaginary * TWO_PI - im);
  expect(error / scale, `${what}: got ${root.real} + j${root.imaginary} Hz`).toBeLessThan(tolerance);
}

describe('poles of an RC section', () => {
  it('is the one real pole at −1/(RC)', () => {
    // Source: the first-order section's time constant RC (common practice, no source).
    const c = new Circuit()
      .voltageSource('signal', 'in', GROUND, { ac: 1 })
      .resistor('R1', 'in', 'out', 1e3)
      .capacitor('C1', 'out', GROUND, 1e-6);
    const p = poles(operatingPoint(c));
    expect(p).toHaveLength(1);
    expectRootAt(p[0]!, -1e3, 0, 1e-12, 'pole');
    expect(p[0]!.q).toBe(0.5);
    expect(p[0]!.dampingRatio).toBe(1);
    expect(p[0]!.imaginary).toBe(0);
  });
});

/** A series RLC driven by a voltage source. */
function seriesRlc(r: number, l: number, c: number): Circuit {
  return new Circuit()
    .voltageSource('signal', 'in', GROUND, { ac: 1 })
    .resistor('R1', 'in', 'a', r)
    .inductor('L1', 'a', 'b', l)
    .capacitor('C1', 'b', GROUND, c);
}

describe('poles of a series RLC', () => {
  it('are a pair at ω0 = 1/√(LC) with Q = √(L/C)/R', () => {
    // Source: the series resonant circuit, s² + (R/L)s + 1/(LC) = 0 (e.g. P. Horowitz and W. Hill,
    // "The Art of Electronics", 3rd ed., 2015, ch. 1; from memory).
    const [r, l, c] = [10, 1e-3, 1e-6];
    const p = poles(operatingPoint(seriesRlc(r, l, c)));
    expect(p).toHaveLength(2);
    const omega0 = 1 / Math.sqrt(l * c);
    const q = Math.sqrt(l / c) / r;
    for (const pole of p) {
      expectRelativelyClose(pole.frequency, omega0 / TWO_PI, 1e-12, 'ω0/2π');
      expectRelativelyClose(pole.q, q, 1e-12, 'Q');
      expectRelativelyClose(pole.dampingRatio, 1 / (2 * q), 1e-12, 'damping ratio');
    }
    // The conjugate pair is adjacent, its positive imaginary part first.
    expect(p[0]!.imaginary).toBeGreaterThan(0);
    expect(p[1]!.imaginary).toBe(-p[0]!.imaginary);
  });

  it('match ω0 and Q for any values (property)', () => {
    // Source: as above.
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 3, noNaN: true }),
        fc.double({ min: -6, max: -2, noNaN: true }),
        fc.double({ min: -9, max: -5, noNaN: true }),
        (re, le, ce) => {
          const [r, l, c] = [10 ** re, 10 ** le, 10 ** ce];
          const p = poles(operatingPoint(seriesRlc(r, l, c)));
          expect(p).toHaveLength(2);
          const omega0 = 1 / Math.sqrt(l * c);
          // Product and sum of the roots: ω0² and −R/L (real for Q < 1/2, a pair above).
          const [a, b] = p.map((x) => ({ re: x.real * TWO_PI, im: x.imaginary * TWO_PI }));
          const product = a!.re * b!.re - a!.im * b!.im;
          expectRelativelyClose(product, omega0 * omega0, 1e-7, 'ω0²');
          expectRelativelyClose(a!.re + b!.re, -r / l, 1e-7, '−R/L');
        },
      ),
      { seed: 15, numRuns: 40 },
    );
  });
});

describe('poles of a unity-gain Sallen-Key low-pass', () => {
  it('are at ω0 = 1/√(R1R2C1C2) with Q = √(R1R2C1C2)/(C2(R1 + R2))', () => {
    // Source: R. P. Sallen and E. L. Kearns, "A practical method of designing RC active filters",
    // IRE Trans. Circuit Theory 2(1), 1955 (the denominator s²R1R2C1C2 + sC2(R1 + R2) + 1).
    const [r1, r2, c1, c2] = [12e3, 33e3, 22e-9, 4.7e-9];
    const circuit = new Circuit()
      .voltageSource('signal', 'in', GROUND, { ac: 1 })
      .resistor('R1', 'in', 'a', r1)
      .resistor('R2', 'a', 'b', r2)
      .capacitor('C1', 'a', 'out', c1)
      .capacitor('C2', 'b', GROUND, c2)
      .opAmp('U1', { plus: 'b', minus: 'out', output: 'out' });
    const p = poles(operatingPoint(circuit));
    expect(p).toHaveLength(2);
    const product = r1 * r2 * c1 * c2;
    for (const pole of p) {
      expectRelativelyClose(pole.frequency, 1 / (TWO_PI * Math.sqrt(product)), 1e-10, 'f0');
      expectRelativelyClose(pole.q, Math.sqrt(product) / (c2 * (r1 + r2)), 1e-10, 'Q');
    }
  });
});

describe('poles of a third-order Butterworth ladder', () => {
  it('are the poles scipy.signal.butter gives', () => {
    // Source: test/reference/butterworth-poles.json, written offline by butterworth-poles.py; the
    // normalized ladder (1 F, 2 H, 1 F between 1 Ω terminations) as tabulated by A. I. Zverev,
    // "Handbook of Filter Synthesis", 1967.
    const r = butterworth.termination;
    const w = TWO_PI * butterworth.cutoff;
    const [c1, l2, c3] = butterworth.normalizedElements;
    const circuit = new Circuit()
      .voltageSource('signal', 'source', GROUND, { ac: 1 })
      .resistor('sourceResistance', 'source', 'n1', r)
      .capacitor('C1', 'n1', GROUND, c1! / (r * w))
      .inductor('L2', 'n1', 'n2', (l2! * r) / w)
      .capacitor('C3', 'n2', GROUND, c3! / (r * w))
      .resistor('termination', 'n2', GROUND, r);
    const p = poles(operatingPoint(circuit));
    expect(p).toHaveLength(3);
    // Sorted by frequency (all equal: the Butterworth circle), then by decreasing real part.
    const want = [...butterworth.poles].sort((a, b) => b.re - a.re || b.im - a.im);
    want.forEach((s, k) => {
      expectRootAt(p[k]!, s.re, s.im, 1e-11, `pole ${k}`);
    });
  });
});

describe('poles of a follower driving a capacitive load', () => {
  it('are the roots of τpτL·s² + (τp + τL)·s + 1 + A0, the op-amp pole included', () => {
    // Source: the closed loop of T = A0/((1 + sτp)(1 + sτL)), 1 + T = 0 (S. Franco, "Design with
    // Operational Amplifiers and Analog Integrated Circuits", 3rd ed., 2002, ch. 8).
    const [a0, gbw, rs, cl] = [1e5, 1e6, 100, 10e-9];
    const circuit = new Circuit()
      .voltageSource('signal', 'in', GROUND, { ac: 1 })
      .opAmp('U1', { plus: 'in', minus: 'out', output: 'amp' }, { openLoopGain: a0, gainBandwidth: gbw })
      .resistor('isolation', 'amp', 'out', rs)
      .capacitor('load', 'out', GROUND, cl);
    const p = poles(operatingPoint(circuit));
    const tp = a0 / (TWO_PI * gbw);
    const tl = rs * cl;
    const [a, b, c] = [tp * tl, tp + tl, 1 + a0];
    const re = -b / (2 * a);
    const im = Math.sqrt(4 * a * c - b * b) / (2 * a);
    expect(p).toHaveLength(2);
    expectRootAt(p[0]!, re, im, 1e-9, 'upper pole');
    expectRootAt(p[1]!, re, -im, 1e-9, 'lower pole');
  });
});

describe('zeros', () => {
  it('of a twin-T notch are ±j/(RC), and a third zero that a pole cancels', () => {
    // Source: the unloaded twin-T, H(s) = (s² + ω0²)/(s² + 4ω0·s + ω0²) with ω0 = 1/(RC) after a
    // common factor (s + ω0) cancels (e.g. A. B. Williams and F. J. Taylor, "Electronic Filter
    // Design Handbook", 4th ed., 2006, on notch networks; from memory).
    const [r, c] = [10e3, 10e-9];
    const circuit = new Circuit()
      .voltageSource('signal', 'in', GROUND, { ac: 1 })
      .resistor('Ra', 'in', 'p', r)
      .resistor('Rb', 'p', 'out', r)
      .capacitor('Cc', 'p', GROUND, 2 * c)
      .capacitor('Ca', 'in', 'q', c)
      .capacitor('Cb', 'q', 'out', c)
      .resistor('Rc', 'q', GROUND, r / 2);
    const op = operatingPoint(circuit);
    const z = zeros(op, { output: 'out', input: 'signal' });
    const w0 = 1 / (r * c);
    expect(z).toHaveLength(3);
    // Frequencies equal within 1e-9: the larger real part first, so the pair on the axis leads.
    expectRootAt(z[0]!, 0, w0, 1e-10, 'notch zero');
    expectRootAt(z[1]!, 0, -w0, 1e-10, 'notch zero');
    expectRootAt(z[2]!, -w0, 0, 1e-10, 'cancelled zero');
    // The poles: ω0·(−2 ± √3) and the cancelled −ω0.
    const p = poles(op);
    expect(p).toHaveLength(3);
    expectRootAt(p[0]!, w0 * (-2 + Math.sqrt(3)), 0, 1e-10, 'pole');
    expectRootAt(p[1]!, -w0, 0, 1e-10, 'pole');
    expectRootAt(p[2]!, w0 * (-2 - Math.sqrt(3)), 0, 1e-10, 'pole');
  });

  it('of a transistor stage with a bypassed emitter resistor is at −1/(RE·CE)', () => {
    // Source: the emitter impedance RE ∥ 1/(sCE) is infinite at s = −1/(RE·CE), so no signal current
    // flows there; the pole sits at −(1/RE + gm + 1/rπ)/CE (A. S. Sedra and K. C. Smith,
    // "Microelectronic Circuits", 7th ed., 2015, §10.1, the bypass capacitor).
    const [re, ce] = [1e3, 100e-6];
    const circuit = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
      .voltageSource('bias', 'base', GROUND, { dc: 1.8, ac: 1 })
      .bjt('Q1', { collector: 'c', base: 'base', emitter: 'e' }, { polarity: 'npn' })
      .resistor('collectorLoad', 'vcc', 'c', 4.7e3)
      .resistor('emitterResistor', 'e', GROUND, re)
      .capacitor('bypass', 'e', GROUND, ce);
    const op = operatingPoint(circuit);
    const z = zeros(op, { output: 'c', input: 'bias' });
    expect(z).toHaveLength(1);
    expectRootAt(z[0]!, -1 / (re * ce), 0, 1e-8, 'bypass zero');
    const { gm, rpi } = op.bjt('Q1');
    const p = poles(op);
    expect(p).toHaveLength(1);
    expectRootAt(p[0]!, -(1 / re + gm + 1 / rpi) / ce, 0, 1e-8, 'bypass pole');
  });

  it('of a high-pass include one at the origin, exactly', () => {
    // Source: H(s) = sRC/(1 + sRC) (common practice, no source).
    const circuit = new Circuit()
      .voltageSource('signal', 'in', GROUND, { ac: 1 })
      .capacitor('coupling', 'in', 'out', 1e-6)
      .resistor('R1', 'out', GROUND, 1e3);
    const z = zeros(operatingPoint(circuit), { output: 'out', input: 'signal' });
    expect(z).toEqual([{ real: 0, imaginary: 0, frequency: 0, q: 0.5, dampingRatio: 1 }]);
  });

  it('of a current read through a capacitor count its s·C', () => {
    // Source: i(C) = sC·v; in the RC section v = V/(1 + sRC), so i(C) has its zero at the origin.
    const circuit = new Circuit()
      .voltageSource('signal', 'in', GROUND, { ac: 1 })
      .resistor('R1', 'in', 'out', 1e3)
      .capacitor('C1', 'out', GROUND, 1e-6);
    const z = zeros(operatingPoint(circuit), { output: { element: 'C1' }, input: 'signal' });
    expect(z.map((x) => x.frequency)).toEqual([0]);
    expect(zeros(operatingPoint(circuit), { output: 'out', input: 'signal' })).toEqual([]);
  });
});

describe('poles and zeros refuse', () => {
  const op = operatingPoint(seriesRlc(10, 1e-3, 1e-6));
  it('an input that is not an independent source', () => {
    expectQuiescentError(() => zeros(op, { output: 'b', input: 'R1' }), 'invalid-value', 'R1');
  });
  it('an unknown output node', () => {
    expectQuiescentError(() => zeros(op, { output: 'nowhere', input: 'signal' }), 'unknown-node', 'nowhere');
  });
  it('a limit that is not a positive whole number', () => {
    expectQuiescentError(() => poles(op, { limit: 0 }), 'invalid-value', 'limit');
    expectQuiescentError(() => poles(op, { near: -1 }), 'invalid-value', 'near');
  });
  it('gives the nearest roots when asked for a limit', () => {
    const p = poles(op, { limit: 1, near: 5000 });
    // A pair is never split: both members come back.
    expect(p).toHaveLength(2);
  });
});

describe('poles of a critically damped RLC', () => {
  it('are a double real pole at −R/(2L), not a pair split by rounding', () => {
    // Source: Q = √(L/C)/R = 1/2 makes s² + (R/L)s + 1/(LC) a perfect square (common practice).
    const [l, c] = [1e-3, 1e-6];
    const r = 2 * Math.sqrt(l / c);
    const p = poles(operatingPoint(seriesRlc(r, l, c)));
    expect(p).toHaveLength(2);
    for (const pole of p) {
      expect(pole.imaginary).toBe(0);
      expectRelativelyClose(pole.real * TWO_PI, -r / (2 * l), 1e-7, 'double pole');
    }
  });
});
