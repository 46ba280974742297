import { describe, expect, it } from 'vitest';
import { channelNonlinearity } from '../../src/math/index.js';
import { taylorAmplitudeForBound, taylorNonlinearity } from '../../src/math/taylor-nonlinearity.js';
import { expectRelativelyClose } from '../support/close.js';

describe('taylorNonlinearity', () => {
  it('gives the square-law figures for c2 = 1, c3 = 0 except the mean shift, which is per g1·scale', () => {
    // The square law with scale V_ov: g1·V_ov = 2·I_Q, so its mean shift x²/2 of I_Q is x²/4 of g1·V_ov.
    const x = 0.3;
    const figures = taylorNonlinearity(x, { second: 1, third: 0 });
    const square = channelNonlinearity(x);
    expect(figures.errorBound).toBe(square.errorBound);
    expect(figures.secondHarmonic).toBe(square.secondHarmonic);
    expect(figures.thirdHarmonic).toBe(0);
    expectRelativelyClose(figures.meanShift, square.meanShift / 2, 1e-15, 'mean shift');
  });

  it('matches the harmonics of a cubic current by a discrete Fourier transform, to leading order', () => {
    // i = v + c2·v²/2 + c3·v³/6 sampled over one period of v = x·cos θ (scale 1, g1 = 1); the
    // trigonometric power identities give c2·x/4 and c3·x²/24 (common practice, no source).
    const [c2, c3, x] = [0.8, -2.5, 0.01];
    const N = 64;
    const harmonic = (k: number) => {
      let re = 0;
      let im = 0;
      for (let j = 0; j < N; j++) {
        const t = (2 * Math.PI * j) / N;
        const v = x * Math.cos(t);
        const i = v + (c2 * v * v) / 2 + (c3 * v ** 3) / 6;
        re += i * Math.cos(k * t);
        im += i * Math.sin(k * t);
      }
      return (2 * Math.hypot(re, im)) / N;
    };
    const figures = taylorNonlinearity(x, { second: c2, third: c3 });
    expectRelativelyClose(figures.secondHarmonic, harmonic(2) / harmonic(1), 1e-3, 'second harmonic');
    expectRelativelyClose(figures.thirdHarmonic, harmonic(3) / harmonic(1), 1e-3, 'third harmonic');
  });

  it('finds the amplitude at the budget as the positive root of (|c2|·x + |c3|·x²)/2 = budget', () => {
    const c = { second: 0.7, third: 3 };
    const x = taylorAmplitudeForBound(0.1, c);
    expectRelativelyClose(taylorNonlinearity(x, c).errorBound, 0.1, 1e-14, 'bound at the root');
    expect(taylorAmplitudeForBound(0.1, { second: 0, third: 0 })).toBe(Number.POSITIVE_INFINITY);
  });
});
