/**
 * Two-tone intermodulation by the method of nonlinear currents, against the closed forms of one
 * exponential junction and against the two-tone large-signal check.
 */
import { describe, expect, it } from 'vitest';
import { intermodulation, operatingPoint, quasiStaticIntermodulation } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { commonEmitterStage, commonSourceStage, singleJunction } from '../support/linearity-circuits.js';

describe('intermodulation of a single junction driven by a voltage source', () => {
  it('gives x/2 and x²/8 (x per tone) and an input intercept of √8·n·Vt in amplitude', () => {
    // Source: the exponential's Taylor coefficients a₂/a₁ = 1/(2Vt), a₃/a₁ = 1/(6Vt²) give
    // IM2 = a₂/a₁·v̂ and IM3 = ¾·a₃/a₁·v̂², so the third-order intercept is v̂ = √8·Vt (P. R. Gray,
    // P. J. Hurst, S. H. Lewis and R. G. Meyer, Analysis and Design of Analog Integrated Circuits,
    // 5th ed., Wiley, 2009, ch. 5, the intermodulation of the bipolar transistor's exponential).
    for (const amplitude of [1e-4, 1e-3]) {
      const op = operatingPoint(singleJunction(amplitude));
      const im = intermodulation(op, { output: { element: 'drive' }, tones: [1e3, 1.1e3] });
      const vt = op.thermalVoltage;
      const x = amplitude / vt;
      expectRelativelyClose(im.secondOrder, x / 2, 1e-8, 'x/2');
      expectRelativelyClose(im.thirdOrder, (x * x) / 8, 1e-8, 'x²/8');
      expectRelativelyClose(im.inputIntercept3 * amplitude, Math.sqrt(8) * vt, 1e-8, '√8·Vt');
      expectRelativelyClose(im.inputIntercept2 * amplitude, 2 * vt, 1e-8, '2·Vt');
      expectRelativelyClose(im.outputIntercept3, im.fundamental[0] * im.inputIntercept3, 1e-15, 'OIP3');
      expect(im.products.map((p) => p.frequency)).toEqual([100, 2100, 900, 1200]);
      expect(im.contributions).toEqual([{ device: 'D1', thirdOrder: im.thirdOrder }]);
    }
  });
});

describe('intermodulation against the two-tone large-signal check', () => {
  // Source: the large-signal check (held capacitors, 16 × 16 phase pairs, two-dimensional DFT).
  // Tolerance: at x ≈ 0.04 per tone the next terms are of relative order x², under 1 %; 3 % for order 3.
  const cases = [
    ['a degenerated common-emitter stage', commonEmitterStage(0.004, 220), 'out'],
    ['a common-source stage', commonSourceStage(0.02), 'd'],
  ] as const;
  for (const [label, circuit, output] of cases) {
    it(`agrees on ${label}`, () => {
      const im = intermodulation(operatingPoint(circuit), { output, tones: [100e3, 110e3] });
      const check = quasiStaticIntermodulation(circuit, { output });
      expectRelativelyClose(im.secondOrder, check.secondOrder, 0.01, 'f2 − f1');
      expectRelativelyClose(im.products[1]!.ratio, check.products[1]!.ratio, 0.01, 'f1 + f2');
      expectRelativelyClose(im.thirdOrder, check.thirdOrder, 0.03, 'order 3');
      const total = im.contributions.reduce((sum, c) => sum + c.thirdOrder, 0);
      expectRelativelyClose(total, im.thirdOrder, 1e-9, 'one device, its contribution is the total');
    });
  }
});

describe('intermodulation options', () => {
  for (const tones of [[1e3, 1e3], [0, 1e3], [-1, 2], [1e3], [1e3, Number.NaN]]) {
    it(`refuses tones ${JSON.stringify(tones)} with invalid-value`, () => {
      const op = operatingPoint(singleJunction(1e-3));
      expect(() => intermodulation(op, { output: 'a', tones: tones as never })).toThrow(
        expect.objectContaining({
          code: 'invalid-value',
          details: expect.objectContaining({ path: ['tones'] }),
        }),
      );
    });
  }

  it('throws no-signal for an output the sources do not reach', () => {
    const op = operatingPoint(commonEmitterStage(0, 220));
    expect(() => intermodulation(op, { output: 'out', tones: [1e3, 1.1e3] })).toThrow(
      expect.objectContaining({ code: 'no-signal' }),
    );
  });
});
