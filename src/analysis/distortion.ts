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
 * Each junction's currents are injected alone, so its share of each harmonic is its own solve; the
 * shares add up to the total (superposition on the linear circuit). The 3rd-order share of a junction
 * includes its interaction term with the whole second-order response W.
 *
 * Assumptions: a single sinusoidal drive (every AC source at the same frequency with its own phase),
 * weak nonlinearity (each harmonic much smaller than the one below it; the estimate is the leading
 * term of each harmonic, growing as s², s³ with the drive scale s), and nonlinear conductances only:
 * the bias dependence of the junction capacitances is not included.
 */
import Complex from 'complex.js';
import type { ElementKind } from '../circuit/elements.js';
import type { JunctionProbe, NonlinearCurrent } from '../devices/device.js';
import { addCurrent } from '../devices/stamp.js';
import { invalidValue } from '../errors/messages.js';
import type { AcAnalysis, Probe } from './ac-analysis.js';
import { AcWorkspace } from './ac-workspace.js';
import { describeProbe, type ProbeReader, probeReader } from './distortion-probe.js';
import { prepareDevices } from './newton.js';

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
  /** The shift of the output's mean value (rectification), to second order. */
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
  /** Its description, such as `v(out)` or `i(RL)`. */
  readonly outputName: string;
  /** The scale applied to every AC source. */
  readonly scale: number;
  /** One point per frequency, in the order of the AC analysis. */
  readonly points: readonly DistortionPoint[];
}

/** A device's nonlinear current, tagged with its junction group. */
interface Injection {
  readonly current: NonlinearCurrent;
  readonly group: number;
}

/** A junction: the group of injections whose share is reported together. */
interface Group {
  readonly device: string;
  readonly kind: ElementKind;
  readonly junction: JunctionProbe['junction'];
}

/**
 * Estimate the 2nd and 3rd harmonics of an output, and each junction's share, by the method of
 * nonlinear currents on the circuit linearized at the AC analysis's operating point. Costs, per
 * frequency, three factorizations (at 2f, 3f and 0) and two solves per junction.
 *
 * @param ac - the small-signal analysis, whose solution is the first-order response
 * @param options - `output` probe; optional `frequency` (one of the analysed ones) and `scale`
 * @returns the estimate at each frequency
 * @throws QuiescentError `invalid-value` for a bad probe, scale or a frequency that was not analysed;
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
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the output to estimate');
  }
  const scale = checkDriveScale(options.scale ?? 1);
  const indices = frequencyIndices(ac, options.frequency);
  const op = ac.operatingPoint;
  const system = op.system;
  const n = system.n;
  const stride = n + 1;
  const read = probeReader(system, op.x, options.output, false);
  const readHarmonic = probeReader(system, op.x, options.output, true);

  prepareDevices(system, op.conditions);
  const groups: Group[] = [];
  const injections: Injection[] = [];
  for (const device of system.devices) {
    for (const current of device.nonlinearCurrents?.(op.x) ?? []) {
      let group = groups.findIndex((g) => g.device === device.name && g.junction === current.junction);
      if (group < 0) {
        group = groups.length;
        groups.push({ device: device.name, kind: device.record.kind, junction: current.junction });
      }
      injections.push({ current, group });
    }
  }

  const workspace = new AcWorkspace(op);
  const work = new Workspace(n, groups.length, injections);
  const points: DistortionPoint[] = [];
  for (const k of indices) {
    const f = ac.frequencies[k]!;
    const x1r = ac.re.subarray(k * stride, (k + 1) * stride);
    const x1i = ac.im.subarray(k * stride, (k + 1) * stride);
    read(x1r, x1i, 2 * Math.PI * f, work.value);
    const fundamental = new Complex(work.value[0]! * scale, work.value[1]! * scale);

    // Second order at 2f: one solve per junction; their sum is W.
    for (let i = 0; i < injections.length; i++) secondOrderCurrent(injections[i]!.current, x1r, x1i, work, i);
    workspace.factorAt(2 * f);
    const second = solveShares(workspace, injections, work, readHarmonic, 4 * Math.PI * f, scale ** 2);
    work.secondTotalRe.fill(0);
    work.secondTotalIm.fill(0);
    for (let g = 0; g < groups.length; g++) {
      for (let i = 0; i < stride; i++) {
        work.secondTotalRe[i]! += work.shareRe[g]![i]!;
        work.secondTotalIm[i]! += work.shareIm[g]![i]!;
      }
    }

    // Third order at 3f, with the interaction of each junction with the whole second-order response.
    for (let i = 0; i < injections.length; i++) {
      thirdOrderCurrent(injections[i]!.current, x1r, x1i, work.secondTotalRe, work.secondTotalIm, work, i);
    }
    workspace.factorAt(3 * f);
    const third = solveShares(workspace, injections, work, readHarmonic, 6 * Math.PI * f, scale ** 3);

    // The mean shift: the DC part of the second-order current, solved at 0 Hz.
    work.dcRe.fill(0);
    work.dcIm.fill(0);
    for (const { current } of injections) {
      addCurrent(work.dcRe, current.from, current.to, meanCurrent(current, x1r, x1i, work));
    }
    workspace.factorAt(0);
    workspace.solve(work.dcRe, work.dcIm);
    readHarmonic(work.dcRe, work.dcIm, 0, work.value);
    const meanShift = work.value[0]! * scale ** 2;

    points.push(assemble(f, fundamental, second, third, meanShift, groups));
  }
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
  const all = Array.from(ac.frequencies.keys());
  if (frequency === undefined) return all;
  const k = all.find((i) => ac.frequencies[i] === frequency);
  if (k === undefined) {
    throw invalidValue(['frequency'], frequency, 'one of the frequencies of the AC analysis');
  }
  return [k];
}

/** Buffers sized once per estimate, reused at every frequency. */
class Workspace {
  /** Injected current phasor of each nonlinear current (re, im). */
  readonly injectedRe: Float64Array;
  readonly injectedIm: Float64Array;
  /** Each junction's solution at the present harmonic. */
  readonly shareRe: Float64Array[];
  readonly shareIm: Float64Array[];
  /** The whole second-order solution W at 2f. */
  readonly secondTotalRe: Float64Array;
  readonly secondTotalIm: Float64Array;
  /** The DC second-order excitation and solution. */
  readonly dcRe: Float64Array;
  readonly dcIm: Float64Array;
  /** Control phasors of one nonlinear current (first and second order). */
  readonly vr: Float64Array;
  readonly vi: Float64Array;
  readonly wr: Float64Array;
  readonly wi: Float64Array;
  readonly value = new Float64Array(2);

