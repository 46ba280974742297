/**
 * The linearity report: how far from linear each junction and each saturated MOSFET channel runs at
 * the signal level the AC analysis carries. For each junction it reads the peak amplitude v̂ of the
 * junction's voltage phasor at every analysed frequency, keeps the worst frequency, normalizes it,
 * x = v̂/(n·Vt) for a junction and x = v̂gs/V_ov for a channel, and reports the figures of
 * src/math/junction-nonlinearity.ts at that x: the Lagrange bound of the first-order remainder, the
 * exact harmonic ratios of the junction's own current for a sinusoidal junction voltage, and the
 * shift of its mean current.
 *
 * Every figure is a function of the first-order (small-signal) amplitude: it says how wrong the linear
 * answer would be if the junction saw that voltage, which holds while the amplitude itself is not yet
 * changed much by the nonlinearity (x well below 1).
 *
 * A junction's own figures say how curved its current is, not how much of that curvature reaches
 * anything the user reads: a reverse-biased junction, or one beside a much smaller resistance, can be
 * strongly curved and harmless. With an `output` the verdict is therefore taken there, by the method of
 * nonlinear currents (distortion.ts): the output's 2nd and 3rd harmonics, the third-order change of its
 * fundamental and the shift of its mean, summed into a bound on the relative error of the linear answer.
 *
 * Which frequencies need the harmonic solves. The output's `frequency` is where its error bound
 * a_k + b_k is largest, a_k = (|M| + |H2|)/|H1| of second order, b_k = (|C1| + |H3|)/|H1| of third.
 * Every analysed frequency gets a_k exactly: one factorization at 2f_k (the mean shift shares one at
 * 0 Hz). The third-order part costs two more (3f_k and f_k), so it is taken where it can matter:
 * first at the largest a_k, then at every frequency with a_k·(1 + β) ≥ the largest bound found, β being
 * the largest ratio b/a met so far; and at every frequency when β exceeds ½ (third order comparable to
 * second, as in a balanced stage whose even order cancels). The frequency found is the exact worst
 * provided no frequency left out has a larger b/a than those evaluated; in a pass band, where a_k and
 * b_k/a_k vary slowly, that costs one or a few third-order evaluations instead of one per frequency.
 * Only the worst frequency repeats the solves per device for the shares.
 */
import type { ElementKind } from '../circuit/elements.js';
import type { JunctionProbe } from '../devices/device.js';
import { invalidValue, noSignal } from '../errors/messages.js';
import {
  channelAmplitudeForBound,
  channelNonlinearity,
  junctionAmplitudeForBound,
  junctionNonlinearity,
} from '../math/junction-nonlinearity.js';
import { taylorAmplitudeForBound, taylorNonlinearity } from '../math/taylor-nonlinearity.js';
import { AcAnalysis, type Probe } from './ac-analysis.js';
import { requireInstance } from './arguments.js';
import { HarmonicEstimator, ratio, relativeReal } from './distortion.js';
import { describeProbe } from './distortion-probe.js';
import { forwardBias } from './junction-bias.js';
import { type LinearityReportJson, linearityToJson } from './result-json.js';

/** Default budget of the first-order error bound: 10 % of the linear term. */
export const DEFAULT_LINEARITY_BUDGET = 0.1;

/** Options of {@link linearity}. */
export interface LinearityOptions {
  /** The largest error bound accepted as linear enough, a finite number > 0 (default 0.1). */
  readonly budget?: number;
  /** Where the verdict is taken: a node, a node pair or an element current (see {@link OutputLinearity}). */
  readonly output?: Probe;
}

/** A device's share of the output's harmonics, each relative to the output's fundamental. */
export interface DistortionShare {
  /** |the device's part of H2| / |H1|. */
  readonly second: number;
  /** |the device's part of H3| / |H1| (its third-order currents formed with the whole circuit's responses). */
  readonly third: number;
}

