import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { acTable, formatAcAnalysis } from '../../src/report/ac-table.js';

// RC low-pass, 10 kΩ and 10 nF: f_c = 1591.55 Hz, −3.01 dB and −45° there; −20.04 dB and −84.3° a decade
// above (Horowitz & Hill, The Art of Electronics, 3rd ed., 2015, §1.7; from memory).
const fc = 1 / (2 * Math.PI * 10e3 * 10e-9);
const ac = acAnalysis(
  operatingPoint(
    new Circuit()
      .voltageSource('input', 'in', GROUND, { ac: 1 })
      .resistor('R', 'in', 'out', '10k')
      .capacitor('C', 'out', GROUND, '10n'),
  ),
  { frequencies: [fc, 10 * fc] },
);

describe('formatAcAnalysis', () => {
  it('lists every node’s peak magnitude and phase at each frequency by default', () => {
    const table = acTable(ac);
    expect(table.columns.map((c) => c.header)).toEqual(['frequency', '|in|', '∠in', '|out|', '∠out']);
    // 1/√2 V = 707.1 mV at the corner.
    expect(table.rows[0]).toEqual(['1.592 kHz', '1 V', '0.0°', '707.1 mV', '-45.0°']);
  });

  it('shows gains in dB against an input, with currents as well as voltages', () => {
    const table = acTable(ac, { outputs: ['out', { element: 'R' }], input: 'in' });
    expect(table.columns.map((c) => c.header)).toEqual([
      'frequency',
      'out ÷ in',
      '∠out ÷ in',
      'current in R ÷ in',
      '∠current in R ÷ in',
    ]);
    expect(table.rows[1]!.slice(0, 3)).toEqual(['15.92 kHz', '-20.04 dB', '-84.3°']);
  });

  it('renders the table as aligned text with a title', () => {
    const lines = formatAcAnalysis(ac, { outputs: ['out'] }).split('\n');
    expect(lines[0]).toBe('Small-signal response (peak phasors)');
    expect(lines).toHaveLength(5);
  });
});
