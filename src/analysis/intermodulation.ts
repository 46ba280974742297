/**
 * Two-tone intermodulation by the method of nonlinear currents (E. Bussgang, L. Ehrman and
 * J. W. Graham, Proc. IEEE 62(8), 1974; P. Wambacq and W. Sansen, Distortion Analysis of Analog
 * Integrated Circuits, Kluwer, 1998, ch. 4). Every AC source drives both tones with its own magnitude
 * and phase, s(t) = A·cos(ω1·t + φ) + A·cos(ω2·t + φ), so the first-order response is
 * v⁽¹⁾ = Re(V1·e^{jω1t}) + Re(V2·e^{jω2t}) with V1, V2 the small-signal solutions at f1 and f2.
 *
 * Second order (½ Σ f_ab·v_a·v_b; the two cross terms are equal since f_ab is symmetric):
 *   at 2f1:      ¼·Q(V1, V1)          at 2f2: ¼·Q(V2, V2)
 *   at f2 − f1:  ½·Q(V̄1, V2)          at f1 + f2: ½·Q(V1, V2)
 * with Q(X, Y) = Σ f_ab·X_a·Y_b. For one junction driven by an ideal source (f'' = 2g₂) the product at
 * f2 − f1 is g₂·|V|², x/2 of the fundamental g₁·|V| for an exponential (g₂/g₁ = 1/(2·n·Vt)).
 *
 * Third order at 2f1 − f2: from ⅙ Σ f_abc·v_a·v_b·v_c the three placements of V1, V1, V̄2 give
 * (1/8)·K(V1, V1, V̄2); from Σ f_ab·v⁽¹⁾_a·v⁽²⁾_b the pairs (V1 at f1, D̄ at f1 − f2) and (V̄2 at −f2,
 * W11 at 2f1) give ½·Q(V1, D̄) + ½·Q(V̄2, W11), where D = V⁽²⁾(f2 − f1) and W11 = V⁽²⁾(2f1). So
 *   I(2f1 − f2) = (1/8)·K(V1, V1, V̄2) + ½·Q(V1, D̄) + ½·Q(V̄2, W11),
 *   I(2f2 − f1) = (1/8)·K(V2, V2, V̄1) + ½·Q(V2, D) + ½·Q(V̄1, W22).
 * For one junction (f''' = 6g₃, no second-order voltage) that is ¾·g₃·|V|³, x²/8 of the fundamental.
 * A product at a negative frequency is solved there as it stands (the circuit at −ω is the conjugate
 * of the circuit at ω); its magnitude is that of the product at the positive frequency.
 *
 * Factorizations: f1, f2, 2f1, 2f2, f2 − f1, f1 + f2, 2f1 − f2 and 2f2 − f1, one each; the devices'
 * contributions to the larger order-3 product take one solve each, or with many devices one
 * transposed solve for all (output-adjoint.ts).
 */
import { Complex } from 'complex.js';
import { invalidValue, noSignal } from '../errors/messages.js';
import type { Probe } from './ac-analysis.js';
import { AcWorkspace } from './ac-workspace.js';
import { ratio, SHARES_BY_ADJOINT } from './distortion.js';
import { describeProbe, probeReader } from './distortion-probe.js';
import {
  ControlPhasors,
  cubic,
  gatherNonlinearCurrents,
  injectCurrents,
  quadratic,
} from './nonlinear-currents.js';
import type { OperatingPoint } from './operating-point.js';
import { OutputAdjoint } from './output-adjoint.js';

/** Options of {@link intermodulation}. */
export interface IntermodulationOptions {
  /** Where the products are read: a node, a node pair or an element current. */
  readonly output: Probe;
  /** The two tones f1 and f2, in Hz: positive and distinct. */
  readonly tones: readonly [number, number];
}

/** One intermodulation product at the output. */
export interface IntermodulationProduct {
  /** Its frequency, in Hz (|f2 − f1|, f1 + f2, |2f1 − f2|, |2f2 − f1|). */
  readonly frequency: number;
  /** How it arises: `'f2 - f1'`, `'f1 + f2'`, `'2f1 - f2'` or `'2f2 - f1'`. */
  readonly mix: '2f1 - f2' | '2f2 - f1' | 'f1 + f2' | 'f2 - f1';
  /** 2 or 3. */
  readonly order: 2 | 3;
  /** Its peak amplitude at the output (V or A). */
  readonly amplitude: number;
  /** amplitude / the output's amplitude at f1. */
  readonly ratio: number;
}

/** A device's contribution to the larger third-order product. */
export interface IntermodulationContribution {
  /** The device's element name. */
  readonly device: string;
  /** |its part of the product| / the output's amplitude at f1 (the complex parts add to the total). */
  readonly thirdOrder: number;
}

