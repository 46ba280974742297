/**
 * Bad input is refused at the boundary with a QuiescentError naming where it was given: sweep
 * parameter names that only Object's prototype knows, a bad fixed temperature of a sweep, subnormal
 * and absurd magnitudes (docs/building-circuits.md, "Values"), and grids too large or out of range.
 */
import { describe, expect, it } from 'vitest';
import {
  acAnalysis,
  Circuit,
  dcSweep,
  GROUND,
  linearSweep,
  logSweep,
  operatingPoint,
} from '../../src/index.js';
import { thrown } from '../support/quiescent-error.js';

const divider = () =>
  new Circuit()
    .voltageSource('supply', 'in', GROUND, { dc: 5 })
    .resistor('upper', 'in', 'mid', '1k')
    .resistor('lower', 'mid', GROUND, '1k');

describe('dcSweep', () => {
  it("refuses parameter names that only Object's prototype knows", () => {
    for (const parameter of ['toString', '__proto__', 'constructor', 'valueOf', 'hasOwnProperty']) {
      const e = thrown(() => dcSweep(divider(), { element: 'upper', parameter, values: [1e3, 2e3] }));
      expect(e.code).toBe('invalid-value');
      expect(e.details).toMatchObject({ path: ['options', 'parameter'], value: parameter });
    }
  });

  it('refuses a bad fixed temperature of a source sweep instead of using the default', () => {
    for (const temperature of ['350', null]) {
      const e = thrown(() =>
        dcSweep(divider(), { source: 'supply', values: [1, 2], temperature: temperature as never }),
      );
      expect(e.code).toBe('invalid-value');
      expect(e.details).toMatchObject({ path: ['options', 'temperature'] });
    }
  });
});

describe('magnitudes', () => {
  it('refuses a subnormal Early voltage, which gave NaN in g_m, r_o and C_π', () => {
    const e = thrown(() =>
      new Circuit().bjt(
        'Q1',
        { collector: 'c', base: 'b', emitter: GROUND },
        { polarity: 'npn', earlyVoltage: 5e-324 },
      ),
    );
    expect(e.code).toBe('invalid-value');
    expect(e.details).toMatchObject({ path: ['Q1', 'model', 'earlyVoltage'], value: 5e-324 });
  });

  it('refuses element values beyond 1e60 and below 1e-60, and keeps 0 where it is allowed', () => {
    expect(thrown(() => new Circuit().resistor('R1', 'a', GROUND, 1e61)).code).toBe('invalid-value');
    expect(thrown(() => new Circuit().capacitor('C1', 'a', GROUND, 1e-61)).code).toBe('invalid-value');
    expect(thrown(() => new Circuit().voltageSource('drive', 'a', GROUND, { dc: 1, ac: 1e307 })).code).toBe(
      'invalid-value',
    );
    expect(() => new Circuit().capacitor('C1', 'a', GROUND, 0)).not.toThrow();
    expect(() => new Circuit().resistor('R1', 'a', GROUND, 1e-15)).not.toThrow();
  });

  it('reports an infinite r_o, never −Infinity, when both junctions are so far off that g_o underflows', () => {
    const circuit = new Circuit()
      .voltageSource('collectorDrive', 'c', GROUND, { dc: -200 })
      .voltageSource('baseDrive', 'b', GROUND, { dc: -100 })
      .bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, { polarity: 'npn', earlyVoltage: 50 });
    const q = operatingPoint(circuit).bjt('Q1');
    expect(q.ro).not.toBe(Number.NEGATIVE_INFINITY);
    expect(Number.isNaN(q.ro)).toBe(false);
    for (const value of [q.gm, q.rpi, q.cpi, q.cmu, q.ic, q.ib]) expect(Number.isNaN(value)).toBe(false);
  });
});

describe('frequency grids', () => {
  it('refuse grids of more than a million points with a clear error, not a RangeError', () => {
    expect(thrown(() => logSweep(1, 10, 1e15)).details).toMatchObject({ path: ['pointsPerDecade'] });
    expect(thrown(() => linearSweep(0, 1, 1e10)).details).toMatchObject({ path: ['count'] });
  });

  it('span any range of finite numbers without overflow', () => {
    // 600 decades at 0.01 per decade: six intervals of 100 decades.
    expect(Array.from(logSweep(1e-300, 1e300, 0.01))).toEqual([
      1e-300, 1e-200, 1e-100, 1, 1e100, 1e200, 1e300,
    ]);
    expect(Array.from(linearSweep(-1e308, 1e308, 3))).toEqual([-1e308, 0, 1e308]);
  });

  it('refuse frequencies above 1e20 Hz instead of reporting a singular circuit', () => {
    const op = operatingPoint(
      new Circuit().voltageSource('drive', 'a', GROUND, { ac: 1 }).capacitor('C1', 'a', GROUND, '1n'),
    );
    const e = thrown(() => acAnalysis(op, { frequencies: [1e300] }));
    expect(e.code).toBe('invalid-value');
    expect(e.details).toMatchObject({ path: ['frequencies', 0] });
  });
});
