/**
 * The linearity matchers: the output verdict, and a junction check that says when a failing junction
 * is reverse-biased and harmless.
 */
import { describe, expect, it } from 'vitest';
import { acAnalysis, linearity, operatingPoint } from '../../src/index.js';
import {
  assertJunctionWithinBudget,
  assertOutputWithinBudget,
  type QuiescentMatchers,
  quiescentMatchers,
} from '../../src/testing/index.js';
import { commonEmitterStage } from '../support/linearity-circuits.js';
import { failure } from './assertion-failure.js';

declare module 'vitest' {
  // biome-ignore lint/suspicious/noExplicitAny: the type parameter must match vitest's own declaration.
  interface Matchers<T = any> extends QuiescentMatchers<T> {}
}

expect.extend(quiescentMatchers);

// A degenerated common-emitter stage at 10 mV: about 0.09 % 2nd harmonic at the output (the large-signal
// check agrees, test/analysis/linearity-output.test.ts), while its base-collector junction, reverse-biased,
// swings far over its own budget.
const report = (budget?: number) =>
  linearity(acAnalysis(operatingPoint(commonEmitterStage(0.01, 220)), { frequencies: [10e3] }), {
    output: 'out',
    ...(budget === undefined ? {} : { budget }),
  });

describe('assertOutputWithinBudget and toHaveOutputWithinBudget', () => {
  it('pass where the output stays within its budget', () => {
    assertOutputWithinBudget(report());
    expect(report()).toHaveOutputWithinBudget({ budget: 0.01 });
    expect(report()).not.toHaveOutputWithinBudget({ budget: 1e-4 });
  });

  it('fail naming the output, the figures and the device that contributes most', () => {
    const error = failure(() => assertOutputWithinBudget(report(), { budget: 1e-4 }));
    expect(error.message).toMatch(
      /^linearity at v\(out\): expected error bound ≤ 0\.0001, actual 0\.000\d+ at 10 kHz \(2nd harmonic 0\.0\d+ %, 3rd .* %, compression -.* %, mean shift 0 %; most from Q1\)$/,
    );
  });

  it('refuse a report taken without an output', () => {
    const plain = linearity(
      acAnalysis(operatingPoint(commonEmitterStage(0.01, 220)), { frequencies: [10e3] }),
    );
    expect(() => assertOutputWithinBudget(plain)).toThrow(expect.objectContaining({ code: 'invalid-value' }));
  });
});

describe('the junction check of a reverse-biased junction', () => {
  it('says that the junction is reverse-biased and gives its share of the output', () => {
    const error = failure(() => assertJunctionWithinBudget(report(), 'Q1', { junction: 'base-collector' }));
    expect(error.message).toMatch(
      /^linearity of Q1 \(base-collector\): expected error bound ≤ 0\.1, actual .* it is reverse-biased \(-\d[\d.]* V\), so its current is too small to matter: judge the output instead/,
    );
  });
});
