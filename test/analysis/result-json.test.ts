import { describe, expect, it } from 'vitest';
import {
  acAnalysis,
  acAnalysisToJson,
  Circuit,
  dcSweep,
  formatDcSweep,
  GROUND,
  linearity,
  linearSweep,
  operatingPoint,
} from '../../src/index.js';

// A divider fed through a coupling capacitor into a biased diode: every result kind has something to show.
function biasedDiode(): Circuit {
  return new Circuit()
    .voltageSource('bias', 'supply', GROUND, { dc: 3 })
    .resistor('Rbias', 'supply', 'anode', '2.2k')
    .diode('D1', 'anode', GROUND)
    .voltageSource('signal', 'sig', GROUND, { ac: '2m' })
    .capacitor('Cc', 'sig', 'anode', '1µ');
}

describe('the JSON forms of results', () => {
  // Ohm's law on the bias resistor at each point (common practice, no source): the JSON carries the
  // same numbers as the accessors, as plain arrays.
  it('write a DC sweep as plain arrays per node and element', () => {
    const sweep = dcSweep(biasedDiode(), { source: 'bias', values: [1, 2, 3] });
    const json = JSON.parse(JSON.stringify(sweep));
    expect(json.swept).toEqual({ kind: 'source', element: 'bias' });
    expect(json.values).toEqual([1, 2, 3]);
    expect(json.nodes.anode).toEqual(Array.from(sweep.voltage('anode')));
    json.values.forEach((v: number, k: number) => {
      expect(json.currents.Rbias[k]).toBeCloseTo((v - json.nodes.anode[k]) / 2200, 15);
    });
  });

  it('write an AC analysis as real and imaginary arrays', () => {
    const ac = acAnalysis(operatingPoint(biasedDiode()), { frequencies: [10, 1e3] });
    const json = JSON.parse(JSON.stringify(ac));
    expect(json).toEqual(JSON.parse(JSON.stringify(acAnalysisToJson(ac))));
    expect(json.frequencies).toEqual([10, 1e3]);
    const v = ac.voltage('anode');
    expect(json.nodes.anode.re).toEqual(v.map((p) => p.re));
    expect(json.nodes.anode.im).toEqual(v.map((p) => p.im));
    expect(json.currents.D1.re).toHaveLength(2);
  });

  it('write a linearity report with arrays and null for an unlimited scale', () => {
    const ac = acAnalysis(operatingPoint(biasedDiode()), { frequencies: [1e3] });
    const report = linearity(ac);
    const json = JSON.parse(JSON.stringify(report));
    expect(json.frequencies).toEqual([1e3]);
    expect(json.junctions[0].amplitudes).toEqual([report.junctions[0]!.amplitude]);
    expect(json.maxInputScale).toBeCloseTo(report.maxInputScale, 12);

    // Without any AC drive no junction carries signal: the scale is unlimited, which JSON writes as null.
    const still = new Circuit()
      .voltageSource('bias', 'supply', GROUND, { dc: 3 })
      .resistor('Rbias', 'supply', 'anode', '2.2k')
      .diode('D1', 'anode', GROUND);
    const unlimited = linearity(acAnalysis(operatingPoint(still), { frequencies: [1e3] }));
    expect(unlimited.maxInputScale).toBe(Number.POSITIVE_INFINITY);
    expect(JSON.parse(JSON.stringify(unlimited)).maxInputScale).toBeNull();
  });
});

describe('the DC sweep table', () => {
  it('shows the swept value with its unit and one column per chosen node and element', () => {
    const sweep = dcSweep(biasedDiode(), { source: 'bias', values: linearSweep(1, 3, 3) });
    const text = formatDcSweep(sweep, { nodes: ['anode'], elements: ['Rbias'] });
    const lines = text.split('\n');
    expect(lines[0]).toBe('DC sweep of bias');
    expect(lines[1]).toMatch(/bias\s+anode\s+current in Rbias/);
    expect(lines).toHaveLength(3 + 3);
    expect(lines[3]).toMatch(/^\s*1 V\s/);
    expect(lines[5]).toMatch(/^\s*3 V\s/);
  });
});