/** Two-tone intermodulation of an output. */
export interface Intermodulation {
  /** The output probe. */
  readonly output: Probe;
  /** Its description. */
  readonly outputName: string;
  /** The tones f1 and f2, in Hz. */
  readonly tones: readonly [number, number];
  /** The output's peak amplitudes at f1 and at f2. */
  readonly fundamental: readonly [number, number];
  /** f2 − f1 and f1 + f2 (order 2), then 2f1 − f2 and 2f2 − f1 (order 3). */
  readonly products: readonly IntermodulationProduct[];
  /** The ratio of the f2 − f1 product. */
  readonly secondOrder: number;
  /** The larger ratio of the two order-3 products. */
  readonly thirdOrder: number;
  /** 1/secondOrder: the drive scale at which the extrapolated f2 − f1 product equals the fundamental. */
  readonly inputIntercept2: number;
  /** 1/√thirdOrder: the drive scale at which the extrapolated order-3 product equals the fundamental. */
  readonly inputIntercept3: number;
  /** The output's amplitude at f1 times `inputIntercept3` (V or A). */
  readonly outputIntercept3: number;
  /** Each device's contribution to the larger order-3 product, in circuit order. */
  readonly contributions: readonly IntermodulationContribution[];
}

/** A solution vector (re, im) of length n+1. */
interface Solution {
  readonly re: Float64Array;
  readonly im: Float64Array;
}

/** Check the two tones: positive, finite and distinct. */
function checkTones(tones: unknown): readonly [number, number] {
  const good =
    Array.isArray(tones) &&
    tones.length === 2 &&
    tones.every((f) => typeof f === 'number' && Number.isFinite(f) && f > 0) &&
    tones[0] !== tones[1];
  if (!good) throw invalidValue(['tones'], tones, 'two distinct positive frequencies [f1, f2] in Hz');
  return [tones[0] as number, tones[1] as number];
}

/**
 * The second- and third-order intermodulation products of two tones at an output, their intercepts
 * and each device's share of the larger third-order product.
 *
 * @param op - the operating point the circuit is linearized at; its AC sources set the tones' drive
 * @param options - `output` probe and `tones` [f1, f2] in Hz
 * @returns the {@link Intermodulation}
 * @throws QuiescentError `invalid-value` for tones that are not two distinct positive frequencies or a
 *   bad probe; `unknown-node`, `unknown-element`; `no-signal` when the output carries nothing at f1;
 *   `singular` at any of the frequencies solved
 *
 * @example
 * ```ts
 * const im = intermodulation(op, { output: 'out', tones: [1e3, 1.1e3] });
 * im.thirdOrder;      // the larger order-3 product over the fundamental
 * im.inputIntercept3; // the drive scale of the third-order intercept
 * ```
 */
