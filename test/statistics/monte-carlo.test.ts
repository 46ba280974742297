import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  Circuit,
  GROUND,
  type MonteCarloOptions,
  mergeMonteCarlo,
  monteCarlo,
  monteCarloJob,
  operatingPoint,
  QuiescentError,
  runMonteCarloJob,
  startMonteCarloWorkers,
} from '../../src/index.js';
import { compileCount } from '../../src/mna/system.js';

const reference = JSON.parse(
  readFileSync(new URL('../reference/monte-carlo-moments.json', import.meta.url), 'utf8'),
) as {
  divider: { supply: number; upper: number; lower: number; relative: number };
  moments: Record<'uniform' | 'normal', { mean: number; variance: number; fourthCentralMoment: number }>;
  yield: { relative: number; max: number; probability: number };
};

/** The divider of test/reference/monte-carlo-moments.py: 10 V, 3 kΩ over 1 kΩ, 2.5 V at `out`. */
function divider(): Circuit {
  const { supply, upper, lower } = reference.divider;
  return new Circuit()
    .voltageSource('supply', 'top', GROUND, { dc: supply })
    .resistor('upper', 'top', 'out', upper)
    .resistor('lower', 'out', GROUND, lower);
}

/** The bytes of a Float64Array, so that equality is bit for bit. */
function bytes(values: Float64Array): Uint8Array {
  return new Uint8Array(values.buffer, values.byteOffset, values.byteLength);
}

async function rejection(run: Promise<unknown>): Promise<QuiescentError> {
  try {
    await run;
  } catch (e) {
    if (e instanceof QuiescentError) return e;
    throw e;
  }
  throw new Error('expected a QuiescentError');
}