/**
 * The linearity verdict at an output, by the method of nonlinear currents, at the analysed frequency
 * where its error bound is largest.
 */
export interface OutputLinearity {
  /** The output probe. */
  readonly output: Probe;
  /** Its description, such as `out` or `current in Rload`. */
  readonly outputName: string;
  /** The analysed frequency where `errorBound` is largest (the lowest such frequency on a tie), in Hz. */
  readonly frequency: number;
  /** |H1|: the peak amplitude of the output's small-signal phasor there (V, or A for a current). */
  readonly fundamental: number;
  /** |H2|/|H1|: the output's 2nd harmonic relative to its fundamental. */
  readonly secondHarmonic: number;
  /** |H3|/|H1|: the output's 3rd harmonic relative to its fundamental. */
  readonly thirdHarmonic: number;
  /** Re(C1/H1): the third-order change of the fundamental (negative: the gain falls; positive: it rises). */
  readonly compression: number;
  /** |C1|/|H1|, the size of that change whatever its phase. */
  readonly compressionMagnitude: number;
  /** |M|/|H1|: the second-order shift of the output's DC value. */
  readonly meanShift: number;
  /** meanShift + secondHarmonic + |C1|/|H1| + thirdHarmonic: the relative peak error of the linear answer, to leading orders. */
  readonly errorBound: number;
  /** Whether `errorBound` ≤ the budget. */
  readonly withinBudget: boolean;
  /** The second-order part of the bound, meanShift + secondHarmonic, at every analysed frequency (NaN without signal). */
  readonly secondOrderBounds: Float64Array;
  /**
   * The whole error bound where its third-order part was evaluated (the worst frequency and the
   * candidates for it), NaN elsewhere.
   */
  readonly errorBounds: Float64Array;
}

/** The linearity of one junction (or MOSFET channel) at its worst analysed frequency. */
export interface JunctionLinearity {
  /** The device's element name. */
  readonly device: string;
  /** The device's kind: `'diode'`, `'bjt'` or `'mosfet'`. */
  readonly kind: ElementKind;
  /** Which junction of the device. */
  readonly junction: JunctionProbe['junction'];
  /** The frequency where the amplitude is largest (the lowest such frequency on a tie), in Hz. */
  readonly frequency: number;
  /** The peak amplitude of the junction's (gate-source) voltage phasor there, in V. */
  readonly amplitude: number;
  /**
   * The junction's DC voltage in its forward sense (anode − cathode, vbe or vbc for npn, veb or vcb
   * for pnp; vgs or vsg for a channel), in V.
   */
  readonly bias: number;
  /**
   * Whether the junction is forward-biased (bias > 0; a saturated channel always is). A reverse-biased
   * junction can swing many n·Vt, and so report a large error bound, while its exponential current is
   * too small to matter: the distortion estimate's shares tell whether it does.
   */
  readonly forwardBiased: boolean;
  /** The voltage that normalizes it: n·Vt for a junction, the overdrive V_ov for a channel, in V. */
  readonly scale: number;
  /** x = amplitude/scale. */
  readonly normalized: number;
  /**
   * Bound on the first-order Taylor remainder relative to the linear term: (x/2)·e^x, or x/2.
   * Infinity when x is beyond about 700 (e^x overflows): the signal is then nowhere near small.
   */
  readonly errorBound: number;
  /** 2nd-harmonic amplitude of the junction's current relative to its fundamental: I₂(x)/I₁(x), or x/4. */
  readonly secondHarmonic: number;
  /** 3rd-harmonic amplitude of the junction's current relative to its fundamental: I₃(x)/I₁(x), or 0. */
  readonly thirdHarmonic: number;
  /**
   * Rise of the junction's mean current relative to its quiescent current: I₀(x) − 1, or x²/2;
   * Infinity when x is beyond about 700 (I₀ overflows).
   */
  readonly meanShift: number;
  /** Whether `errorBound` ≤ the budget. */
  readonly withinBudget: boolean;
  /** The factor by which every AC source could be scaled with this junction just at the budget (Infinity without signal). */
  readonly maxInputScale: number;
  /** The amplitude at every analysed frequency, in the order of the analysis, in V. */
  readonly amplitudes: Float64Array;
  /**
   * The device's share of the output's harmonics, with an output named: on the diode's entry, a bipolar
   * transistor's base-emitter entry and a MOSFET's channel entry (one entry per device).
   */
  readonly share?: DistortionShare;
}

