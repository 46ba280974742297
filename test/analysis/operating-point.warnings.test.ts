import { describe, expect, it } from 'vitest';
import { Circuit, formatOperatingPoint, GROUND, operatingPoint } from '../../src/index.js';

describe('the warnings of an operating point', () => {
  // A silicon junction at milliamp currents sits near 0.6–0.7 V (common practice, no source): far
  // inside the exponential's range, so a sensible bias network raises no warning.
  it('are empty for a diode biased through a resistor', () => {
    const op = operatingPoint(
      new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 5 })
        .resistor('R1', 'a', 'b', '1k')
        .diode('D1', 'b', GROUND),
    );
    expect(op.warnings).toEqual([]);
  });

  // 5 V forced across a junction is 194.6·Vt at 298.15 K (Vt = 25.69 mV, k·T/q with the SI 2019
  // constants): beyond the limit of 80·n·Vt, so the answer is the continued model's and says so.
  it('name a junction forced beyond the exponential limit', () => {
    const op = operatingPoint(
      new Circuit().voltageSource('supply', 'a', GROUND, { dc: 5 }).diode('D1', 'a', GROUND),
    );
    expect(op.warnings).toHaveLength(1);
    expect(op.warnings[0]).toMatch(/pn junction of 'D1' at 195·n·Vt/);
    expect(formatOperatingPoint(op)).toContain(`Warning: ${op.warnings[0]}`);
  });

  it('read a pnp junction in its forward sense', () => {
    const pnp = (vbe: number) =>
      operatingPoint(
        new Circuit()
          .voltageSource('emitterBias', 'e', GROUND, { dc: 0 })
          .voltageSource('baseBias', 'b', GROUND, { dc: vbe })
          .voltageSource('collectorBias', 'c', GROUND, { dc: -10 })
          .bjt('Q1', { collector: 'c', base: 'b', emitter: 'e' }, { polarity: 'pnp' }),
      );
    expect(pnp(3).warnings).toEqual([]); // base-emitter reverse-biased by 3 V
    expect(pnp(-3).warnings.some((w) => w.startsWith("base-emitter junction of 'Q1'"))).toBe(true);
  });
});
