import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { limiterKnee, limitOutput } from '../../src/devices/op-amp/op-amp-limiter.js';

// The bounds are the op-amp's output-limit rule of docs/devices.md ("Op-amp"): smooth, monotonic,
// continuously differentiable, never beyond a limit, within 1 mV of the linear value while that is
// more than 50 mV inside both limits, within 10 mV of a limit once it is 1 V or more beyond.
const out = new Float64Array(4);
const at = (u: number, low: number, high: number) => limitOutput(u, low, high, limiterKnee(low, high), out);

const limits = fc
  .tuple(fc.double({ min: -30, max: 30, noNaN: true }), fc.double({ min: 0.02, max: 60, noNaN: true }))
  .map(([low, span]) => ({ low, high: low + span }));
const oneSided = fc.oneof(
  limits,
  limits.map(({ high }) => ({ low: Number.NEGATIVE_INFINITY, high })),
  limits.map(({ low }) => ({ low, high: Number.POSITIVE_INFINITY })),
);
const PARAMETERS = { seed: 1616, numRuns: 400 };

describe('the op-amp output limiter', () => {
  it('never goes beyond either limit', () => {
    fc.assert(
      fc.property(oneSided, fc.double({ min: -1e7, max: 1e7, noNaN: true }), ({ low, high }, u) => {
        const y = at(u, low, high)[0]!;
        return y <= high && y >= low;
      }),
      PARAMETERS,
    );
  });

  it('is monotonic: a larger linear value never gives a smaller output', () => {
    fc.assert(
      fc.property(
        oneSided,
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 10, noNaN: true }),
        ({ low, high }, u, step) => at(u + step, low, high)[0]! >= at(u, low, high)[0]!,
      ),
      PARAMETERS,
    );
  });

  it('stays within 1 mV of the linear value while that is more than 50 mV inside both limits', () => {
    fc.assert(
      fc.property(limits, fc.double({ min: 0, max: 1, noNaN: true }), ({ low, high }, t) => {
        fc.pre(high - low > 0.1 + 1e-9);
        const u = low + 0.05 + 1e-9 + t * (high - low - 0.1 - 2e-9);
        return Math.abs(at(u, low, high)[0]! - u) <= 1e-3;
      }),
      PARAMETERS,
    );
  });

  it('lies within 10 mV of a limit once the linear value is 1 V or more beyond it', () => {
    fc.assert(
      fc.property(oneSided, fc.double({ min: 1, max: 1e6, noNaN: true }), ({ low, high }, beyond) => {
        const aboveOk = !Number.isFinite(high) || high - at(high + beyond, low, high)[0]! <= 0.01;
        const belowOk = !Number.isFinite(low) || at(low - beyond, low, high)[0]! - low <= 0.01;
        return aboveOk && belowOk;
      }),
      PARAMETERS,
    );
  });

  it('has a continuous slope equal to the derivative of its value, across both knees', () => {
    fc.assert(
      fc.property(limits, fc.double({ min: -0.2, max: 0.2, noNaN: true }), ({ low, high }, offset) => {
        const knee = limiterKnee(low, high);
        for (const u of [high - knee + offset * knee, low + knee + offset * knee, high - knee, low + knee]) {
          const h = 1e-7 * knee;
          const difference = (at(u + h, low, high)[0]! - at(u - h, low, high)[0]!) / (2 * h);
          const slope = at(u, low, high)[1]!;
          if (Math.abs(difference - slope) > 1e-5) return false;
          // Continuity of the slope: the two sides of the point agree.
          if (Math.abs(at(u + h, low, high)[1]! - at(u - h, low, high)[1]!) > 1e-5) return false;
        }
        return true;
      }),
      PARAMETERS,
    );
  });

  it('is the identity with slope 1 in the middle of a wide range', () => {
    expect(Array.from(at(0.3, -5, 5))).toEqual([0.3, 1, 0, 0]);
  });
});
