/**
 * The quasi-static large-signal check: the full nonlinear circuit solved at N phases of one period of
 * its AC sources, harmonics by a DFT. Judged against exact solutions outside the solver.
 */
import { describe, expect, it } from 'vitest';
import { quasiStaticHarmonics } from '../../src/analysis/quasi-static.js';
import { Circuit, GROUND, operatingPoint, QuiescentError } from '../../src/index.js';
import reference from '../reference/diode-harmonics.json';
import { expectRelativelyClose } from '../support/close.js';

function diodeAttenuator(amplitude: number): Circuit {
  return new Circuit()
    .voltageSource('drive', 'in', GROUND, { dc: reference.bias, ac: amplitude })
    .resistor('R1', 'in', 'a', reference.resistance)
    .diode('D1', 'a', GROUND, { saturationCurrent: reference.saturationCurrent });
}

describe('quasiStaticHarmonics', () => {
  it('reproduces the exact harmonics of a diode attenuator', () => {
    // Source: exact Lambert-W loop solution at 256 phases, 50 digits (Banwell & Jayakumar, Electronics
    // Letters 36(4), 2000): test/reference/diode-harmonics.py. With a cosine drive every
    // harmonic is real, so the phasors' real parts are compared with the signed coefficients.
    for (const c of reference.cases) {
      const voltage = quasiStaticHarmonics(diodeAttenuator(c.amplitude), { output: 'a' });
      const current = quasiStaticHarmonics(diodeAttenuator(c.amplitude), { output: { element: 'R1' } });
      const [v1, v2, v3] = c.junctionHarmonics as [number, number, number];
      const [i1, i2, i3] = c.currentHarmonics as [number, number, number];
      const at = `A = ${c.amplitude} V`;
      expectRelativelyClose(voltage.fundamentalPhasor.re, v1, 1e-8, `v1, ${at}`);
      expectRelativelyClose(voltage.second.re, v2, 1e-6, `v2, ${at}`);
      expectRelativelyClose(voltage.third.re, v3, 1e-4, `v3, ${at}`);
      expectRelativelyClose(voltage.meanOffset, c.junctionMeanShift, 1e-6, `mean shift, ${at}`);
      expectRelativelyClose(current.fundamentalPhasor.re, i1, 1e-8, `i1, ${at}`);
      expectRelativelyClose(current.second.re, i2, 1e-6, `i2, ${at}`);
      expectRelativelyClose(current.third.re, i3, 1e-4, `i3, ${at}`);
      expect(Math.abs(voltage.second.im)).toBeLessThanOrEqual(1e-9 * Math.abs(v1));
      expect(voltage.quiescent).toBeCloseTo(reference.quiescentJunctionVoltage, 9);
    }
  });

  it('matches the Fourier series of the logarithm for a diode driven by a current source', () => {
    // Source: ln(1 + a·cos θ) = ln((1 + √(1 − a²))/2) + 2·Σ_k (−1)^(k+1)·(r^k/k)·cos kθ,
    // r = (1 − √(1 − a²))/a (Gradshteyn & Ryzhik, Table of Integrals, 7th ed., 2007, 1.514). The
    // junction voltage is n·Vt·ln((I + I_S)/I_S) with I = I0 + Î·cos θ, so its h-th harmonic is
    // 2·n·Vt·(−1)^(h+1)·r^h/h with a = Î/(I0 + I_S). The drive's phase of 30° shifts harmonic h by 30°·h.
    const i0 = 1e-3;
    const peak = 4e-4;
    const c = new Circuit()
      .currentSource('bias', GROUND, 'a', { dc: i0, ac: { magnitude: peak, phase: 30 } })
      .diode('D1', 'a', GROUND, { emissionCoefficient: 1.5 });
    const result = quasiStaticHarmonics(c, { output: 'a', phases: 128 });
    const nVt = 1.5 * operatingPoint(c).thermalVoltage;
    const a = peak / (i0 + 1e-14);
    const r = (1 - Math.sqrt(1 - a * a)) / a;
    result.harmonics.slice(0, 5).forEach((phasor, index) => {
      const h = index + 1;
      const expected = (2 * nVt * (-1) ** (h + 1) * r ** h) / h;
      expectRelativelyClose(phasor.abs(), Math.abs(expected), 1e-6, `harmonic ${h}`);
      const phase = phasor.arg() - (expected < 0 ? Math.PI : 0);
      const wrapped = Math.atan2(Math.sin(phase - (h * Math.PI) / 6), Math.cos(phase - (h * Math.PI) / 6));
      expect(Math.abs(wrapped), `phase of harmonic ${h}`).toBeLessThan(1e-6);
    });
    expectRelativelyClose(result.secondRatio, r / 2, 1e-6, 'H2 = r/2');
    expectRelativelyClose(result.thirdRatio, (r * r) / 3, 1e-6, 'H3 = r²/3');
  });

  it('finds no harmonics in a linear circuit', () => {
    // Source: superposition (a linear circuit's response to a sinusoid is that sinusoid); the divider
    // gain 1k/(1k + 3k) by Ohm's law.
    const c = new Circuit()
      .voltageSource('drive', 'in', GROUND, { dc: 1, ac: 2 })
      .resistor('R1', 'in', 'out', '3k')
      .resistor('R2', 'out', GROUND, '1k');
    const result = quasiStaticHarmonics(c, { output: { node: 'out' }, phases: 16 });
    expectRelativelyClose(result.fundamentalPhasor.re, 0.5, 1e-12, 'fundamental');
    expect(result.second.abs()).toBeLessThan(1e-12);
    expect(result.third.abs()).toBeLessThan(1e-12);
    expect(result.harmonics).toHaveLength(7);
  });

  it('scales the drive and leaves the circuit as it was', () => {
    // Source: common practice, no source: a check must not change what it checks.
    const c = diodeAttenuator(0.001);
    const before = JSON.stringify(c.toJSON());
    const once = quasiStaticHarmonics(c, { output: 'a', scale: 2 });
    const twice = quasiStaticHarmonics(diodeAttenuator(0.002), { output: 'a' });
    expectRelativelyClose(once.second.re, twice.second.re, 1e-9, 'scale 2 is the doubled source');
    expect(JSON.stringify(c.toJSON())).toBe(before);
    expectRelativelyClose(operatingPoint(c).voltage('a'), once.quiescent, 1e-9, 'operating point unchanged');
  });

  for (const [what, options, code] of [
    ['7 phases', { output: 'a', phases: 7 }, 'invalid-value'],
    ['a fractional number of phases', { output: 'a', phases: 8.5 }, 'invalid-value'],
    ['a negative scale', { output: 'a', scale: -1 }, 'invalid-value'],
    ['an unknown node', { output: 'zz' }, 'unknown-node'],
    ['an unknown element', { output: { element: 'R7' } }, 'unknown-element'],
  ] as const) {
    it(`refuses ${what} with ${code}`, () => {
      // Source: the error table of docs/building-circuits.md, "Errors".
      try {
        quasiStaticHarmonics(diodeAttenuator(0.001), options as never);
        expect.unreachable('quasiStaticHarmonics accepted a bad argument');
      } catch (error) {
        expect(error).toBeInstanceOf(QuiescentError);
        expect((error as QuiescentError).code).toBe(code);
      }
    });
  }
});

