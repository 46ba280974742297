/**
 * The circuit-level distortion estimate by the method of nonlinear currents: the Volterra series of a
 * weakly nonlinear circuit solved harmonic by harmonic on the linearized circuit (E. Bussgang,
 * L. Ehrman and J. W. Graham, "Analysis of nonlinear systems with multiple inputs", Proc. IEEE 62(8),
 * 1974; P. Wambacq and W. Sansen, "Distortion Analysis of Analog Integrated Circuits", Kluwer, 1998,
 * ch. 3 and 4).
 *
 * Each nonlinear current i(v₁ … v_m) of a device (Device.nonlinearCurrents) is expanded about the bias:
 *   i = Σ_a f_a·v_a + ½ Σ_ab f_ab·v_a·v_b + ⅙ Σ_abc f_abc·v_a·v_b·v_c + …
 * The linear terms are the small-signal stamp. Write the response as v = v⁽¹⁾ + v⁽²⁾ + v⁽³⁾ + … by
 * order in the drive. For one tone, v⁽¹⁾_a(t) = Re(V_a·e^{jωt}) with V the AC solution. Then:
 *
 * Second order. v⁽²⁾ is the response of the linear circuit to the current ½ Σ f_ab·v⁽¹⁾_a·v⁽¹⁾_b, and
 *   Re(V_a e^{jωt})·Re(V_b e^{jωt}) = ½ Re(V_a V_b e^{2jωt}) + ½ Re(V_a V̄_b),
 * so the injected current has the 2f phasor  I⁽²⁾ = ¼ Σ_ab f_ab·V_a·V_b  (for one control with
 * f'' = 2·g₂: g₂·V²/2) and the DC value  ¼ Σ_ab f_ab·Re(V_a·V̄_b)  (g₂·|V|²/2). The circuit at 2f
 * (capacitors at 2ω) turns I⁽²⁾ into the second-order phasors W = V⁽²⁾(2f).
 *
 * Third order. Collecting the terms of order three in  ½ Σ f_ab (v⁽¹⁾ + v⁽²⁾)_a (v⁽¹⁾ + v⁽²⁾)_b
 * + ⅙ Σ f_abc v⁽¹⁾_a v⁽¹⁾_b v⁽¹⁾_c  gives the current  Σ_ab f_ab·v⁽¹⁾_a·v⁽²⁾_b + ⅙ Σ f_abc·v⁽¹⁾v⁽¹⁾v⁽¹⁾
 * (f_ab symmetric). Its 3f phasor, from Re(V e^{jωt})·Re(W e^{2jωt}) = ½ Re(V W e^{3jωt}) + … and
 * the product of three tones = ¼ Re(V_a V_b V_c e^{3jωt}) + …, is
 *   I⁽³⁾ = (1/24) Σ_abc f_abc·V_a·V_b·V_c + ½ Σ_ab f_ab·V_a·W_b
 * (one control, f''' = 6·g₃: g₃·V³/4 + 2·g₂·V·W/2). The DC part of v⁽²⁾ does not reach 3f.
 *
 * Third order at the fundamental (compression or expansion). The same current has a component at f:
 * three first-order factors give (1/4)(V_a V_b V̄_c + V_a V̄_b V_c + V̄_a V_b V_c) per term, and
 * Re(V e^{jωt})·Re(W e^{2jωt}) and Re(V e^{jωt})·M give ½·V̄·W and V·M, so
 *   I_C = (1/8) Σ_abc f_abc·V_a·V_b·V̄_c + Σ_ab f_ab·(½·V̄_a·W_b + V_a·M_b)
 * with M the DC part of the second-order response. Solved at f it gives C1, the third-order part of
 * the output at the fundamental: Re(C1/H1) < 0 means the gain falls with the drive. For one control
 * (f'' = 2g₂, f''' = 6g₃, and W = M = 0 at a junction driven by an ideal source), I_C = ¾·g₃·|V|²·V.
 *
 * Each device's (or junction's) currents are injected alone, so its share of each harmonic is its own
 * solve; the shares add up to the total (superposition on the linear circuit). The 3rd-order share
 * includes the interaction term with the whole second-order response W.
 *
 * Factorizations. The mean shift is solved on one factorization at 0 Hz kept for the whole estimate;
 * each frequency then factors at 2f, 3f and f, and a factorization is reused whenever the next solve
 * is at the frequency already factored (f = 0, where all four coincide).
 *
 * Assumptions: a single sinusoidal drive (every AC source at the same frequency with its own phase),
 * weak nonlinearity (each harmonic much smaller than the one below it; the estimate is the leading
 * term of each harmonic, growing as s², s³ with the drive scale s), and nonlinear conductances only:
 * the bias dependence of the junction capacitances is not included.
 */
