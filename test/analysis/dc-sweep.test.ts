import { describe, expect, it } from 'vitest';
import { Circuit, dcSweep, GROUND, operatingPoint, thermalVoltage } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { diodeSeriesResistorSolution } from '../support/diode-series-resistor.js';
import { thrown } from '../support/quiescent-error.js';

const saturationCurrent = 1e-14;
/** The reference has no junction conductance; tight tolerances make the comparison exact. */
const EXACT = { junctionConductance: 1e-30, relativeTolerance: 1e-12 };

function loop(): Circuit {
  return new Circuit()
    .voltageSource('supply', 'in', GROUND, { dc: 5 })
    .resistor('R1', 'in', 'a', '1k')
    .diode('D1', 'a', GROUND, { saturationCurrent });
}

function lambert(supply: number, resistance: number, temperature = 298.15) {
  // Banwell & Jayakumar, Electronics Letters 36(4), 2000: the exact diode-resistor loop.
  return diodeSeriesResistorSolution({
    supply,
    resistance,
    saturationCurrent,
    emissionCoefficient: 1,
    thermalVoltage: thermalVoltage(temperature),
  });
}

describe('dcSweep over a source value', () => {
  it('follows the exact diode-resistor solution at every supply value', () => {
    const values = [0.5, 1, 2, 5, 10, 20, 50];
    const sweep = dcSweep(loop(), { source: 'supply', values, ...EXACT });
    expect(Array.from(sweep.values)).toEqual(values);
    expect(sweep.points).toHaveLength(values.length);
    const va = sweep.voltage('a');
    const i = sweep.current('R1');
    values.forEach((v, k) => {
      const ref = lambert(v, 1000);
      expectRelativelyClose(va[k]!, ref.junctionVoltage, 1e-10, `voltage at a at ${v} V`);
      expectRelativelyClose(i[k]!, ref.current, 1e-10, `current at ${v} V`);
      // The supply delivers the loop current (passive sign convention: negative through it).
      expectRelativelyClose(sweep.current('supply')[k]!, -ref.current, 1e-10, `supply current at ${v} V`);
    });
  });

  it('takes fewer iterations by continuation than solving every point from zero', () => {
    // Common practice, no source: a warm start near the answer needs fewer Newton steps.
    const values = Array.from({ length: 21 }, (_, k) => 0.25 * k + 1);
    const sweep = dcSweep(loop(), { source: 'supply', values });
    const cold = values.reduce((sum, v) => {
      const c = new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: v })
        .resistor('R1', 'in', 'a', '1k')
        .diode('D1', 'a', GROUND, { saturationCurrent });
      return sum + operatingPoint(c).iterations;
    }, 0);
    expect(sweep.iterations).toBeLessThan(cold);
  });

  it('keeps each point its own source value (a current source reads back its value)', () => {
    const c = new Circuit().currentSource('bias', GROUND, 'a', { dc: 1e-3 }).diode('D1', 'a', GROUND);
    const sweep = dcSweep(c, { source: 'bias', values: new Float64Array([1e-6, 1e-4, 1e-2]) });
    expect(Array.from(sweep.current('bias'))).toEqual([1e-6, 1e-4, 1e-2]);
    // Shockley: the voltage rises by Vt·ln 100 per two decades of current (from memory, any textbook).
    const v = sweep.voltage('a');
    const vt = thermalVoltage(298.15);
    expect(v[1]! - v[0]!).toBeCloseTo(vt * Math.log(100), 4);
    expect(sweep.points[0]!.current('bias')).toBe(1e-6);
  });

  it('leaves the circuit unchanged', () => {
    const c = loop();
    dcSweep(c, { source: 'supply', values: [1, 2] });
    const record = c.element('supply');
    expect(record?.kind === 'voltage-source' && record.dc).toBe(5);
    expect(operatingPoint(c).voltage('in')).toBe(5);
  });

  it('keeps a fixed temperature given with the sweep', () => {
    const sweep = dcSweep(loop(), { source: 'supply', values: [1, 2], temperature: 350 });
    expect(sweep.points.map((p) => p.temperature)).toEqual([350, 350]);
  });
});

