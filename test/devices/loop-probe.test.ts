/**
 * The loop probe as an element: a short at DC whose current is counted from `from` to `to`, a
 * current-sense point for a current-controlled source, and a record that round-trips through JSON.
 */
import { describe, expect, it } from 'vitest';
import { acAnalysis, Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { kclHolds } from '../support/kcl.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

/** A 5 V source feeding a 1 kΩ load through the probe. */
function sensed(): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 5, ac: 1 })
    .loopProbe('sense', 'vcc', 'load')
    .resistor('loadResistor', 'load', GROUND, 1e3);
}

describe('loopProbe', () => {
  it('is a short at DC carrying the current from `from` to `to`', () => {
    // Source: Ohm's law, 5 V across 1 kΩ.
    const c = sensed();
    const op = operatingPoint(c);
    expect(op.voltage('load')).toBeCloseTo(5, 12);
    expectRelativelyClose(op.current('sense'), 5e-3, 1e-12, 'probe current');
    expect(kclHolds(c, op)).toBe(true);
  });

  it('is a short in AC, with no excitation of its own', () => {
    const ac = acAnalysis(operatingPoint(sensed()), { frequencies: [1e3] });
    expectRelativelyClose(ac.voltage('load')[0]!.re, 1, 1e-12, 'voltage at load');
    expectRelativelyClose(ac.current('sense')[0]!.re, 1e-3, 1e-12, 'current in sense');
  });

  it('senses the current of a current-controlled voltage source', () => {
    // v(out) = r·i(sense) = 100 Ω · 5 mA.
    const c = sensed().ccvs('monitor', ['out', GROUND], 'sense', 100).resistor('meter', 'out', GROUND, 1e6);
    expectRelativelyClose(operatingPoint(c).voltage('out'), 0.5, 1e-12, 'monitor output');
  });

  it('round-trips through JSON', () => {
    const c = sensed();
    const again = Circuit.fromJSON(JSON.parse(JSON.stringify(c)));
    expect(again.element('sense')).toEqual({ kind: 'loop-probe', name: 'sense', from: 'vcc', to: 'load' });
  });

  it('closes a loop of voltage-defined branches with a clear error', () => {
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
      .loopProbe('sense', 'vcc', GROUND);
    expectQuiescentError(() => operatingPoint(c), 'singular', 'sense');
  });

  it('refuses an empty node name', () => {
    expectQuiescentError(() => new Circuit().loopProbe('sense', '', 'a'), 'invalid-circuit', 'sense');
  });
});
