import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { type QuiescentMatchers, quiescentMatchers } from '../../src/testing/index.js';

declare module 'vitest' {
  // biome-ignore lint/suspicious/noExplicitAny: the type parameter must match vitest's own declaration.
  interface Matchers<T = any> extends QuiescentMatchers<T> {}
}

expect.extend(quiescentMatchers);

// vgs = 2 V with the default Vth0 = 0.7 V and β = 1 mA/V²: id = ½·β·(1.3 V)² = 845 µA, so the drain
// sits at 5 V − 845 µA · 2 kΩ = 3.31 V, in saturation (Shichman & Hodges, IEEE J. Solid-State
// Circuits 3(3), 1968, square law).
const op = operatingPoint(
  new Circuit()
    .voltageSource('supply', 'vdd', GROUND, { dc: 5 })
    .voltageSource('gateBias', 'gate', GROUND, { dc: 2 })
    .resistor('Rd', 'vdd', 'drain', '2k')
    .mosfet('amplifier', { drain: 'drain', gate: 'gate', source: GROUND }, { polarity: 'nmos' }),
);

/** The message of a failing expectation. */
function messageOf(expectation: () => void): string {
  try {
    expectation();
  } catch (e) {
    return (e as Error).message;
  }
  throw new Error('the expectation passed');
}

describe('quiescentMatchers', () => {
  it('check node voltages, element currents and regions', () => {
    expect(op).toHaveNodeVoltage('drain', '3.31 V', { absolute: '1 mV' });
    expect(op).toHaveElementCurrent('Rd', '845 µA', { relative: 1e-6 });
    expect(op).toHaveDeviceRegion('amplifier', 'saturation');
    expect(op).not.toHaveDeviceRegion('amplifier', 'triode');
  });

  it('fail with the node, expected value, tolerance and actual value', () => {
    expect(messageOf(() => expect(op).toHaveNodeVoltage('drain', 3.2, { absolute: 0.01 }))).toBe(
      'drain: expected 3.2 V ± 10 mV, actual 3.31 V (off by +110 mV)',
    );
  });

  it('say "not" when a negated expectation fails', () => {
    expect(
      messageOf(() => expect(op).not.toHaveElementCurrent('Rd', '845 µA', { absolute: '1 µA' })),
    ).toMatch(/^current in Rd: expected not 845 µA ± 1 µA, actual 845 µA \(off by [-+]?[\d.]+ [pf]?A\)$/);
  });

  it('name the region and the bias of a MOSFET in the wrong region', () => {
    expect(messageOf(() => expect(op).toHaveDeviceRegion('amplifier', 'triode'))).toBe(
      'region of amplifier: expected triode, actual saturation (vgs 2 V, vds 3.31 V, Vth 700 mV)',
    );
  });

  it('reject anything but an operating point', () => {
    expect(() => expect({ voltage: 1 }).toHaveNodeVoltage('out', 1, { absolute: 1 })).toThrow(
      /toHaveNodeVoltage expects an OperatingPoint from operatingPoint\(\), received Object/,
    );
  });
});