describe('dcSweep over an element parameter', () => {
  it('follows the exact solution as the series resistance steps', () => {
    const values = [100, 470, 1e3, 4.7e3, 1e4];
    const sweep = dcSweep(loop(), { element: 'R1', parameter: 'resistance', values, ...EXACT });
    expect(sweep.swept).toEqual({ kind: 'parameter', element: 'R1', parameter: 'resistance' });
    const va = sweep.voltage('a');
    values.forEach((r, k) => {
      expectRelativelyClose(va[k]!, lambert(5, r).junctionVoltage, 1e-10, `voltage at a at R = ${r}`);
    });
  });

  it('sweeps a model parameter, even one that adds an internal node', () => {
    const values = [0, 10, 100];
    const sweep = dcSweep(loop(), { element: 'D1', parameter: 'seriesResistance', values, ...EXACT });
    values.forEach((rs, k) => {
      const ref = lambert(5, 1000 + rs);
      const d = sweep.device('D1')[k]!;
      expect(d.kind).toBe('diode');
      expectRelativelyClose(
        sweep.points[k]!.diode('D1').current,
        ref.current,
        1e-10,
        `current at R_S = ${rs}`,
      );
    });
  });

  it('treats the dc of a source as a source sweep', () => {
    const sweep = dcSweep(loop(), { element: 'supply', parameter: 'dc', values: [1, 2] });
    expect(sweep.swept).toEqual({ kind: 'source', element: 'supply' });
    expect(Array.from(sweep.voltage('in'))).toEqual([1, 2]);
  });
});

describe('dcSweep over temperature', () => {
  it('solves each point at its own temperature and thermal voltage', () => {
    const values = [250, 298.15, 350, 400];
    const sweep = dcSweep(loop(), { temperature: values, ...EXACT });
    expect(sweep.swept).toEqual({ kind: 'temperature' });
    sweep.points.forEach((p, k) => {
      expect(p.thermalVoltage).toBe(thermalVoltage(values[k]!));
    });
    // At the reference temperature I_S is unchanged, so Banwell & Jayakumar (2000) applies as is.
    expectRelativelyClose(
      sweep.voltage('a')[1]!,
      lambert(5, 1000).junctionVoltage,
      1e-10,
      'voltage at a at Tref',
    );
    // Common practice, no source: the forward voltage falls as the temperature rises.
    const v = sweep.voltage('a');
    for (let k = 1; k < v.length; k++) expect(v[k]!).toBeLessThan(v[k - 1]!);
  });
});

describe('dcSweep checks its options', () => {
  it('names an unknown source or element', () => {
    const e = thrown(() => dcSweep(loop(), { source: 'absentSource', values: [1] }));
    expect(e.code).toBe('unknown-element');
    expect(e.message).toContain('absentSource');
    expect(thrown(() => dcSweep(loop(), { element: 'R9', parameter: 'resistance', values: [1] })).code).toBe(
      'unknown-element',
    );
  });

  it('refuses to sweep an element that is not a source as a source', () => {
    const e = thrown(() => dcSweep(loop(), { source: 'R1', values: [1] }));
    expect(e.code).toBe('unknown-element');
    expect(e.message).toContain('R1');
  });

  it('rejects options that name two sweeps at once', () => {
    const both = { source: 'supply', element: 'R1', parameter: 'resistance', values: [1] };
    expect(thrown(() => dcSweep(loop(), both)).code).toBe('invalid-value');
  });

  it('rejects empty and non-finite values', () => {
    expect(thrown(() => dcSweep(loop(), { source: 'supply', values: [] })).code).toBe('invalid-value');
    const e = thrown(() => dcSweep(loop(), { source: 'supply', values: [1, Number.NaN] }));
    expect(e.code).toBe('invalid-value');
    expect(e.details).toMatchObject({ path: ['options', 'values', 1] });
    expect(thrown(() => dcSweep(loop(), { temperature: [300, Number.POSITIVE_INFINITY] })).code).toBe(
      'invalid-value',
    );
    expect(thrown(() => dcSweep(loop(), { temperature: [0] })).code).toBe('invalid-value');
  });

  it('rejects an unknown parameter and a value out of its range, naming the element', () => {
    const unknown = thrown(() => dcSweep(loop(), { element: 'R1', parameter: 'colour', values: [1] }));
    expect(unknown.code).toBe('invalid-value');
    expect(unknown.message).toContain('R1');
    const negative = thrown(() =>
      dcSweep(loop(), { element: 'R1', parameter: 'resistance', values: [1e3, -1] }),
    );
    expect(negative.code).toBe('invalid-value');
    expect(negative.message).toContain('R1');
    const model = thrown(() =>
      dcSweep(loop(), { element: 'D1', parameter: 'saturationCurrent', values: [0] }),
    );
    expect(model.details).toMatchObject({ path: ['D1', 'model', 'saturationCurrent'] });
  });

  it('says at which value the operating point could not be found', () => {
    const e = thrown(() => dcSweep(loop(), { source: 'supply', values: [1, 2], maxIterations: 1 }));
    expect(e.code).toBe('no-convergence');
    expect(e.message).toContain('supply = 1 V');
  });

  it('answers for every node and element as an operating point does', () => {
    const sweep = dcSweep(loop(), { source: 'supply', values: [1] });
    expect(thrown(() => sweep.voltage('nowhere')).code).toBe('unknown-node');
    expect(thrown(() => sweep.current('nothing')).code).toBe('unknown-element');
    const values = sweep.values;
    values[0] = 99;
    expect(sweep.values[0]).toBe(1);
  });
});
