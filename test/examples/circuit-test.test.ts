import { describe, expect, it } from 'vitest';
import { acceptanceTest, TEMPERATURES, tooStrictCheck } from '../../examples/circuit-test.js';

describe('examples/circuit-test', () => {
  it('passes all four checks at every temperature from 0 °C to 70 °C', () => {
    // 0 °C = 273.15 K and 70 °C = 343.15 K (BIPM, SI Brochure, 9th ed., 2019, §2.3.1).
    expect(TEMPERATURES[0]).toBe(273.15);
    expect(TEMPERATURES[TEMPERATURES.length - 1]).toBe(343.15);
    // Four checks at each of the 8 temperatures, counted by hand (common practice, no source).
    expect(acceptanceTest()).toBe(4 * TEMPERATURES.length);
  });

  it('shows a failure that names the node, the expectation, the tolerance and the actual value', () => {
    expect(tooStrictCheck()).toMatch(
      /^collector: expected 6 V ± 10 mV, actual [\d.]+ V \(off by [-+][\d.]+ m?V\)$/,
    );
  });
});