import { Complex } from 'complex.js';
import type { ElementKind } from '../circuit/elements.js';
import type { JunctionProbe } from '../devices/device.js';
import { invalidValue } from '../errors/messages.js';
import { AcAnalysis, type Probe } from './ac-analysis.js';
import { AcWorkspace } from './ac-workspace.js';
import { analysedFrequencyIndex } from './analysed-frequency.js';
import { requireInstance } from './arguments.js';
import { describeProbe, type ProbeReader, probeReader } from './distortion-probe.js';
import {
  ControlPhasors,
  cubic,
  gatherNonlinearCurrents,
  injectCurrents,
  type NonlinearCurrents,
  quadratic,
} from './nonlinear-currents.js';
import type { OperatingPoint } from './operating-point.js';
import { OutputAdjoint } from './output-adjoint.js';

/**
 * Above this many devices the shares come from one transposed solve (output-adjoint.ts) rather than
 * one forward solve per device: the same numbers, at a cost that no longer grows with the count.
 */
export const SHARES_BY_ADJOINT = 8;

/** Options of {@link distortion}. */
export interface DistortionOptions {
  /** Where the harmonics are read: a node, a node pair or an element current. */
  readonly output: Probe;
  /** Estimate at this one frequency of the AC analysis, in Hz (default: every analysed frequency). */
  readonly frequency?: number;
  /** Scale every AC source by this finite factor > 0 before estimating (default 1). */
  readonly scale?: number;
}

/** One junction's share of the harmonics at the output. */
export interface DistortionContribution {
  /** The device's element name. */
  readonly device: string;
  /** The device's kind. */
  readonly kind: ElementKind;
  /** Which junction (or channel) of the device. */
  readonly junction: JunctionProbe['junction'];
  /** Its share of the output's 2nd-harmonic phasor (V or A, peak). */
  readonly second: Complex;
  /** Its share of the output's 3rd-harmonic phasor (V or A, peak). */
  readonly third: Complex;
  /** |second| / |fundamental|. */
  readonly secondRatio: number;
  /** |third| / |fundamental|. */
  readonly thirdRatio: number;
}

/** The estimated harmonics of the output at one drive frequency. */
export interface DistortionPoint {
  /** The drive frequency f, in Hz. */
  readonly frequency: number;
  /** The output's phasor at f (the small-signal answer, scaled). */
  readonly fundamental: Complex;
  /** The output's 2nd-harmonic phasor at 2f, to leading (second) order. */
  readonly second: Complex;
  /** The output's 3rd-harmonic phasor at 3f, to leading (third) order. */
  readonly third: Complex;
  /** C1: the third-order part of the output at f itself (V or A, peak). */
  readonly compressionPhasor: Complex;
  /** Re(C1/H1): the relative change of the fundamental, negative where the gain falls (0 without signal). */
  readonly compression: number;
  /** The shift of the output's mean value (rectification), to second order, signed (V or A). */
  readonly meanShift: number;
  /** |second| / |fundamental| (0 when both vanish, Infinity when only the fundamental does). */
  readonly secondRatio: number;
  /** |third| / |fundamental|. */
  readonly thirdRatio: number;
  /** √(|second|² + |third|²) / |fundamental|: the distortion of the 2nd and 3rd harmonic together. */
  readonly harmonicDistortion: number;
  /** Each junction's share, in circuit order. */
  readonly contributions: readonly DistortionContribution[];
}

/** The distortion estimate of an output over the frequencies asked for. */
export interface DistortionEstimate {
  /** The output probe. */
  readonly output: Probe;
  /** Its description, such as `out` or `current in RL`. */
  readonly outputName: string;
  /** The scale applied to every AC source. */
  readonly scale: number;
  /** One point per frequency, in the order of the AC analysis. */
  readonly points: readonly DistortionPoint[];
}