describe('monteCarlo on a divider', () => {
  it.each(['uniform', 'normal'] as const)(
    'gives the exact mean and variance of the output with %s tolerances, within 4 standard errors',
    async (distribution) => {
      // Exact moments by numerical integration (scipy dblquad), test/reference/monte-carlo-moments.py.
      const exact = reference.moments[distribution];
      const n = 4000;
      const mc = await monteCarlo(divider(), {
        samples: n,
        seed: 20261204,
        tolerances: [
          { element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.05, distribution },
        ],
        measures: { out: 'out' },
      });
      const s = mc.summary.out!;
      expect(s.count).toBe(n);
      expect(Math.abs(s.mean - exact.mean)).toBeLessThan(4 * Math.sqrt(exact.variance / n));
      // The standard error of the sample variance: √((μ4 − σ⁴·(n − 3)/(n − 1))/n) (common practice, no source).
      const varianceError = Math.sqrt(
        (exact.fourthCentralMoment - (exact.variance ** 2 * (n - 3)) / (n - 1)) / n,
      );
      expect(Math.abs(s.standardDeviation ** 2 - exact.variance)).toBeLessThan(4 * varianceError);
      // Every draw lies within the tolerance.
      const upper = mc.parameters['upper.resistance']!;
      expect(Math.min(...upper)).toBeGreaterThanOrEqual(3000 * 0.95);
      expect(Math.max(...upper)).toBeLessThanOrEqual(3000 * 1.05);
    },
  );

  it('finds a yield whose Wilson interval holds the analytic probability', async () => {
    // Only `lower` varies, uniformly by ±10 %: out ≤ 2.55 V exactly when lower ≤ 2.55·3k/7.45, a
    // probability of 0.6342 (closed form, test/reference/monte-carlo-moments.py).
    const mc = await monteCarlo(divider(), {
      samples: 2000,
      seed: 3,
      tolerances: [{ element: 'lower', parameter: 'resistance', relative: reference.yield.relative }],
      measures: { out: 'out' },
    });
    const y = mc.yield({ out: { max: reference.yield.max } });
    expect(y.total).toBe(2000);
    expect(y.low).toBeLessThan(reference.yield.probability);
    expect(y.high).toBeGreaterThan(reference.yield.probability);
  });

  it('reads AC measures of every sample as the closed form of its drawn values', async () => {
    // First-order RC low-pass: H = 1/(1 + jωRC), |H| = 1/√(1 + (ωRC)²), arg H = −atan(ωRC)
    // (common practice, no source).
    const filter = new Circuit()
      .voltageSource('source', 'in', GROUND, { ac: 1 })
      .resistor('series', 'in', 'out', '10k')
      .capacitor('shunt', 'out', GROUND, '15.9n');
    const mc = await monteCarlo(filter, {
      samples: 50,
      seed: 8,
      tolerances: [
        { element: 'series', parameter: 'resistance', relative: 0.01 },
        { element: 'shunt', parameter: 'capacitance', relative: 0.1, distribution: 'normal' },
      ],
      measures: {
        level: { output: 'out', frequency: 1000, form: 'magnitude-db' },
        size: { output: 'out', frequency: 1000, form: 'magnitude' },
        phase: { output: 'out', frequency: 1000, form: 'phase-degrees' },
      },
    });
    expect(mc.sampleIndex).toHaveLength(50);
    for (let k = 0; k < 50; k++) {
      const wrc =
        2 *
        Math.PI *
        1000 *
        mc.parameters['series.resistance']![k]! *
        mc.parameters['shunt.capacitance']![k]!;
      expect(mc.values.size![k]).toBeCloseTo(1 / Math.sqrt(1 + wrc * wrc), 12);
      expect(mc.values.level![k]).toBeCloseTo(-10 * Math.log10(1 + wrc * wrc), 10);
      expect(mc.values.phase![k]).toBeCloseTo((-Math.atan(wrc) * 180) / Math.PI, 10);
    }
  });

  it('solves every sample of a transistor stage as an independent solve of its drawn values', async () => {
    // Each sample starts from a prediction made at the nominal point; whatever it starts from, its
    // answer must be the operating point of the circuit built with its values (common practice, no
    // source). The temperature spread moves every junction, the case the prediction is for.
    const stage = (beta: number, feed: number, saturation: number) =>
      new Circuit()
        .voltageSource('supply', 'vcc', GROUND, { dc: 9 })
        .resistor('feed', 'vcc', 'base', feed)
        .resistor('baseLoad', 'base', GROUND, '10k')
        .bjt(
          'amplifier',
          { collector: 'out', base: 'base', emitter: 'tail' },
          {
            polarity: 'npn',
            forwardBeta: beta,
            saturationCurrent: saturation,
          },
        )
        .resistor('collectorLoad', 'vcc', 'out', '3.3k')
        .resistor('tailLoad', 'tail', GROUND, '1k');
    const mc = await monteCarlo(stage(150, 47e3, 1e-15), {
      samples: 40,
      seed: 11,
      tolerances: [
        { element: 'amplifier', parameter: 'forwardBeta', min: 80, max: 400 },
        { element: 'amplifier', parameter: 'saturationCurrent', relative: 0.5 },
        { element: 'feed', parameter: 'resistance', relative: 0.05, distribution: 'normal' },
        { parameter: 'temperature', min: 233.15, max: 398.15 },
      ],
      measures: { out: 'out', collector: { device: 'amplifier', field: 'ic' } },
    });
    expect(mc.sampleIndex).toHaveLength(40);
    for (let k = 0; k < 40; k++) {
      const p = (key: string) => mc.parameters[key]![k]!;
      const fresh = operatingPoint(
        stage(p('amplifier.forwardBeta'), p('feed.resistance'), p('amplifier.saturationCurrent')),
        { temperature: p('temperature') },
      );
      const out = fresh.voltage('out');
      expect(Math.abs(mc.values.out![k]! - out)).toBeLessThanOrEqual(1e-6 * Math.abs(out) + 1e-9);
      const ic = fresh.bjt('amplifier').ic;
      expect(Math.abs(mc.values.collector![k]! - ic)).toBeLessThanOrEqual(1e-6 * Math.abs(ic) + 1e-12);
    }
  });

  it('keeps a sample whose draw makes a resistance 0 or less as a failure, and goes on', async () => {
    // Common practice, no source: a resistance must be positive (docs/tolerances.md, "Failures").
    const mc = await monteCarlo(divider(), {
      samples: 200,
      seed: 9,
      tolerances: [{ element: 'lower', parameter: 'resistance', min: -500, max: 1500 }],
      measures: { out: 'out' },
    });
    const negative = [...mc.parameters['lower.resistance']!].filter((r) => r <= 0).length;
    expect(negative).toBeGreaterThan(0);
    expect(mc.failures).toHaveLength(negative);
    expect(mc.sampleIndex.length + mc.failures.length).toBe(200);
    const failure = mc.failures[0]!;
    expect(failure.code).toBe('invalid-value');
    expect(failure.message).toContain('lower');
    expect(mc.parameters['lower.resistance']![failure.sample]!).toBeLessThanOrEqual(0);
    // Failures count as out of specification.
    expect(mc.yield({ out: { min: -1, max: 100 } }).passed).toBe(200 - negative);
  });

  it('compiles the circuit once per run, not once per sample', async () => {
    // The prepared circuit takes each sample's values without compiling (docs/analyses.md, prepared circuits).
    const before = compileCount();
    await monteCarlo(divider(), {
      samples: 100,
      seed: 2,
      tolerances: [{ element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.05 }],
      measures: { out: 'out' },
    });
    expect(compileCount() - before).toBe(1);
  });

  it('reports progress as samples finish, up to the total', async () => {
    const seen: number[] = [];
    await monteCarlo(divider(), {
      samples: 50,
      seed: 1,
      tolerances: [{ element: 'upper', parameter: 'resistance', relative: 0.01 }],
      measures: { out: 'out' },
      onProgress: (done, total) => {
        expect(total).toBe(50);
        seen.push(done);
      },
    });
    expect(seen).toEqual(Array.from({ length: 50 }, (_, k) => k + 1));
  });

  it('stops with cancelled when its signal aborts', async () => {
    const controller = new AbortController();
    const error = await rejection(
      monteCarlo(divider(), {
        samples: 1_000_000,
        seed: 1,
        tolerances: [{ element: 'upper', parameter: 'resistance', relative: 0.01 }],
        measures: { out: 'out' },
        signal: controller.signal,
        onProgress: (done) => {
          if (done === 100) controller.abort();
        },
      }),
    );
    expect(error.code).toBe('cancelled');
    expect(error.message).toContain('Monte Carlo');
    controller.abort();
    const before = await rejection(
      monteCarlo(divider(), {
        samples: 10,
        seed: 1,
        tolerances: [],
        measures: { out: 'out' },
        signal: controller.signal,
      }),
    );
    expect(before.code).toBe('cancelled');
  });

  it('stops its workers with cancelled when its signal aborts', async () => {
    const controller = new AbortController();
    const started = Date.now();
    const error = await rejection(
      monteCarlo(divider(), {
        samples: 2_000_000,
        seed: 1,
        tolerances: [{ element: 'upper', parameter: 'resistance', relative: 0.01 }],
        measures: { out: 'out' },
        workers: 2,
        signal: controller.signal,
        onProgress: () => controller.abort(),
      }),
    );
    expect(error.code).toBe('cancelled');
    // Two million samples would take minutes; the abort ends the run at the first progress report.
    expect(Date.now() - started).toBeLessThan(30_000);
  });

  it('names what is wrong in its options', async () => {
    const base: MonteCarloOptions = {
      samples: 10,
      seed: 1,
      tolerances: [{ element: 'upper', parameter: 'resistance', relative: 0.01 }],
      measures: { out: 'out' },
    };
    const code = async (options: MonteCarloOptions) => (await rejection(monteCarlo(divider(), options))).code;
    expect(await code({ ...base, samples: 0 })).toBe('invalid-value');
    expect(await code({ ...base, seed: -1 })).toBe('invalid-value');
    expect(await code({ ...base, range: [5, 20] })).toBe('invalid-value');
    expect(await code({ ...base, workers: 0 })).toBe('invalid-value');
    expect(
      await code({ ...base, tolerances: [{ element: 'missing', parameter: 'resistance', relative: 0.1 }] }),
    ).toBe('unknown-element');
    expect(
      await code({ ...base, tolerances: [{ element: 'upper', parameter: 'gain', relative: 0.1 }] }),
    ).toBe('invalid-value');
    expect(
      await code({ ...base, tolerances: [{ element: 'upper', parameter: 'resistance', relative: -1 }] }),
    ).toBe('invalid-value');
    expect(
      await code({
        ...base,
        tolerances: [
          { element: 'upper', parameter: 'resistance', relative: 0.1 },
          { element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.1 },
        ],
      }),
    ).toBe('invalid-value');
    expect(await code({ ...base, measures: {} })).toBe('invalid-value');
    expect(await code({ ...base, measures: { nowhere: 'nowhere' } })).toBe('unknown-node');
    expect(await code({ ...base, measures: { nowhere: 'nowhere' }, workers: 2 })).toBe('unknown-node');
    expect(await code({ ...base, measures: { ghost: { element: 'ghost' } } })).toBe('unknown-element');
    expect(
      await code({
        ...base,
        measures: { out: { output: 'out', frequency: 1e3, form: 'loudness' as 'magnitude' } },
      }),
    ).toBe('invalid-value');
  });
});