/** How far from linear every junction of a circuit runs, from an AC analysis. */
export interface LinearityReport {
  /** The budget the junctions were judged against. */
  readonly budget: number;
  /** The analysed frequencies, in Hz, in the order of the analysis. */
  readonly frequencies: Float64Array;
  /** One entry per diode, bipolar junction and saturated MOSFET channel, in circuit order. */
  readonly junctions: readonly JunctionLinearity[];
  /** The verdict at the output, when one was named. */
  readonly output?: OutputLinearity;
  /**
   * The largest factor by which every AC source could be scaled with the verdict still holding: with
   * an output, the positive root of a·s + b·s² = budget (a = meanShift + secondHarmonic,
   * b = |C1|/|H1| + thirdHarmonic); without one, the smallest scale of the forward-biased junctions and
   * channels. Infinity where nothing limits it.
   */
  readonly maxInputScale: number;
  /** The smallest scale of the forward-biased junctions and channels, with or without an output. */
  readonly maxInputScaleForwardBiased: number;
  /** The forward-biased junction or channel with the largest error bound (the first on a tie), or null. */
  readonly worst: JunctionLinearity | null;
  /**
   * The verdict: the output's, when one is named; otherwise whether every forward-biased junction and
   * every channel is within budget (reverse-biased junctions are reported and do not count).
   */
  readonly withinBudget: boolean;
  /** Plain data for `JSON.stringify`: arrays for typed arrays, `null` for infinite values. */
  toJSON(): LinearityReportJson;
}

/** Check a budget option: a finite number > 0. */
function checkBudget(budget: unknown): number {
  if (budget === undefined) return DEFAULT_LINEARITY_BUDGET;
  if (typeof budget !== 'number' || !Number.isFinite(budget) || budget <= 0) {
    throw invalidValue(['budget'], budget, 'a finite positive error bound (such as 0.1)');
  }
  return budget;
}

/**
 * Judge the linearity of an AC analysis against a budget: each junction's own figures, and with an
 * `output` the verdict taken there.
 *
 * @param ac - the small-signal analysis whose amplitudes are judged (peak phasors, as driven)
 * @param options - `budget`: the largest accepted error bound (default 0.1); `output`: where the
 *   verdict is taken
 * @returns the {@link LinearityReport}, junctions in circuit order
 * @throws QuiescentError `invalid-value` for a budget that is not a finite number > 0 or a bad probe;
 *   `unknown-node`, `unknown-element` for a probe the circuit lacks; `no-signal` when the output's
 *   fundamental is zero at every analysed frequency; `singular` at 2f, 3f or 0 Hz
 *
 * @example
 * ```ts
 * const report = linearity(acAnalysis(op, { frequencies: [1e3] }), { output: 'out', budget: 0.05 });
 * report.output?.secondHarmonic; // the output's 2nd harmonic over its fundamental
 * report.withinBudget;           // the verdict at the output
 * report.maxInputScale;          // how much louder the input could be
 * ```
 */
