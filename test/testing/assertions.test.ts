import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { assertDeviceRegion, assertElementCurrent, assertNodeVoltage } from '../../src/testing/index.js';
import { failure } from './assertion-failure.js';

// 10 V across 1 kΩ and 4 kΩ: 8 V at the tap, 2 mA through both (Ohm's law; common practice, no source).
const divider = operatingPoint(
  new Circuit()
    .voltageSource('input', 'in', GROUND, { dc: 10 })
    .resistor('Rtop', 'in', 'tap', '1k')
    .resistor('Rbottom', 'tap', GROUND, '4k'),
);

describe('assertNodeVoltage', () => {
  it('passes within an absolute tolerance, given as a number or with a unit', () => {
    assertNodeVoltage(divider, 'tap', 8.004, { absolute: 0.005 });
    assertNodeVoltage(divider, 'tap', '8004 mV', { absolute: '5 mV' });
  });

  it('fails outside it with the node, expected value, tolerance, actual value and deviation', () => {
    const error = failure(() => assertNodeVoltage(divider, 'tap', '7.9 V', { absolute: '50 mV' }));
    expect(error.message).toBe('tap: expected 7.9 V ± 50 mV, actual 8 V (off by +100 mV)');
    expect(error.expected).toBe(7.9);
    expect(error.actual).toBeCloseTo(8, 12);
  });

  it('scales a relative tolerance with the expected value and says so', () => {
    assertNodeVoltage(divider, 'tap', 8.07, { relative: 0.01 });
    const error = failure(() => assertNodeVoltage(divider, 'tap', 8.1, { relative: 0.01 }));
    expect(error.message).toBe('tap: expected 8.1 V ± 81 mV (±1 %), actual 8 V (off by -100 mV)');
  });

  it('allows the larger of an absolute and a relative tolerance', () => {
    // At 0 V a relative tolerance allows nothing; the absolute one still applies.
    assertNodeVoltage(divider, 'tap', 7.95, { absolute: '60 mV', relative: 0.001 });
    const error = failure(() =>
      assertNodeVoltage(divider, 'tap', 7.9, { absolute: '60 mV', relative: 0.001 }),
    );
    expect(error.message).toContain('± 60 mV (±60 mV or ±0.1 %, whichever is larger)');
  });

  it('measures against a reference node when asked', () => {
    assertNodeVoltage(divider, 'in', 2, { absolute: 1e-9, reference: 'tap' });
    expect(
      failure(() => assertNodeVoltage(divider, 'in', 3, { absolute: 1e-3, reference: 'tap' })).message,
    ).toMatch(/^in − tap: expected 3 V/);
  });

  it('rejects a tolerance with neither allowance, or a negative one', () => {
    expect(() => assertNodeVoltage(divider, 'tap', 8, {})).toThrow(
      expect.objectContaining({ code: 'invalid-value' }),
    );
    expect(() => assertNodeVoltage(divider, 'tap', 8, { relative: -0.1 })).toThrow(
      expect.objectContaining({ code: 'invalid-value' }),
    );
    expect(() => assertNodeVoltage(divider, 'tap', '8 A', { absolute: 1 })).toThrow(
      expect.objectContaining({ code: 'invalid-value' }),
    );
  });

  it('lets an unknown node through as the library’s own error', () => {
    expect(() => assertNodeVoltage(divider, 'nowhere', 8, { absolute: 1 })).toThrow(
      expect.objectContaining({ code: 'unknown-node' }),
    );
  });
});

describe('assertElementCurrent', () => {
  it('passes and fails by the sign conventions of docs/building-circuits.md', () => {
    assertElementCurrent(divider, 'Rtop', '2 mA', { relative: 1e-9 });
    // The source delivers power, so its current is −2 mA.
    const error = failure(() => assertElementCurrent(divider, 'input', '2 mA', { relative: 0.05 }));
    expect(error.message).toBe(
      'current in input: expected 2 mA ± 100 µA (±5 %), actual -2 mA (off by -4 mA)',
    );
  });
});

describe('assertDeviceRegion', () => {
  // Base at 0.7 V and collector fed through 1 kΩ from 5 V: forward-active. A 100 kΩ collector resistor
  // drops the collector below the base: saturation (Sedra & Smith, Microelectronic Circuits, 7th ed.,
  // 2015, Table 6.2).
  const stage = (collectorResistance: string) =>
    operatingPoint(
      new Circuit()
        .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
        .voltageSource('baseBias', 'base', GROUND, { dc: 0.7 })
        .resistor('Rc', 'vcc', 'collector', collectorResistance)
        .bjt('Q1', { collector: 'collector', base: 'base', emitter: GROUND }, { polarity: 'npn' }),
    );

  it('passes for the region the transistor is in', () => {
    assertDeviceRegion(stage('1k'), 'Q1', 'forward-active');
    assertDeviceRegion(stage('100k'), 'Q1', 'saturation');
  });

  it('fails with the region found and the junction voltages that decided it', () => {
    const error = failure(() => assertDeviceRegion(stage('100k'), 'Q1', 'forward-active'));
    expect(error.message).toMatch(
      /^region of Q1: expected forward-active, actual saturation \(vbe 700 mV, vbc [\d.]+ mV\)$/,
    );
  });
});
