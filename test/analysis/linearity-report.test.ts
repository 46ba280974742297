/**
 * The linearity report as text: worst junction first, every figure, the distortion shares and the
 * quasi-static check when given, and a verdict.
 */
import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { distortion } from '../../src/analysis/distortion.js';
import { linearity } from '../../src/analysis/linearity.js';
import { quasiStaticHarmonics } from '../../src/analysis/quasi-static.js';
import { Circuit, formatValue, GROUND, operatingPoint, QuiescentError } from '../../src/index.js';
import { formatLinearity, linearityTables, linearityVerdict } from '../../src/report/linearity-table.js';
import { commonEmitterStage } from '../support/linearity-circuits.js';

/** Two diodes: D1 at about 1.6 mA behind 20 Ω swings little; D2 at 13 µA behind 100 kΩ swings a lot. */
function twoDiodes(amplitude: number): Circuit {
  return new Circuit()
    .voltageSource('drive', 'in', GROUND, { dc: 2, ac: amplitude })
    .resistor('R1', 'in', 'a', '1k')
    .diode('D1', 'a', GROUND)
    .resistor('R2', 'a', 'b', '100')
    .diode('D2', 'b', GROUND, { saturationCurrent: 1e-12 });
}

describe('formatLinearity', () => {
  const circuit = twoDiodes(0.2);
  const ac = acAnalysis(operatingPoint(circuit), { frequencies: [100, 1e3] });
  const report = linearity(ac, { budget: 0.1 });
  const estimate = distortion(ac, { output: 'b' });
  const check = quasiStaticHarmonics(circuit, { output: 'b' });
  const text = formatLinearity(report, { distortion: estimate, check });

  it('lists the worst junction first', () => {
    // Source: the report's stated order (largest error bound first); common practice, no source.
    const [table] = linearityTables(report);
    const order = [...report.junctions].sort((a, b) => b.errorBound - a.errorBound).map((j) => j.device);
    expect(table!.rows.map((row) => row[0])).toEqual(order);
    expect(order[0]).toBe(report.worst!.device);
  });

  it('prints every figure of every junction', () => {
    // Source: common practice, no source: each number is printed with 4 significant digits.
    for (const j of report.junctions) {
      expect(text).toContain(formatValue(j.amplitude, 'V', { digits: 4 }));
      expect(text).toContain(String(Number(j.normalized.toPrecision(4))));
      expect(text).toContain(String(Number(j.errorBound.toPrecision(4))));
      expect(text).toContain(`${Number((100 * j.secondHarmonic).toPrecision(4))} %`);
      expect(text).toContain(`${Number((100 * j.thirdHarmonic).toPrecision(4))} %`);
    }
    expect(text).toContain('Distortion of b ');
    expect(text).toContain('quasi-static check');
    expect(text).toContain(`${Number((100 * check.secondRatio).toPrecision(4))} %`);
  });

  it('ends with a verdict naming the worst junction and the scale that meets the budget', () => {
    // Source: the definitions of withinBudget and maxInputScale (docs/analyses.md, "Linearity report").
    const verdict = linearityVerdict(report);
    expect(text.endsWith(verdict)).toBe(true);
    expect(report.withinBudget).toBe(false);
    expect(verdict).toMatch(/^Not linear enough/);
    expect(verdict).toContain(report.worst!.device);
    expect(verdict).toContain(String(Number(report.maxInputScale.toPrecision(4))));
    expect(text).toContain('OVER BUDGET');
    const quiet = linearity(acAnalysis(operatingPoint(twoDiodes(1e-4)), { frequencies: [1] }));
    expect(linearityVerdict(quiet)).toMatch(/^Linear enough/);
  });

  it('refuses a bad number of digits', () => {
    // Source: the report options' range (common practice, no source).
    expect(() => formatLinearity(report, { digits: 0 })).toThrow(QuiescentError);
  });
});

describe('formatLinearity with an output', () => {
  // A degenerated common-emitter stage at 10 mV (test/support/linearity-circuits.ts).
  const ac = acAnalysis(operatingPoint(commonEmitterStage(0.01, 220)), { frequencies: [1e3, 10e3] });
  const report = linearity(ac, { output: 'out' });
  const text = formatLinearity(report);

  it('opens with the output table and closes with a verdict naming the output, its figures and the top contributor', () => {
    // Source: the report's definitions (docs/linearity.md, "The verdict at an output").
    const [first] = linearityTables(report);
    expect(first!.title).toContain('Linearity at out');
    const verdict = linearityVerdict(report);
    expect(text.endsWith(verdict)).toBe(true);
    expect(verdict).toMatch(/^Linear enough at out: error bound /);
    expect(verdict).toContain(`${Number((100 * report.output!.secondHarmonic).toPrecision(4))} %`);
    expect(verdict).toContain('most of it from Q1');
    expect(verdict).toContain(String(Number(report.maxInputScale.toPrecision(4))));
  });

  it('keeps the junction rows, the reverse-biased one described, not condemned', () => {
    expect(text).toContain('curved (reverse-biased)');
    expect(text).not.toContain('OVER BUDGET');
  });

  it('says "not linear enough" at the output when its bound exceeds the budget', () => {
    const tight = linearity(ac, { output: 'out', budget: 1e-4 });
    expect(linearityVerdict(tight)).toMatch(/^Not linear enough at out/);
    expect(formatLinearity(tight)).toContain('OVER BUDGET');
  });
});
