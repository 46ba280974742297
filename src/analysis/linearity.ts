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
 */
import type { ElementKind } from '../circuit/elements.js';
import type { JunctionProbe } from '../devices/device.js';
import { invalidValue } from '../errors/messages.js';
import {
  channelAmplitudeForBound,
  channelNonlinearity,
  junctionAmplitudeForBound,
  junctionNonlinearity,
} from '../math/junction-nonlinearity.js';
import type { AcAnalysis } from './ac-analysis.js';
import { forwardBias } from './junction-bias.js';
import { prepareDevices } from './newton.js';
import { type LinearityReportJson, linearityToJson } from './result-json.js';

/** Default budget of the first-order error bound: 10 % of the linear term. */
export const DEFAULT_LINEARITY_BUDGET = 0.1;

/** Options of {@link linearity}. */
export interface LinearityOptions {
  /** The largest error bound accepted as linear enough, a finite number > 0 (default 0.1). */
  readonly budget?: number;
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
  /** Bound on the first-order Taylor remainder relative to the linear term: (x/2)·e^x, or x/2. */
  readonly errorBound: number;
  /** 2nd-harmonic amplitude of the junction's current relative to its fundamental: I₂(x)/I₁(x), or x/4. */
  readonly secondHarmonic: number;
  /** 3rd-harmonic amplitude of the junction's current relative to its fundamental: I₃(x)/I₁(x), or 0. */
  readonly thirdHarmonic: number;
  /** Rise of the junction's mean current relative to its quiescent current: I₀(x) − 1, or x²/2. */
  readonly meanShift: number;
  /** Whether `errorBound` ≤ the budget. */
  readonly withinBudget: boolean;
  /** The factor by which every AC source could be scaled with this junction just at the budget (Infinity without signal). */
  readonly maxInputScale: number;
  /** The amplitude at every analysed frequency, in the order of the analysis, in V. */
  readonly amplitudes: Float64Array;
}

/** How far from linear every junction of a circuit runs, from an AC analysis. */
export interface LinearityReport {
  /** The budget the junctions were judged against. */
  readonly budget: number;
  /** The analysed frequencies, in Hz, in the order of the analysis. */
  readonly frequencies: Float64Array;
  /** One entry per diode, bipolar junction and saturated MOSFET channel, in circuit order. */
  readonly junctions: readonly JunctionLinearity[];
  /** The largest factor by which every AC source could be scaled with every junction within budget. */
  readonly maxInputScale: number;
  /** The same over the forward-biased junctions (and channels) only, which carry the current that matters. */
  readonly maxInputScaleForwardBiased: number;
  /** The junction with the largest error bound (the first on a tie), or null when there is none. */
  readonly worst: JunctionLinearity | null;
  /** Whether every junction is within budget. */
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
 * Judge every junction of an AC analysis against a budget on its first-order error.
 *
 * @param ac - the small-signal analysis whose amplitudes are judged (peak phasors, as driven)
 * @param options - `budget`: the largest accepted error bound (default 0.1)
 * @returns the {@link LinearityReport}, junctions in circuit order
 * @throws QuiescentError `invalid-value` for a budget that is not a finite number > 0
 *
 * @example
 * ```ts
 * const report = linearity(acAnalysis(op, { frequencies: [1e3] }), { budget: 0.05 });
 * report.worst?.normalized; // x = v̂/(n·Vt) of the junction that swings most
 * report.maxInputScale;     // how much louder the input could be
 * ```
 */
export function linearity(ac: AcAnalysis, options: LinearityOptions = {}): LinearityReport {
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object such as { budget: 0.1 }');
  }
  const budget = checkBudget(options.budget);
  const op = ac.operatingPoint;
  const system = op.system;
  const stride = system.n + 1;
  const frequencies = ac.frequencies;
  const junctionLimit = junctionAmplitudeForBound(budget);
  const channelLimit = channelAmplitudeForBound(budget);
  prepareDevices(system, op.conditions);
  const junctions: JunctionLinearity[] = [];
  for (const device of system.devices) {
    for (const probe of device.junctions?.(op.x) ?? []) {
      const amplitudes = new Float64Array(frequencies.length);
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
      const figures = channel ? channelNonlinearity(x) : junctionNonlinearity(x);
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
        maxInputScale: x > 0 ? (channel ? channelLimit : junctionLimit) / x : Number.POSITIVE_INFINITY,
        amplitudes,
      });
    }
  }
  let worst: JunctionLinearity | null = null;
  for (const j of junctions) if (worst === null || j.errorBound > worst.errorBound) worst = j;
  return {
    budget,
    frequencies: frequencies.slice(),
    junctions,
    maxInputScale: smallestScale(junctions),
    maxInputScaleForwardBiased: smallestScale(junctions.filter((j) => j.forwardBiased)),
    worst,
    withinBudget: junctions.every((j) => j.withinBudget),
    toJSON() {
      return linearityToJson(this);
    },
  };
}

function smallestScale(junctions: readonly JunctionLinearity[]): number {
  return junctions.reduce((s, j) => Math.min(s, j.maxInputScale), Number.POSITIVE_INFINITY);
}