  constructor(n: number, groups: number, injections: readonly Injection[]) {
    const m = injections.reduce((most, j) => Math.max(most, j.current.controls.length), 0);
    this.injectedRe = new Float64Array(injections.length);
    this.injectedIm = new Float64Array(injections.length);
    this.shareRe = Array.from({ length: groups }, () => new Float64Array(n + 1));
    this.shareIm = Array.from({ length: groups }, () => new Float64Array(n + 1));
    this.secondTotalRe = new Float64Array(n + 1);
    this.secondTotalIm = new Float64Array(n + 1);
    this.dcRe = new Float64Array(n + 1);
    this.dcIm = new Float64Array(n + 1);
    this.vr = new Float64Array(m);
    this.vi = new Float64Array(m);
    this.wr = new Float64Array(m);
    this.wi = new Float64Array(m);
  }
}

/** Control phasors V_a = X[plus] − X[minus] into (outRe, outIm). */
function controlPhasors(
  current: NonlinearCurrent,
  xr: Float64Array,
  xi: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
): void {
  const controls = current.controls;
  for (let a = 0; a < controls.length; a++) {
    const { plus, minus } = controls[a]!;
    outRe[a] = xr[plus]! - xr[minus]!;
    outIm[a] = xi[plus]! - xi[minus]!;
  }
}

/** I⁽²⁾ = ¼ Σ_ab f_ab·V_a·V_b into injected[i]. */
function secondOrderCurrent(
  current: NonlinearCurrent,
  xr: Float64Array,
  xi: Float64Array,
  work: Workspace,
  i: number,
): void {
  const { vr, vi } = work;
  controlPhasors(current, xr, xi, vr, vi);
  const m = current.controls.length;
  let re = 0;
  let im = 0;
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) {
      const f = current.second[a * m + b]!;
      if (f === 0) continue;
      re += f * (vr[a]! * vr[b]! - vi[a]! * vi[b]!);
      im += f * (vr[a]! * vi[b]! + vi[a]! * vr[b]!);
    }
  }
  work.injectedRe[i] = 0.25 * re;
  work.injectedIm[i] = 0.25 * im;
}