export function linearity(ac: AcAnalysis, options: LinearityOptions = {}): LinearityReport {
  requireInstance(ac, AcAnalysis, 'ac', 'an AcAnalysis (the result of acAnalysis(op, options))');
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object such as { output: "out", budget: 0.1 }');
  }
  const budget = checkBudget(options.budget);
  const junctions = junctionEntries(ac, budget);
  const forward = junctions.filter((j) => j.forwardBiased);
  let worst: JunctionLinearity | null = null;
  for (const j of forward) if (worst === null || j.errorBound > worst.errorBound) worst = j;
  const screenScale = smallestScale(forward);
  const measured =
    options.output === undefined ? undefined : outputVerdict(ac, options.output, budget, junctions);
  const entries = measured?.junctions ?? junctions;
  return {
    budget,
    frequencies: ac.frequencies.slice(),
    junctions: entries,
    ...(measured === undefined ? {} : { output: measured.output }),
    maxInputScale: measured === undefined ? screenScale : measured.maxInputScale,
    maxInputScaleForwardBiased: screenScale,
    worst: worst === null ? null : (entries[junctions.indexOf(worst)] ?? worst),
    withinBudget:
      measured === undefined ? forward.every((j) => j.withinBudget) : measured.output.withinBudget,
    toJSON() {
      return linearityToJson(this);
    },
  };
}

/** The junctions of a device without any. */
const NO_PROBES: readonly JunctionProbe[] = [];

/** Each junction's own figures at its worst frequency. */
function junctionEntries(ac: AcAnalysis, budget: number): JunctionLinearity[] {
  const op = ac.operatingPoint;
  const system = op.system;
  const stride = system.n + 1;
  const frequencies = ac.frequencies;
  const junctionLimit = junctionAmplitudeForBound(budget);
  const channelLimit = channelAmplitudeForBound(budget);
  const probed = system.devices.map((device) => device.junctions?.(op.x, op.conditions) ?? NO_PROBES);
  // Every junction's amplitudes are a view on one buffer: a typed array each would cost an array
  // buffer each (about 7 MB for 33,000 junctions).
  let count = 0;
  for (const probes of probed) count += probes.length;
  const allAmplitudes = new Float64Array(count * frequencies.length);
  let next = 0;
  const junctions: JunctionLinearity[] = [];
  for (let d = 0; d < system.devices.length; d++) {
    const device = system.devices[d]!;
    for (const probe of probed[d]!) {
      const amplitudes = allAmplitudes.subarray(next, next + frequencies.length);
      next += frequencies.length;
      let worst = -1;
      for (let k = 0; k < frequencies.length; k++) {
        const base = k * stride;
        const re = ac.re[base + probe.plus]! - ac.re[base + probe.minus]!;
        const im = ac.im[base + probe.plus]! - ac.im[base + probe.minus]!;
        amplitudes[k] = Math.hypot(re, im);
        const better =
          worst < 0 ||
          amplitudes[k]! > amplitudes[worst]! ||
          (amplitudes[k] === amplitudes[worst] && frequencies[k]! < frequencies[worst]!);
        if (better) worst = k;
      }
      const amplitude = amplitudes[worst]!;
      const x = amplitude / probe.scale;
      const channel = probe.junction === 'channel';
      const bias = forwardBias(device.record, probe, op.x);
      const figures = probe.taylor
        ? taylorNonlinearity(x, probe.taylor)
        : channel
          ? channelNonlinearity(x)
          : junctionNonlinearity(x);
      junctions.push({
        device: device.name,
        kind: device.record.kind,
        junction: probe.junction,
        frequency: frequencies[worst]!,
        amplitude,
        bias,
        forwardBiased: channel || bias > 0,
        scale: probe.scale,
        normalized: x,
        ...figures,
        withinBudget: figures.errorBound <= budget,
        maxInputScale:
          x > 0
            ? (probe.taylor
                ? taylorAmplitudeForBound(budget, probe.taylor)
                : channel
                  ? channelLimit
                  : junctionLimit) / x
            : Number.POSITIVE_INFINITY,
        amplitudes,
      });
    }
  }
  return junctions;
}

