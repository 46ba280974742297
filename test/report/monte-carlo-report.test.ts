import { describe, expect, it } from 'vitest';
import {
  Circuit,
  formatMonteCarlo,
  formatWorstCase,
  GROUND,
  histogramSvg,
  monteCarlo,
  monteCarloTable,
  QuiescentError,
  worstCase,
} from '../../src/index.js';

const divider = () =>
  new Circuit()
    .voltageSource('supply', 'top', GROUND, { dc: 10 })
    .resistor('upper', 'top', 'out', '3k')
    .resistor('lower', 'out', GROUND, '1k');
const tolerances = [{ element: { kind: 'resistor' as const }, parameter: 'resistance', relative: 0.05 }];

describe('the Monte Carlo reports', () => {
  it('tabulate every measure with its statistics and yield', async () => {
    const mc = await monteCarlo(divider(), { samples: 300, seed: 4, tolerances, measures: { out: 'out' } });
    const table = monteCarloTable(mc, { units: { out: 'V' }, specs: { out: { min: 2.45, max: 2.55 } } });
    expect(table.rows).toHaveLength(1);
    const row = table.rows[0]!;
    expect(row[0]).toBe('out');
    expect(row[1]).toBe('300/300');
    expect(row[2]).toMatch(/ V$/);
    const y = mc.yield({ out: { min: 2.45, max: 2.55 } });
    expect(row[11]).toBe(
      `${(100 * y.fraction).toFixed(1)} % (${(100 * y.low).toFixed(1)}–${(100 * y.high).toFixed(1)})`,
    );
    expect(formatMonteCarlo(mc)).toContain('seed 4');
  });

  it('draw a histogram whose bars hold every solved sample, with the limits marked', async () => {
    const mc = await monteCarlo(divider(), { samples: 400, seed: 4, tolerances, measures: { out: 'out' } });
    const svg = histogramSvg(mc, 'out', { unit: 'V', spec: { min: 2.45, max: 2.55 }, bins: 20 });
    expect(svg.startsWith('<svg')).toBe(true);
    const counts = [...svg.matchAll(/: (\d+)<\/title>/g)].map((m) => Number(m[1]));
    expect(counts.reduce((a, b) => a + b, 0)).toBe(400);
    expect(svg).toContain('class="spec-min"');
    expect(svg).toContain('class="spec-max"');
    expect(svg).toContain('yield');
    expect(() => histogramSvg(mc, 'missing')).toThrow(QuiescentError);
  });

  it('list the worst case with the parameter values at each end', () => {
    const wc = worstCase(divider(), { tolerances, measures: { out: 'out' } });
    const text = formatWorstCase(wc, { units: { out: 'V' } });
    expect(text).toContain('upper.resistance = 2.85 k');
    expect(text).toContain('lower.resistance = 1.05 k');
  });
});
