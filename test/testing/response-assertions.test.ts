import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { linearity } from '../../src/analysis/linearity.js';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import {
  assertGain,
  assertJunctionWithinBudget,
  assertPhase,
  type QuiescentMatchers,
  quiescentMatchers,
} from '../../src/testing/index.js';
import { failure } from './assertion-failure.js';

declare module 'vitest' {
  // biome-ignore lint/suspicious/noExplicitAny: the type parameter must match vitest's own declaration.
  interface Matchers<T = any> extends QuiescentMatchers<T> {}
}

expect.extend(quiescentMatchers);

// A first-order RC low-pass, 10 kΩ and 10 nF, f_c = 1/(2π·R·C) = 1591.55 Hz: at f_c the gain is
// −10·log10 2 = −3.0103 dB and the phase −45°; a decade above, −10·log10(101) = −20.0432 dB and
// −atan(10) = −84.2894° (Horowitz & Hill, The Art of Electronics, 3rd ed., 2015, §1.7; from memory).
const fc = 1 / (2 * Math.PI * 10e3 * 10e-9);
const lowPass = new Circuit()
  .voltageSource('input', 'in', GROUND, { ac: 1 })
  .resistor('R', 'in', 'out', '10k')
  .capacitor('C', 'out', GROUND, '10n');
const ac = acAnalysis(operatingPoint(lowPass), { frequencies: [fc, 10 * fc] });

describe('assertGain and assertPhase', () => {
  it('pass at the corner and a decade above it', () => {
    assertGain(ac, { output: 'out', input: 'in', frequency: fc }, -3.0103, { absolute: 1e-3 });
    assertGain(ac, { output: 'out', frequency: 10 * fc }, -20.0432, { absolute: 1e-3 });
    assertPhase(ac, { output: 'out', input: 'in', frequency: fc }, -45, { absolute: 1e-6 });
    assertPhase(ac, { output: 'out', frequency: 10 * fc }, -84.2894, { absolute: 1e-3 });
  });

  it('compare phases modulo 360°', () => {
    assertPhase(ac, { output: 'out', frequency: fc }, 315, { absolute: 1e-6 });
  });

  it('fail with the ratio, frequency, expected level, tolerance and actual level', () => {
    const error = failure(() =>
      assertGain(ac, { output: 'out', input: 'in', frequency: fc }, -6, { absolute: 0.5 }),
    );
    expect(error.message).toMatch(
      /^gain out ÷ in at 1\.592 kHz: expected -6 dB ± 0\.5 dB, actual -3\.0103 dB \(off by \+2\.9897 dB\)$/,
    );
    expect(
      failure(() => assertPhase(ac, { output: 'out', frequency: fc }, -90, { absolute: 5 })).message,
    ).toBe('phase out at 1.592 kHz: expected -90° ± 5°, actual -45° (off by +45°)');
  });

  it('refuse a frequency that was not analysed, listing those that were', () => {
    expect(() => assertGain(ac, { output: 'out', frequency: 1000 }, 0, { absolute: 1 })).toThrow(
      /one of the analysed frequencies \(1\.59155 kHz, 15\.9155 kHz\)/,
    );
  });

  it('work as vitest matchers', () => {
    expect(ac).toHaveGain({ output: 'out', input: 'in', frequency: fc }, -3.0103, { absolute: 1e-3 });
    expect(ac).not.toHavePhase({ output: 'out', frequency: fc }, 0, { absolute: 10 });
    expect(() =>
      expect(operatingPoint(lowPass)).toHaveGain({ output: 'out', frequency: fc }, 0, { absolute: 1 }),
    ).toThrow(/toHaveGain expects an AcAnalysis/);
  });
});

describe('assertJunctionWithinBudget', () => {
  // A diode biased at 1 mA (r_d = Vt/1 mA ≈ 25.9 Ω) fed through 10 kΩ: the junction sees
  // v̂ ≈ v̂in·r_d/(10 kΩ + r_d). With x = v̂/Vt, the error bound is (x/2)·e^x (Taylor's theorem with the
  // Lagrange remainder). 100 mV in gives x ≈ 0.01; 4 V in gives v̂ = 4 V · 25.865/10025.865 = 10.32 mV,
  // x = 0.3990 and a bound of 0.1995·e^0.399 = 0.2973.
  const diodeStage = (drive: number) =>
    linearity(
      acAnalysis(
        operatingPoint(
          new Circuit()
            .currentSource('bias', GROUND, 'anode', { dc: '1 mA' })
            .voltageSource('signal', 'drive', GROUND, { ac: drive })
            .capacitor('Ccouple', 'drive', 'feed', '10µ')
            .resistor('Rsignal', 'feed', 'anode', '10k')
            .diode('D1', 'anode', GROUND),
        ),
        { frequencies: [1e3] },
      ),
    );

  it('passes for a junction well inside the budget', () => {
    assertJunctionWithinBudget(diodeStage(0.1), 'D1');
    expect(diodeStage(0.1)).toHaveJunctionWithinBudget('D1', { junction: 'pn', budget: 0.01 });
  });

  it('fails with the junction, the budget, the bound, the frequency, the amplitude and x', () => {
    const error = failure(() => assertJunctionWithinBudget(diodeStage(4), 'D1'));
    expect(error.message).toMatch(
      /^linearity of D1 \(pn\): expected error bound ≤ 0\.1, actual 0\.297\d* at 1 kHz \(amplitude 10\.2\d* mV, x = 0\.399\d*\)$/,
    );
  });

  it('names a device the report does not judge', () => {
    expect(() => assertJunctionWithinBudget(diodeStage(0.1), 'Rsignal')).toThrow(
      expect.objectContaining({ code: 'unknown-element' }),
    );
  });
});