/** The ratio of third- to second-order figures above which every frequency gets its third-order part. */
const THIRD_ORDER_RATIO_LIMIT = 0.5;

/** Round-off margin below which an output phasor counts as no signal, relative to the largest unknown. */
const NO_SIGNAL_MARGIN = 64 * Number.EPSILON;

/**
 * The output's figures at every analysed frequency, the worst kept, and the devices' shares there.
 */
function outputVerdict(
  ac: AcAnalysis,
  output: Probe,
  budget: number,
  junctions: readonly JunctionLinearity[],
): { output: OutputLinearity; junctions: JunctionLinearity[]; maxInputScale: number } {
  const op = ac.operatingPoint;
  const stride = op.system.n + 1;
  const frequencies = ac.frequencies;
  const estimator = new HarmonicEstimator(op, output, false);
  const voltage = typeof output === 'string' || (typeof output === 'object' && 'node' in output);
  const count = frequencies.length;
  const secondOrderBounds = new Float64Array(count).fill(Number.NaN);
  const errorBounds = new Float64Array(count).fill(Number.NaN);
  const slice = (k: number, parts: Float64Array) => parts.subarray(k * stride, (k + 1) * stride);
  if (estimator.set.currents.length < count) estimator.prepareMeanTransfer();
  for (let k = 0; k < count; k++) {
    const xr = slice(k, ac.re);
    const xi = slice(k, ac.im);
    if (fundamentalSize(ac, k, xr, xi, estimator, voltage) === 0) continue;
    estimator.evaluateSecondOrder(frequencies[k]!, xr, xi, false, false);
    const f = figures(estimator);
    secondOrderBounds[k] = f.meanShift + f.secondHarmonic;
  }
  let worst = -1;
  let beta = 0;
  const evaluate = (k: number): void => {
    estimator.evaluateSecondOrder(frequencies[k]!, slice(k, ac.re), slice(k, ac.im), false);
    estimator.evaluateThirdOrder(frequencies[k]!, slice(k, ac.re), slice(k, ac.im), false);
    const f = figures(estimator);
    errorBounds[k] = f.errorBound;
    const a = secondOrderBounds[k]!;
    const b = f.errorBound - a;
    beta = Math.max(beta, a > 0 ? b / a : b > 0 ? Number.POSITIVE_INFINITY : 0);
    const better =
      worst < 0 ||
      f.errorBound > errorBounds[worst]! ||
      (f.errorBound === errorBounds[worst] && frequencies[k]! < frequencies[worst]!);
    if (better) worst = k;
  };
  // The third-order part where it can decide the worst frequency (see the top of this file). A circuit
  // without nonlinear currents has none: its bound is 0 everywhere, the lowest frequency with signal.
  if (estimator.set.currents.length === 0) {
    const first = secondOrderBounds.findIndex((a) => !Number.isNaN(a));
    let lowest = first;
    for (let k = first + 1; first >= 0 && k < count; k++) {
      if (!Number.isNaN(secondOrderBounds[k]!) && frequencies[k]! < frequencies[lowest]!) lowest = k;
    }
    if (lowest >= 0) evaluate(lowest);
  }
  while (estimator.set.currents.length > 0) {
    let next = -1;
    for (let k = 0; k < count; k++) {
      const a = secondOrderBounds[k]!;
      if (Number.isNaN(a) || !Number.isNaN(errorBounds[k]!)) continue;
      const candidate = worst < 0 || beta > THIRD_ORDER_RATIO_LIMIT || a * (1 + beta) >= errorBounds[worst]!;
      if (candidate && (next < 0 || a > secondOrderBounds[next]!)) next = k;
    }
    if (next < 0) break;
    evaluate(next);
  }
  if (worst < 0) {
    throw noSignal(describeProbe(output), Array.from(frequencies), 'its small-signal phasor is zero');
  }
  const frequency = frequencies[worst]!;
  estimator.evaluate(
    frequency,
    ac.re.subarray(worst * stride, (worst + 1) * stride),
    ac.im.subarray(worst * stride, (worst + 1) * stride),
    true,
  );
  const f = figures(estimator);
  const a = f.meanShift + f.secondHarmonic;
  const b = f.compressionMagnitude + f.thirdHarmonic;
  // a·s + b·s² = budget, in the form that keeps its precision when b·budget ≪ a².
  const maxInputScale =
    a === 0 && b === 0 ? Number.POSITIVE_INFINITY : (2 * budget) / (a + Math.sqrt(a * a + 4 * b * budget));
  const h1 = Math.hypot(estimator.fundamental[0]!, estimator.fundamental[1]!);
  const shares = new Map<string, DistortionShare>();
  estimator.set.devices.forEach((d, g) => {
    const s = estimator.secondShares;
    const t = estimator.thirdShares;
    shares.set(d.device, {
      second: Math.hypot(s[2 * g]!, s[2 * g + 1]!) / h1,
      third: Math.hypot(t[2 * g]!, t[2 * g + 1]!) / h1,
    });
  });
  const seen = new Set<string>();
  const withShares = junctions.map((j) => {
    const share = shares.get(j.device);
    // One entry per device: the first (a diode's, a bipolar transistor's base-emitter, a channel).
    if (share === undefined || j.junction === 'base-collector' || seen.has(j.device)) return j;
    seen.add(j.device);
    return { ...j, share };
  });
  return {
    output: {
      output,
      outputName: describeProbe(output),
      frequency,
      fundamental: h1,
      ...f,
      withinBudget: f.errorBound <= budget,
      secondOrderBounds,
      errorBounds,
    },
    junctions: withShares,
    maxInputScale,
  };
}

