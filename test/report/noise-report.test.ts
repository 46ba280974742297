/**
 * The noise reports: the text tables (density per decade, largest contributors with their share of
 * the power), the SVG spectrum and the JSON form, on a divider with a hold capacitor whose noise is
 * known in closed form (4kT·R1∥R2 below the pole, Johnson 1928 and Nyquist 1928).
 */
import { describe, expect, it } from 'vitest';
import {
  BOLTZMANN,
  Circuit,
  formatNoise,
  GROUND,
  logSweep,
  noise,
  noisePlotSvg,
  noiseTables,
  operatingPoint,
} from '../../src/index.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

const circuit = new Circuit()
  .voltageSource('sensor', 'in', GROUND, { dc: 1, ac: 1 })
  .resistor('source', 'in', 'out', '1k')
  .resistor('bias', 'out', GROUND, '3k')
  .capacitor('hold', 'out', GROUND, '1n');
const op = operatingPoint(circuit);
const nz = noise(op, {
  output: 'out',
  frequencies: logSweep(10, 1e7, 10),
  input: 'sensor',
  sourceResistor: 'source',
});

describe('noiseTables', () => {
  it('lists the density at each decade and the contributors with their shares of the power', () => {
    const [densities, contributors] = noiseTables(nz, { digits: 3 });
    expect(densities!.rows.map((r) => r[0])).toEqual([
      '10 Hz',
      '100 Hz',
      '1 kHz',
      '10 kHz',
      '100 kHz',
      '1 MHz',
      '10 MHz',
    ]);
    // Below the pole: √(4kT·750 Ω) = 3.53 nV/√Hz at 300.15 K.
    const flat = Math.sqrt(4 * BOLTZMANN * op.temperature * 750);
    expect(densities!.rows[0]![1]).toBe(`${(flat * 1e9).toFixed(2)} nV`);
    // The source resistor's noise current is 3 times the bias resistor's power: 75 % and 25 %.
    expect(contributors!.rows).toEqual([
      ['source thermal', expect.any(String), '75.0 %'],
      ['bias thermal', expect.any(String), '25.0 %'],
    ]);
    expect(densities!.rows[0]![3]).toBe('1.25 dB'); // 10·log10(4/3): the source's share is 3/4
  });

  it('renders the tables as text and refuses a bad count of contributors', () => {
    const text = formatNoise(nz, { top: 1 });
    expect(text).toContain('Largest contributors');
    expect(text).not.toContain('bias thermal');
    expectQuiescentError(() => noiseTables(nz, { top: 0 }), 'invalid-value', 'top');
  });
});

describe('noisePlotSvg', () => {
  it('draws the total and the top contributors on log axes, at the output or referred to the input', () => {
    const svg = noisePlotSvg(nz);
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg).toContain('source thermal');
    expect(svg).toContain('Noise density at the output');
    expect(noisePlotSvg(nz, { referred: 'input', top: 1 })).toContain('referred to sensor');
  });
  it('refuses an input-referred plot without an input', () => {
    const bare = noise(op, { output: 'out', frequencies: [1, 10] });
    expectQuiescentError(() => noisePlotSvg(bare, { referred: 'input' }), 'invalid-value', 'referred');
  });
});

describe('Noise.toJSON', () => {
  it('writes the densities, the input-referred density, the noise figure and the contributions as arrays', () => {
    const json = JSON.parse(JSON.stringify(nz));
    expect(json.output).toBe('out');
    expect(json.frequencies).toEqual(Array.from(nz.frequencies));
    expect(json.outputDensity).toEqual(Array.from(nz.outputDensity));
    expect(json.input.source).toBe('sensor');
    expect(json.noiseFigure.sourceResistor).toBe('source');
    expect(json.contributions.map((c: { element: string }) => c.element)).toEqual(['source', 'bias']);
  });
});