export function intermodulation(op: OperatingPoint, options: IntermodulationOptions): Intermodulation {
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the output and the two tones');
  }
  const [f1, f2] = checkTones(options.tones);
  const output = options.output;
  const system = op.system;
  const n = system.n;
  const read = probeReader(system, op, output, false);
  const readHarmonic = probeReader(system, op, output, true);
  const set = gatherNonlinearCurrents(op);
  const { currents } = set;
  const workspace = new AcWorkspace(op);
  const solution = (): Solution => ({ re: new Float64Array(n + 1), im: new Float64Array(n + 1) });
  const value = new Float64Array(2);
  const form = new Float64Array(2);

  /** The small-signal solution at f, and the output's phasor there. */
  const firstOrder = (f: number): { x: Solution; phasor: Complex } => {
    workspace.factorAt(f);
    const x = solution();
    x.re.set(workspace.sourceRe);
    x.im.set(workspace.sourceIm);
    workspace.solve(x.re, x.im);
    read(x.re, x.im, 2 * Math.PI * f, value);
    return { x, phasor: new Complex(value[0]!, value[1]!) };
  };
  const one = firstOrder(f1);
  const two = firstOrder(f2);
  const base = one.phasor.abs();
  if (base === 0) {
    throw noSignalAt(output, f1);
  }

  const currentRe = new Float64Array(currents.length);
  const currentIm = new Float64Array(currents.length);
  const p = new ControlPhasors(set.maxControls);
  const q = new ControlPhasors(set.maxControls);
  const r = new ControlPhasors(set.maxControls);

  /** Solve the currents in currentRe/Im at f (all devices, or one), returning the solution and the output. */
  const solveAt = (f: number, device: number, into: Solution = solution()): Complex => {
    injectCurrents(set, currentRe, currentIm, device, into.re, into.im);
    workspace.solve(into.re, into.im);
    readHarmonic(into.re, into.im, 2 * Math.PI * f, value);
    return new Complex(value[0]!, value[1]!);
  };

  /** A second-order response: coefficient·Q(X, Y) at f, X and Y read from solutions (conjugated on request). */
  const secondOrder = (
    f: number,
    coefficient: number,
    x: Solution,
    conjugateX: boolean,
    y: Solution,
  ): { x: Solution; phasor: Complex } => {
    for (let i = 0; i < currents.length; i++) {
      const current = currents[i]!;
      quadratic(current, p.read(current, x.re, x.im, conjugateX), q.read(current, y.re, y.im), form);
      currentRe[i] = coefficient * form[0]!;
      currentIm[i] = coefficient * form[1]!;
    }
    workspace.factorAt(f);
    const into = solution();
    return { x: into, phasor: solveAt(f, -1, into) };
  };
  const difference = secondOrder(f2 - f1, 0.5, one.x, true, two.x);
  const sum = secondOrder(f1 + f2, 0.5, one.x, false, two.x);
  const double1 = secondOrder(2 * f1, 0.25, one.x, false, one.x);
  const double2 = secondOrder(2 * f2, 0.25, two.x, false, two.x);

  /**
   * The currents at 2·fa − fb: (1/8)·K(Va, Va, V̄b) + ½·Q(Va, E) + ½·Q(V̄b, Waa), with E = D̄ for
   * a = 1 and E = D for a = 2.
   */
  const thirdOrderCurrents = (a: Solution, b: Solution, conjugateD: boolean, doubled: Solution): void => {
    for (let i = 0; i < currents.length; i++) {
      const current = currents[i]!;
      p.read(current, a.re, a.im);
      q.read(current, b.re, b.im, true);
      cubic(current, p, p, q, form);
      let re = form[0]! / 8;
      let im = form[1]! / 8;
      quadratic(current, p, r.read(current, difference.x.re, difference.x.im, conjugateD), form);
      re += 0.5 * form[0]!;
      im += 0.5 * form[1]!;
      quadratic(current, q, r.read(current, doubled.re, doubled.im), form);
      re += 0.5 * form[0]!;
      im += 0.5 * form[1]!;
      currentRe[i] = re;
      currentIm[i] = im;
    }
  };
  // Each device's part of the larger order-3 product: with few devices one solve each, right after
  // the product's own solve; with many, one transposed solve at the larger product afterwards.
  const fewDevices = set.devices.length <= SHARES_BY_ADJOINT;
  const lowerFrequency = 2 * f1 - f2;
  thirdOrderCurrents(one.x, two.x, true, double1.x);
  workspace.factorAt(lowerFrequency);
  const lower = solveAt(lowerFrequency, -1);
  const lowerShares = fewDevices ? set.devices.map((_, g) => solveAt(lowerFrequency, g)) : [];
  const lowerCurrents = [currentRe.slice(), currentIm.slice()] as const;
  const upperFrequency = 2 * f2 - f1;
  thirdOrderCurrents(two.x, one.x, false, double2.x);
  workspace.factorAt(upperFrequency);
  const upper = solveAt(upperFrequency, -1);
  const upperShares = fewDevices ? set.devices.map((_, g) => solveAt(upperFrequency, g)) : [];
  const lowerLarger = lower.abs() >= upper.abs();
  let shares = lowerLarger ? lowerShares : upperShares;
  if (!fewDevices) {
    if (lowerLarger) {
      currentRe.set(lowerCurrents[0]);
      currentIm.set(lowerCurrents[1]);
    }
    const adjoint = new OutputAdjoint(workspace, readHarmonic);
    adjoint.solveAt(lowerLarger ? lowerFrequency : upperFrequency);
    const parts = new Float64Array(2 * set.devices.length);
    for (let i = 0; i < currents.length; i++) {
      const { from, to } = currents[i]!;
      adjoint.addResponse(from, to, currentRe[i]!, currentIm[i]!, parts, 2 * set.owner[i]!);
    }
    shares = set.devices.map((_, g) => new Complex(parts[2 * g]!, parts[2 * g + 1]!));
  }

  const product = (
    frequency: number,
    mix: IntermodulationProduct['mix'],
    order: 2 | 3,
    phasor: Complex,
  ): IntermodulationProduct => ({
    frequency: Math.abs(frequency),
    mix,
    order,
    amplitude: phasor.abs(),
    ratio: ratio(phasor.abs(), base),
  });
  const products = [
    product(f2 - f1, 'f2 - f1', 2, difference.phasor),
    product(f1 + f2, 'f1 + f2', 2, sum.phasor),
    product(lowerFrequency, '2f1 - f2', 3, lower),
    product(upperFrequency, '2f2 - f1', 3, upper),
  ];
  const secondOrderRatio = products[0]!.ratio;
  const thirdOrderRatio = Math.max(products[2]!.ratio, products[3]!.ratio);
  const inputIntercept3 = thirdOrderRatio === 0 ? Number.POSITIVE_INFINITY : 1 / Math.sqrt(thirdOrderRatio);
  return {
    output,
    outputName: describeProbe(output),
    tones: [f1, f2],
    fundamental: [base, two.phasor.abs()],
    products,
    secondOrder: secondOrderRatio,
    thirdOrder: thirdOrderRatio,
    inputIntercept2: secondOrderRatio === 0 ? Number.POSITIVE_INFINITY : 1 / secondOrderRatio,
    inputIntercept3,
    outputIntercept3: base * inputIntercept3,
    contributions: set.devices.map((d, g) => ({ device: d.device, thirdOrder: shares[g]!.abs() / base })),
  };
}

/** The `no-signal` error for an output that carries nothing at the first tone. */
function noSignalAt(output: Probe, f1: number) {
  return noSignal(describeProbe(output), [f1], 'its small-signal phasor at the first tone is zero');
}