/** |H1| at frequency index k, or 0 where it is below round-off against the largest unknown there. */
function fundamentalSize(
  ac: AcAnalysis,
  k: number,
  xr: Float64Array,
  xi: Float64Array,
  estimator: HarmonicEstimator,
  voltage: boolean,
): number {
  estimator.readFundamental(ac.frequencies[k]!, xr, xi);
  const size = Math.hypot(estimator.fundamental[0]!, estimator.fundamental[1]!);
  if (!voltage) return size;
  const nodes = ac.operatingPoint.system.nodeCount;
  let largest = 0;
  for (let i = 0; i < nodes; i++) largest = Math.max(largest, Math.abs(xr[i]!) + Math.abs(xi[i]!));
  return size <= NO_SIGNAL_MARGIN * largest ? 0 : size;
}

/** The output's ratios from the estimator's last evaluation. */
function figures(
  e: HarmonicEstimator,
): Omit<
  OutputLinearity,
  'output' | 'outputName' | 'frequency' | 'fundamental' | 'withinBudget' | 'errorBounds' | 'secondOrderBounds'
> {
  const h1 = Math.hypot(e.fundamental[0]!, e.fundamental[1]!);
  const secondHarmonic = ratio(Math.hypot(e.second[0]!, e.second[1]!), h1);
  const thirdHarmonic = ratio(Math.hypot(e.third[0]!, e.third[1]!), h1);
  const compressionMagnitude = ratio(Math.hypot(e.compression[0]!, e.compression[1]!), h1);
  const compression = relativeReal(
    e.compression[0]!,
    e.compression[1]!,
    e.fundamental[0]!,
    e.fundamental[1]!,
  );
  const meanShift = ratio(Math.abs(e.mean), h1);
  return {
    secondHarmonic,
    thirdHarmonic,
    compression,
    compressionMagnitude,
    meanShift,
    errorBound: meanShift + secondHarmonic + compressionMagnitude + thirdHarmonic,
  };
}

function smallestScale(junctions: readonly JunctionLinearity[]): number {
  return junctions.reduce((s, j) => Math.min(s, j.maxInputScale), Number.POSITIVE_INFINITY);
}