describe('reproducibility', () => {
  const options: MonteCarloOptions = {
    samples: 120,
    seed: 77,
    tolerances: [
      { element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.05, distribution: 'normal' },
      { element: 'supply', parameter: 'dc', min: 9.5, max: 10.5 },
      { parameter: 'temperature', min: 250, max: 350 },
    ],
    measures: { out: 'out', supplyCurrent: { element: 'supply' } },
  };

  it('gives bit-identical results for 1 and 2 workers and for a split run merged', async () => {
    // Common practice, no source: draws depend only on (seed, sample) (docs/tolerances.md, "Seeds").
    const one = await monteCarlo(divider(), options);
    const two = await monteCarlo(divider(), { ...options, workers: 2 });
    const job = monteCarloJob(divider(), options);
    const parts = [
      [70, 120],
      [0, 33],
      [33, 70],
    ].map(([a, b]) =>
      JSON.parse(JSON.stringify(runMonteCarloJob({ ...job, options: { ...job.options, range: [a!, b!] } }))),
    );
    const merged = mergeMonteCarlo(parts);
    for (const other of [two, merged]) {
      expect(other.range).toEqual([0, 120]);
      expect([...other.sampleIndex]).toEqual([...one.sampleIndex]);
      for (const name of ['out', 'supplyCurrent']) {
        expect(bytes(other.values[name]!)).toEqual(bytes(one.values[name]!));
        expect(other.summary[name]).toEqual(one.summary[name]);
      }
      for (const key of Object.keys(one.parameters)) {
        expect(bytes(other.parameters[key]!)).toEqual(bytes(one.parameters[key]!));
      }
    }
  });

  it('gives bit-identical results on workers kept between runs, for a nonlinear stage', async () => {
    // Common practice, no source: a sample's answer depends on its values alone, never on the
    // samples a worker solved before it (docs/tolerances.md, "Seeds"), here with transistors, whose
    // samples start from a prediction and refactor on the nominal pivot order.
    const stage = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
      .resistor('feed', 'vcc', 'base', '47k')
      .resistor('baseLoad', 'base', GROUND, '10k')
      .bjt(
        'amplifier',
        { collector: 'out', base: 'base', emitter: 'tail' },
        { polarity: 'npn', forwardBeta: 150 },
      )
      .resistor('collectorLoad', 'vcc', 'out', '3.3k')
      .resistor('tailLoad', 'tail', GROUND, '1k');
    const run: MonteCarloOptions = {
      samples: 90,
      seed: 5,
      tolerances: [
        { element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.05, distribution: 'normal' },
        { element: 'amplifier', parameter: 'forwardBeta', min: 80, max: 400 },
        { parameter: 'temperature', min: 233.15, max: 398.15 },
      ],
      measures: { out: 'out' },
    };
    const here = await monteCarlo(stage, run);
    const workers = startMonteCarloWorkers({ workers: 2 });
    try {
      const first = await monteCarlo(stage, { ...run, pool: workers });
      const again = await monteCarlo(stage, { ...run, pool: workers });
      for (const result of [first, again]) {
        expect(bytes(result.values.out!)).toEqual(bytes(here.values.out!));
        expect(Array.from(result.sampleIndex)).toEqual(Array.from(here.sampleIndex));
      }
      expect(workers.closed).toBe(false);
    } finally {
      await workers.close();
    }
    const refused = await rejection(monteCarlo(stage, { ...run, pool: workers }));
    expect(refused.code).toBe('invalid-value');
    expect(refused.message).toContain('pool');
    const single = startMonteCarloWorkers({ workers: 1 });
    try {
      const doubled = await rejection(monteCarlo(stage, { ...run, pool: single, workers: 2 }));
      expect(doubled.code).toBe('invalid-value');
    } finally {
      await single.close();
    }
  });

  it('gives the same result for any split into ranges, merged in any order (property)', () => {
    // Common practice, no source: the definition of the draws (docs/tolerances.md, "Seeds and reproducibility").
    const job = monteCarloJob(divider(), { ...options, samples: 40 });
    const whole = JSON.stringify(runMonteCarloJob(job));
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 1, max: 39 }), { maxLength: 6 }),
        fc.boolean(),
        (cuts, reverse) => {
          const edges = [0, ...cuts.sort((a, b) => a - b), 40];
          const parts = edges
            .slice(1)
            .map((end, k) =>
              runMonteCarloJob({ ...job, options: { ...job.options, range: [edges[k]!, end] } }),
            );
          if (reverse) parts.reverse();
          expect(JSON.stringify(mergeMonteCarlo(parts))).toBe(whole);
        },
      ),
      { seed: 40, numRuns: 15 },
    );
  });

  it('draws every value within its tolerance (property)', () => {
    // The definitions of docs/tolerances.md, "Tolerances": p·(1 ± r), or [min, max].
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.double({ min: 1, max: 20, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.constantFrom('uniform' as const, 'normal' as const),
        (relative, low, width, distribution) => {
          const mc = runMonteCarloJob(
            monteCarloJob(divider(), {
              samples: 25,
              seed: 3,
              tolerances: [
                { element: 'upper', parameter: 'resistance', relative, distribution },
                { element: 'supply', parameter: 'dc', min: low, max: low + width, distribution },
              ],
              measures: { out: 'out' },
            }),
          );
          for (const r of mc.parameters['upper.resistance']!) {
            expect(r).toBeGreaterThanOrEqual(3000 * (1 - relative) * (1 - 1e-15));
            expect(r).toBeLessThanOrEqual(3000 * (1 + relative) * (1 + 1e-15));
          }
          for (const v of mc.parameters['supply.dc']!) {
            expect(v).toBeGreaterThanOrEqual(low);
            expect(v).toBeLessThanOrEqual(low + width);
          }
        },
      ),
      { seed: 41, numRuns: 30 },
    );
  });

  it('refuses to merge parts of different runs or overlapping ranges', () => {
    const job = monteCarloJob(divider(), options);
    const part = (a: number, b: number, seed = 77) =>
      runMonteCarloJob({ ...job, options: { ...job.options, seed, range: [a, b] } });
    expect(() => mergeMonteCarlo([part(0, 10), part(10, 20, 78)])).toThrow(QuiescentError);
    expect(() => mergeMonteCarlo([part(0, 10), part(5, 20)])).toThrow(/range/);
    expect(() => mergeMonteCarlo([])).toThrow(QuiescentError);
  });
});