/**
 * The output's harmonics by the method of nonlinear currents, one drive frequency at a time, on
 * workspaces built once: the engine of {@link distortion} and of the linearity report's output
 * figures. The figures of the last {@link HarmonicEstimator.evaluate} are left in its public arrays.
 */
export class HarmonicEstimator {
  /** The nonlinear currents, grouped as asked. */
  readonly set: NonlinearCurrents;
  /** Output phasors of the last evaluation, unscaled, as [re, im]: the fundamental H1 … */
  readonly fundamental = new Float64Array(2);
  /** … the 2nd harmonic H2 at 2f … */
  readonly second = new Float64Array(2);
  /** … the 3rd harmonic H3 at 3f … */
  readonly third = new Float64Array(2);
  /** … and C1, the third-order part at f. */
  readonly compression = new Float64Array(2);
  /** The signed second-order shift of the output's mean, unscaled. */
  mean = 0;
  /** Each group's share of H2 and of H3, [re, im] interleaved, when asked for. */
  readonly secondShares: Float64Array;
  readonly thirdShares: Float64Array;

  readonly #op: OperatingPoint;
  readonly #ac: AcWorkspace;
  readonly #dc: AcWorkspace;
  readonly #read: ProbeReader;
  readonly #readHarmonic: ProbeReader;
  readonly #currentRe: Float64Array;
  readonly #currentIm: Float64Array;
  readonly #meanCurrent: Float64Array;
  readonly #noCurrent: Float64Array;
  #meanTransfer: Float64Array | null = null;
  #adjoint: OutputAdjoint | undefined;
  readonly #v: ControlPhasors;
  readonly #vBar: ControlPhasors;
  readonly #w: ControlPhasors;
  readonly #m: ControlPhasors;
  readonly #wRe: Float64Array;
  readonly #wIm: Float64Array;
  readonly #mRe: Float64Array;
  readonly #mIm: Float64Array;
  readonly #re: Float64Array;
  readonly #im: Float64Array;
  readonly #value = new Float64Array(2);
  readonly #form = new Float64Array(2);

  /**
   * @param op - the operating point the circuit is linearized at
   * @param output - the probe read
   * @param byJunction - share by junction (the distortion estimate) rather than by device
   * @throws QuiescentError `unknown-node`, `unknown-element`, `invalid-value` for the probe
   */
  constructor(op: OperatingPoint, output: Probe, byJunction: boolean) {
    this.#op = op;
    const n = op.system.n;
    this.#read = probeReader(op.system, op, output, false);
    this.#readHarmonic = probeReader(op.system, op, output, true);
    this.set = gatherNonlinearCurrents(op, byJunction);
    const count = this.set.currents.length;
    const m = this.set.maxControls;
    this.#ac = new AcWorkspace(op);
    this.#dc = new AcWorkspace(op);
    this.#currentRe = new Float64Array(count);
    this.#currentIm = new Float64Array(count);
    this.#meanCurrent = new Float64Array(count);
    this.#noCurrent = new Float64Array(count);
    this.#v = new ControlPhasors(m);
    this.#vBar = new ControlPhasors(m);
    this.#w = new ControlPhasors(m);
    this.#m = new ControlPhasors(m);
    this.#wRe = new Float64Array(n + 1);
    this.#wIm = new Float64Array(n + 1);
    this.#mRe = new Float64Array(n + 1);
    this.#mIm = new Float64Array(n + 1);
    this.#re = new Float64Array(n + 1);
    this.#im = new Float64Array(n + 1);
    this.secondShares = new Float64Array(2 * this.set.devices.length);
    this.thirdShares = new Float64Array(2 * this.set.devices.length);
  }