/** I⁽³⁾ = (1/24) Σ_abc f_abc·V_a·V_b·V_c + ½ Σ_ab f_ab·V_a·W_b into injected[i]. */
function thirdOrderCurrent(
  current: NonlinearCurrent,
  xr: Float64Array,
  xi: Float64Array,
  yr: Float64Array,
  yi: Float64Array,
  work: Workspace,
  i: number,
): void {
  const { vr, vi, wr, wi } = work;
  controlPhasors(current, xr, xi, vr, vi);
  controlPhasors(current, yr, yi, wr, wi);
  const m = current.controls.length;
  let cubicRe = 0;
  let cubicIm = 0;
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) {
      const pr = vr[a]! * vr[b]! - vi[a]! * vi[b]!;
      const pi = vr[a]! * vi[b]! + vi[a]! * vr[b]!;
      for (let c = 0; c < m; c++) {
        const f = current.third[(a * m + b) * m + c]!;
        if (f === 0) continue;
        cubicRe += f * (pr * vr[c]! - pi * vi[c]!);
        cubicIm += f * (pr * vi[c]! + pi * vr[c]!);
      }
    }
  }
  let mixRe = 0;
  let mixIm = 0;
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) {
      const f = current.second[a * m + b]!;
      if (f === 0) continue;
      mixRe += f * (vr[a]! * wr[b]! - vi[a]! * wi[b]!);
      mixIm += f * (vr[a]! * wi[b]! + vi[a]! * wr[b]!);
    }
  }
  work.injectedRe[i] = cubicRe / 24 + 0.5 * mixRe;
  work.injectedIm[i] = cubicIm / 24 + 0.5 * mixIm;
}

/** The DC second-order current ¼ Σ_ab f_ab·Re(V_a·V̄_b). */
function meanCurrent(current: NonlinearCurrent, xr: Float64Array, xi: Float64Array, work: Workspace): number {
  const { vr, vi } = work;
  controlPhasors(current, xr, xi, vr, vi);
  const m = current.controls.length;
  let sum = 0;
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) sum += current.second[a * m + b]! * (vr[a]! * vr[b]! + vi[a]! * vi[b]!);
  }
  return 0.25 * sum;
}

/**
 * Inject each junction's currents (work.injected) alone into the factored circuit, solve, and read
 * the output: returns each junction's share of the output phasor, times `factor`. The solutions stay
 * in work.share.
 */
function solveShares(
  workspace: AcWorkspace,
  injections: readonly Injection[],
  work: Workspace,
  read: ProbeReader,
  omega: number,
  factor: number,
): Complex[] {
  const shares: Complex[] = [];
  for (let g = 0; g < work.shareRe.length; g++) {
    const re = work.shareRe[g]!;
    const im = work.shareIm[g]!;
    re.fill(0);
    im.fill(0);
    for (let i = 0; i < injections.length; i++) {
      const { current, group } = injections[i]!;
      if (group !== g) continue;
      addCurrent(re, current.from, current.to, work.injectedRe[i]!);
      addCurrent(im, current.from, current.to, work.injectedIm[i]!);
    }
    workspace.solve(re, im);
    read(re, im, omega, work.value);
    shares.push(new Complex(work.value[0]! * factor, work.value[1]! * factor));
  }
  return shares;
}

/** |a|/|b|, with 0/0 = 0 and a/0 = Infinity. */
function ratio(a: number, b: number): number {
  if (b === 0) return a === 0 ? 0 : Number.POSITIVE_INFINITY;
  return a / b;
}

function assemble(
  frequency: number,
  fundamental: Complex,
  seconds: readonly Complex[],
  thirds: readonly Complex[],
  meanShift: number,
  groups: readonly Group[],
): DistortionPoint {
  const base = fundamental.abs();
  let second = new Complex(0, 0);
  let third = new Complex(0, 0);
  const contributions = groups.map((group, g) => {
    const s = seconds[g]!;
    const t = thirds[g]!;
    second = second.add(s);
    third = third.add(t);
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
    meanShift,
    secondRatio: ratio(second.abs(), base),
    thirdRatio: ratio(third.abs(), base),
    harmonicDistortion: ratio(Math.hypot(second.abs(), third.abs()), base),
    contributions,
  };
}