describe('the held reactive elements', () => {
  it('hold coupling capacitors and chokes, and keep those that would close a loop of sources or a cut set', () => {
    // Source: a loop of voltage sources or a cut set of current sources has no unique solution
    // (modified nodal analysis, common practice, no source), the two exceptions of docs/linearity.md.
    const circuit = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
      .capacitor('Cdecouple', 'vcc', GROUND, '10µ')
      .voltageSource('signal', 'in', GROUND, { ac: 0.01 })
      .capacitor('Ccouple', 'in', 'a', '10µ')
      .resistor('Rbias', 'vcc', 'a', '10k')
      .diode('D1', 'a', GROUND)
      .inductor('Lchoke', 'vcc', 'b', '1m')
      .resistor('Rload', 'b', GROUND, '1k')
      .currentSource('feed', GROUND, 'c', { dc: 1e-3 })
      .inductor('Lseries', 'c', 'd', '1m')
      .resistor('Rsense', 'd', GROUND, '100');
    const check = quasiStaticHarmonics(circuit, { output: 'a' });
    expect([...check.held].sort()).toEqual(['Ccouple', 'Lchoke']);
    expect([...check.kept].sort()).toEqual(['Cdecouple', 'Lseries']);
    expect(check.secondHarmonic).toBeGreaterThan(0);
  });

  it('refuses an unknown treatment', () => {
    expect(() =>
      quasiStaticHarmonics(diodeAttenuator(0.01), { output: 'a', reactive: 'short' as never }),
    ).toThrow(expect.objectContaining({ code: 'invalid-value' }));
  });
});