  /** The workspace factored at `frequency`, refactoring only when it is not already. */
  #factoredAt(frequency: number): AcWorkspace {
    const ws = frequency === 0 ? this.#dc : this.#ac;
    if (ws.frequency !== frequency) ws.factorAt(frequency);
    return ws;
  }

  /** Read the output's first-order phasor from (x1r, x1i) at `frequency` into {@link HarmonicEstimator.fundamental}. */
  readFundamental(frequency: number, x1r: Float64Array, x1i: Float64Array): void {
    this.#read(x1r, x1i, 2 * Math.PI * frequency, this.fundamental);
  }

  /** Solve the excitation in #re, #im at `frequency` and read the output into `out` at [offset, offset+1]. */
  #solveAndRead(frequency: number, out: Float64Array, offset: number): void {
    this.#factoredAt(frequency).solve(this.#re, this.#im);
    this.#readHarmonic(this.#re, this.#im, 2 * Math.PI * frequency, this.#value);
    out[offset] = this.#value[0]!;
    out[offset + 1] = this.#value[1]!;
  }

  /**
   * Estimate at drive frequency `frequency` from the first-order solution (x1r, x1i) there: H1, H2,
   * H3, C1 and the mean shift, and with `shares` each group's part of H2 and H3.
   */
  evaluate(frequency: number, x1r: Float64Array, x1i: Float64Array, shares: boolean): void {
    this.evaluateSecondOrder(frequency, x1r, x1i, shares);
    this.evaluateThirdOrder(frequency, x1r, x1i, shares);
  }

  /**
   * Solve, once, the output's DC response to a unit of each nonlinear current, so that
   * {@link HarmonicEstimator.evaluateSecondOrder} can form the output's mean shift without a solve
   * (worth it when there are more frequencies than currents).
   */
  prepareMeanTransfer(): void {
    const { currents } = this.set;
    const transfer = new Float64Array(currents.length);
    const unit = new Float64Array(currents.length);
    for (let i = 0; i < currents.length; i++) {
      unit.fill(0);
      unit[i] = 1;
      injectCurrents(this.set, unit, this.#noCurrent, -1, this.#re, this.#im);
      this.#factoredAt(0).solve(this.#re, this.#im);
      this.#readHarmonic(this.#re, this.#im, 0, this.#value);
      transfer[i] = this.#value[0]!;
    }
    this.#meanTransfer = transfer;
  }

  /**
   * The first half of {@link HarmonicEstimator.evaluate}: H1, the mean shift and H2 (one factorization,
   * at 2f). `meanResponse` keeps the whole DC response, which the third order needs.
   */
  evaluateSecondOrder(
    frequency: number,
    x1r: Float64Array,
    x1i: Float64Array,
    shares: boolean,
    meanResponse = true,
  ): void {
    const { currents } = this.set;
    const v = this.#v;
    const form = this.#form;
    this.#read(x1r, x1i, 2 * Math.PI * frequency, this.fundamental);

    // Second order: I⁽²⁾ = ¼·Q(V, V) at 2f, and ¼·Re Q(V, V̄) at DC.
    for (let i = 0; i < currents.length; i++) {
      const current = currents[i]!;
      v.read(current, x1r, x1i);
      this.#vBar.read(current, x1r, x1i, true);
      quadratic(current, v, v, form);
      this.#currentRe[i] = 0.25 * form[0]!;
      this.#currentIm[i] = 0.25 * form[1]!;
      quadratic(current, v, this.#vBar, form);
      this.#meanCurrent[i] = 0.25 * form[0]!;
    }
    const transfer = this.#meanTransfer;
    if (transfer !== null && !meanResponse) {
      // Only the output's mean is needed: the precomputed DC transfer of every current gives it.
      let mean = 0;
      for (let i = 0; i < currents.length; i++) mean += transfer[i]! * this.#meanCurrent[i]!;
      this.mean = mean;
    } else {
      injectCurrents(this.set, this.#meanCurrent, this.#noCurrent, -1, this.#mRe, this.#mIm);
      this.#factoredAt(0).solve(this.#mRe, this.#mIm);
      this.#readHarmonic(this.#mRe, this.#mIm, 0, this.#value);
      this.mean = this.#value[0]!;
    }
    this.#solveOrder(2 * frequency, shares, this.secondShares, this.second, this.#wRe, this.#wIm);
  }

  /**
   * The second half of {@link HarmonicEstimator.evaluate}: H3 and C1 (factorizations at 3f and f). It
   * reads the second-order responses left by {@link HarmonicEstimator.evaluateSecondOrder}, which must
   * have run last, at the same frequency.
   */
  evaluateThirdOrder(frequency: number, x1r: Float64Array, x1i: Float64Array, shares: boolean): void {
    const { currents } = this.set;
    const v = this.#v;
    const form = this.#form;
    // Third order at 3f: I⁽³⁾ = (1/24)·K(V, V, V) + ½·Q(V, W).
    for (let i = 0; i < currents.length; i++) {
      const current = currents[i]!;
      v.read(current, x1r, x1i);
      this.#w.read(current, this.#wRe, this.#wIm);
      cubic(current, v, v, v, form);
      let re = form[0]! / 24;
      let im = form[1]! / 24;
      quadratic(current, v, this.#w, form);
      re += 0.5 * form[0]!;
      im += 0.5 * form[1]!;
      this.#currentRe[i] = re;
      this.#currentIm[i] = im;
    }
    this.#solveOrder(3 * frequency, shares, this.thirdShares, this.third, null, null);

    // Third order at f: I_C = (1/8)·K(V, V, V̄) + ½·Q(V̄, W) + Q(V, M).
    for (let i = 0; i < currents.length; i++) {
      const current = currents[i]!;
      v.read(current, x1r, x1i);
      this.#vBar.read(current, x1r, x1i, true);
      this.#w.read(current, this.#wRe, this.#wIm);
      this.#m.read(current, this.#mRe, this.#mIm);
      cubic(current, v, v, this.#vBar, form);
      let re = form[0]! / 8;
      let im = form[1]! / 8;
      quadratic(current, this.#vBar, this.#w, form);
      re += 0.5 * form[0]!;
      im += 0.5 * form[1]!;
      quadratic(current, v, this.#m, form);
      re += form[0]!;
      im += form[1]!;
      this.#currentRe[i] = re;
      this.#currentIm[i] = im;
    }
    injectCurrents(this.set, this.#currentRe, this.#currentIm, -1, this.#re, this.#im);
    this.#solveAndRead(frequency, this.compression, 0);
  }

  /**
   * Solve the injected currents of one order at `frequency`: once for all of them, or (with `shares`)
   * once per group, summing. The total output phasor goes to `total`; the summed solution, when asked
   * for, to (solutionRe, solutionIm).
   */
  #solveOrder(
    frequency: number,
    shares: boolean,
    shareOut: Float64Array,
    total: Float64Array,
    solutionRe: Float64Array | null,
    solutionIm: Float64Array | null,
  ): void {
    const groups = shares ? this.set.devices.length : 0;
    if (shares && groups > SHARES_BY_ADJOINT) {
      // One forward solve for the total, one transposed solve for every share.
      injectCurrents(this.set, this.#currentRe, this.#currentIm, -1, this.#re, this.#im);
      this.#solveAndRead(frequency, total, 0);
      solutionRe?.set(this.#re);
      solutionIm?.set(this.#im);
      this.#adjoint ??= new OutputAdjoint(this.#ac, this.#readHarmonic);
      this.#adjoint.solveAt(frequency);
      shareOut.fill(0);
      const { currents, owner } = this.set;
      for (let i = 0; i < currents.length; i++) {
        const { from, to } = currents[i]!;
        this.#adjoint.addResponse(
          from,
          to,
          this.#currentRe[i]!,
          this.#currentIm[i]!,
          shareOut,
          2 * owner[i]!,
        );
      }
      return;
    }
    if (!shares) {
      injectCurrents(this.set, this.#currentRe, this.#currentIm, -1, this.#re, this.#im);
      this.#solveAndRead(frequency, total, 0);
      solutionRe?.set(this.#re);
      solutionIm?.set(this.#im);
      return;
    }
    total.fill(0);
    solutionRe?.fill(0);
    solutionIm?.fill(0);
    for (let g = 0; g < groups; g++) {
      injectCurrents(this.set, this.#currentRe, this.#currentIm, g, this.#re, this.#im);
      this.#solveAndRead(frequency, shareOut, 2 * g);
      total[0]! += shareOut[2 * g]!;
      total[1]! += shareOut[2 * g + 1]!;
      if (solutionRe !== null && solutionIm !== null) {
        for (let i = 0; i < solutionRe.length; i++) {
          solutionRe[i]! += this.#re[i]!;
          solutionIm[i]! += this.#im[i]!;
        }
      }
    }
  }

  /** The operating point estimated at. */
  get operatingPoint(): OperatingPoint {
    return this.#op;
  }
}

/**
 * Estimate the 2nd and 3rd harmonics of an output, the third-order change of its fundamental, and each
 * junction's share, by the method of nonlinear currents on the circuit linearized at the AC analysis's
 * operating point. Costs one factorization at 0 Hz, then per frequency three (at 2f, 3f and f) and two
 * solves per junction.
 *
 * @param ac - the small-signal analysis (the first-order response)
 * @param options - `output` probe, optional `frequency` (one of the analysed ones) and drive `scale`
 * @returns one {@link DistortionPoint} per frequency
 * @throws QuiescentError `invalid-value` for a bad scale or a frequency that was not analysed;
 *   `unknown-node`, `unknown-element` for a probe the circuit lacks; `singular` at 2f, 3f or 0 Hz
 *
 * @example
 * ```ts
 * const ac = acAnalysis(op, { frequencies: [1e3] });
 * const [point] = distortion(ac, { output: 'out' }).points;
 * point.secondRatio; // 2nd harmonic over the fundamental at the output
 * ```
 */
export function distortion(ac: AcAnalysis, options: DistortionOptions): DistortionEstimate {
  requireInstance(ac, AcAnalysis, 'ac', 'an AcAnalysis (the result of acAnalysis(op, options))');
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the output to estimate');
  }
  const scale = checkDriveScale(options.scale ?? 1);
  const indices = frequencyIndices(ac, options.frequency);
  const op = ac.operatingPoint;
  const stride = op.system.n + 1;
  const estimator = new HarmonicEstimator(op, options.output, true);
  const points = indices.map((k) => {
    const f = ac.frequencies[k]!;
    estimator.evaluate(
      f,
      ac.re.subarray(k * stride, (k + 1) * stride),
      ac.im.subarray(k * stride, (k + 1) * stride),
      true,
    );
    return assemble(f, estimator, scale);
  });
  return { output: options.output, outputName: describeProbe(options.output), scale, points };
}

/** Check the factor every AC source is scaled by: a finite number > 0. Shared with the quasi-static check. */
export function checkDriveScale(scale: unknown): number {
  if (typeof scale !== 'number' || !Number.isFinite(scale) || scale <= 0) {
    throw invalidValue(['scale'], scale, 'a finite factor > 0');
  }
  return scale;
}

/** The indices of the analysed frequencies to estimate at. */
function frequencyIndices(ac: AcAnalysis, frequency: number | undefined): number[] {
  if (frequency === undefined) return Array.from(ac.frequencies.keys());
  return [analysedFrequencyIndex(ac.frequencies, frequency)];
}

/** |a|/|b|, with 0/0 = 0 and a/0 = Infinity. */
export function ratio(a: number, b: number): number {
  if (b === 0) return a === 0 ? 0 : Number.POSITIVE_INFINITY;
  return a / b;
}

/** Re(c/h) for complex c = (cr, ci), h = (hr, hi); 0 when h = 0. */
export function relativeReal(cr: number, ci: number, hr: number, hi: number): number {
  const size = hr * hr + hi * hi;
  return size === 0 ? 0 : (cr * hr + ci * hi) / size;
}

/** The point of the estimator's last evaluation, every phasor scaled by the drive scale's power. */
function assemble(frequency: number, e: HarmonicEstimator, scale: number): DistortionPoint {
  const s2 = scale * scale;
  const s3 = s2 * scale;
  const fundamental = new Complex(e.fundamental[0]! * scale, e.fundamental[1]! * scale);
  const second = new Complex(e.second[0]! * s2, e.second[1]! * s2);
  const third = new Complex(e.third[0]! * s3, e.third[1]! * s3);
  const compressionPhasor = new Complex(e.compression[0]! * s3, e.compression[1]! * s3);
  const base = fundamental.abs();
  const contributions = e.set.devices.map((group, g) => {
    const s = new Complex(e.secondShares[2 * g]! * s2, e.secondShares[2 * g + 1]! * s2);
    const t = new Complex(e.thirdShares[2 * g]! * s3, e.thirdShares[2 * g + 1]! * s3);
    return {
      ...group,
      second: s,
      third: t,
      secondRatio: ratio(s.abs(), base),
      thirdRatio: ratio(t.abs(), base),
    };
  });
  return {
    frequency,
    fundamental,
    second,
    third,
    compressionPhasor,
    compression: relativeReal(compressionPhasor.re, compressionPhasor.im, fundamental.re, fundamental.im),
    meanShift: e.mean * s2,
    secondRatio: ratio(second.abs(), base),
    thirdRatio: ratio(third.abs(), base),
    harmonicDistortion: ratio(Math.hypot(second.abs(), third.abs()), base),
    contributions,
  };
}
