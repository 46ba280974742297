/**
 * Sensitivities by the adjoint method: how much an output moves for a change of every parameter of
 * every element, and of the temperature, from one transposed solve and one short product per
 * parameter (Director & Rohrer, "The generalized adjoint network and network sensitivities", IEEE
 * Trans. Circuit Theory 16(3), 1969).
 *
 * DC. The operating point solves F(x, p) = 0, F the KCL and branch residuals. For an output
 * y = g(x, p): dy/dp = ∂g/∂p − λᵀ·∂F/∂p with Jᵀλ = ∂g/∂x, J = ∂F/∂x the converged Jacobian.
 *
 * AC. The phasors solve R = A(x, p)·X − U(p) = 0 at the analysed frequency; an output Y = cᵀX (+ its
 * own dependence on p and x). Both the direct change of the small-signal circuit and the shift of the
 * bias it is linearized at count:
 *   dY/dp = ∂Y/∂p − λᵀ·∂R/∂p − ηᵀ·∂F/∂p,  Aᵀλ = c,  Jᵀη = ∂Y/∂x − λᵀ·∂R/∂x.
 *
 * ∂F/∂p, ∂R/∂p and ∂R/∂x are taken device by device on the few unknowns each device touches
 * (element-unknowns.ts), by central differences of the device's own residual share at the fixed
 * solution, with a step of 10⁻⁶ of the parameter (10⁻³ K for the temperature); the tests check them
 * against closed forms and against differences of independent solves. A parameter whose change alters
 * the unknowns (a diode's series resistance stepping away from 0) has its DC derivative at 0⁺ taken at
 * a small value instead ({@link THRESHOLD_VALUE}); its relative figures are 0, as for any parameter at 0.
 */
import { Complex } from 'complex.js';
import { GROUND } from '../circuit/elements.js';
import type { BiasPoint, Conditions, Device } from '../devices/device.js';
import { thermalVoltage } from '../devices/junction.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import { QuiescentError } from '../errors/quiescent-error.js';
import { type CompiledSystem, rebind } from '../mna/system.js';
import type { AcAnalysis, Probe } from './ac-analysis.js';
import { AcWorkspace } from './ac-workspace.js';
import { analysedFrequencyIndex } from './analysed-frequency.js';
import { currentReader } from './distortion-probe.js';
import { parametersOf, parameterValue, parameterVariant } from './element-parameters.js';
import {
  acShare,
  DeviceScratch,
  dcShare,
  type ElementUnknowns,
  elementUnknowns,
} from './element-unknowns.js';
import { measureResidual, NewtonWorkspace, prepareDevices, prepareWorkspace, singularAt } from './newton.js';
import { nodeAt, type OperatingPoint } from './operating-point.js';
import { resolveOptions } from './options.js';
import { PreparedCircuit } from './prepared.js';

/** A numeric field of a device's report, as a DC sensitivity's output. */
export interface DeviceFieldOutput {
  /** The diode or transistor. */
  readonly device: string;
  /** The report field, such as `'ic'` or `'gm'`. */
  readonly field: string;
}

/** What a DC sensitivity reads: a probe, or a numeric field of a device's report (`{ device: 'Q1', field: 'ic' }`). */
export type SensitivityOutput = Probe | DeviceFieldOutput;

/** A DC sensitivity as plain data. */
export interface SensitivityJson {
  /** The output at the operating point. */
  readonly value: number;
  /** Every entry, largest |relative| first. */
  readonly entries: SensitivityEntry[];
}

/** An AC sensitivity as plain data. */
export interface AcSensitivityJson {
  /** The analysed frequency, in Hz. */
  readonly frequency: number;
  /** The output's phasor there. */
  readonly value: {
    /** Real part. */
    readonly re: number;
    /** Imaginary part. */
    readonly im: number;
  };
  /** Every entry, largest |magnitudeDb| first. */
  readonly entries: AcSensitivityEntry[];
}

/** Options of a DC {@link sensitivity}. */
export interface DcSensitivityOptions {
  /** The output whose sensitivities are wanted. */
  readonly output: SensitivityOutput;
}

/** Options of an AC {@link sensitivity}. */
export interface AcSensitivityOptions {
  /** The output whose phasor is differentiated. */
  readonly output: Probe;
  /** The frequency, in Hz: one of the analysed frequencies. */
  readonly frequency: number;
}

/** One parameter's DC sensitivity. */
export interface SensitivityEntry {
  /** The element, or null for the analysis temperature. */
  readonly element: string | null;
  /** The parameter's name (`'temperature'` for the temperature). */
  readonly parameter: string;
  /** Its value, in its SI unit (K for the temperature). */
  readonly value: number;
  /** ∂output/∂parameter, in the output's unit per the parameter's unit. */
  readonly derivative: number;
  /** parameter·∂output/∂parameter: the output's change for a unit relative change of the parameter. */
  readonly relative: number;
}

/** One parameter's AC sensitivity. */
export interface AcSensitivityEntry {
  /** The element, or null for the analysis temperature. */
  readonly element: string | null;
  /** The parameter's name (`'temperature'` for the temperature). */
  readonly parameter: string;
  /** Its value, in its SI unit. */
  readonly value: number;
  /** ∂(20·log10|Y|)/∂ln p: dB per unit relative change of the parameter. */
  readonly magnitudeDb: number;
  /** ∂(arg Y)/∂ln p in degrees per unit relative change of the parameter. */
  readonly phaseDegrees: number;
}

/** The DC sensitivities of one output. Entries are sorted by |relative|, largest first. */
export class Sensitivity {
  /** The output at the operating point (V, A, or the device field's unit). */
  readonly value: number;
  /** Every parameter of every element, and the temperature. */
  readonly entries: readonly SensitivityEntry[];

  /** @internal Built by {@link sensitivity}. */
  constructor(value: number, entries: SensitivityEntry[]) {
    this.value = value;
    this.entries = Object.freeze(entries.sort((a, b) => Math.abs(b.relative) - Math.abs(a.relative)));
  }

  /** The entry of one parameter; `of(null, 'temperature')` reads the temperature's. */
  of(element: string | null, parameter: string): SensitivityEntry {
    return findEntry(this.entries, element, parameter);
  }

  /** Plain data: the output's value and every entry. */
  toJSON(): SensitivityJson {
    return { value: this.value, entries: this.entries.map((e) => ({ ...e })) };
  }
}

/** The AC sensitivities of one output at one frequency. Entries are sorted by |magnitudeDb|, largest first. */
export class AcSensitivity {
  /** The analysed frequency, in Hz. */
  readonly frequency: number;
  /** The output's phasor there. */
  readonly value: Complex;
  /** Every parameter of every element, and the temperature. */
  readonly entries: readonly AcSensitivityEntry[];

  /** @internal Built by {@link sensitivity}. */
  constructor(frequency: number, value: Complex, entries: AcSensitivityEntry[]) {
    this.frequency = frequency;
    this.value = value;
    this.entries = Object.freeze(entries.sort((a, b) => Math.abs(b.magnitudeDb) - Math.abs(a.magnitudeDb)));
  }

  /** The entry of one parameter; `of(null, 'temperature')` reads the temperature's. */
  of(element: string | null, parameter: string): AcSensitivityEntry {
    return findEntry(this.entries, element, parameter);
  }

  /** Plain data: frequency, the output phasor as { re, im } and every entry. */
  toJSON(): AcSensitivityJson {
    return {
      frequency: this.frequency,
      value: { re: this.value.re, im: this.value.im },
      entries: this.entries.map((e) => ({ ...e })),
    };
  }
}

function findEntry<E extends { element: string | null; parameter: string }>(
  entries: readonly E[],
  element: string | null,
  parameter: string,
): E {
  const found = entries.find((e) => e.element === element && e.parameter === parameter);
  if (found !== undefined) return found;
  if (element !== null && !entries.some((e) => e.element === element)) {
    // An element with no listed parameter (an ideal op-amp) still exists; only a missing one is unknown.
    throw unknownElement(String(element));
  }
  throw invalidValue(
    ['parameter'],
    parameter,
    `a parameter listed for ${element === null ? 'the analysis' : `'${element}'`}`,
  );
}

/**
 * The sensitivities of a DC output (a probe, or a device report field) to every parameter of every
 * element and to the temperature, at an operating point; or of an AC output's magnitude (dB) and
 * phase (degrees) at one analysed frequency. See docs/sensitivity.md.
 *
 * @throws QuiescentError `unknown-node`, `unknown-element` (the output names what the circuit lacks),
 *   `invalid-value` (a device field that is not a number, a frequency that was not analysed, an
 *   output without signal), `singular` (the Jacobian or the small-signal matrix cannot be factored)
 *
 * @example
 * ```ts
 * const s = sensitivity(op, { output: 'out' });
 * s.of('R2', 'resistance').relative;            // V per unit relative change of R2
 * const a = sensitivity(ac, { output: 'out', frequency: 1e3 });
 * a.of('C1', 'capacitance').magnitudeDb;        // dB per unit relative change of C1
 * ```
 */
export function sensitivity(op: OperatingPoint, options: DcSensitivityOptions): Sensitivity;
export function sensitivity(ac: AcAnalysis, options: AcSensitivityOptions): AcSensitivity;
export function sensitivity(
  result: OperatingPoint | AcAnalysis,
  options: DcSensitivityOptions | AcSensitivityOptions,
): Sensitivity | AcSensitivity {
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object naming the output');
  }
  if (
    result !== null &&
    typeof result === 'object' &&
    'frequencies' in result &&
    'operatingPoint' in result
  ) {
    return acSensitivity(result as AcAnalysis, options as AcSensitivityOptions);
  }
  if (result === null || typeof result !== 'object' || !('x' in result) || !('system' in result)) {
    throw invalidValue(['result'], result, 'an operating point or an AC analysis');
  }
  return dcSensitivity(result as OperatingPoint, options as DcSensitivityOptions);
}

/** Relative step of the central differences, and the step of the temperature in K. */
const RELATIVE_STEP = 1e-6;
const TEMPERATURE_STEP = 1e-3;

/** The step for parameter value p: relative, or absolute where p is 0. */
function stepOf(p: number): number {
  return p === 0 ? RELATIVE_STEP : RELATIVE_STEP * Math.abs(p);
}

/** Everything the two sensitivities share: the system, the DC adjoint machinery and scratch. */
class AdjointContext {
  readonly system: CompiledSystem;
  readonly x: Float64Array;
  readonly conditions: Conditions;
  readonly scratch: DeviceScratch;
  readonly #unknowns: (ElementUnknowns | undefined)[];
  readonly #jacobian: NewtonWorkspace;
  readonly #share: Float64Array;

  constructor(readonly op: OperatingPoint) {
    this.system = op.system;
    this.x = op.x;
    this.conditions = op.conditions;
    this.scratch = new DeviceScratch(this.system);
    this.#unknowns = new Array(this.system.devices.length);
    this.#share = new Float64Array(this.system.n + 1);
    prepareDevices(this.system, this.conditions);
    // The converged Jacobian: every device loaded at the solution itself.
    const ws = new NewtonWorkspace(this.system);
    ws.x.set(this.x);
    prepareWorkspace(ws, this.conditions);
    measureResidual(ws, resolveOptions());
    const status = ws.solver.factor(ws.A);
    if (status !== 0) throw singularAt(this.system, status - 1, 'in the Jacobian at the operating point');
    this.#jacobian = ws;
  }

  unknownsOf(k: number): ElementUnknowns {
    let e = this.#unknowns[k];
    if (e === undefined) {
      e = elementUnknowns(this.system, k);
      this.#unknowns[k] = e;
    }
    return e;
  }

  /**
   * y ← J⁻ᵀ·y (y of length n + 1; y[n] is set to 0), its residual checked: ‖b − Jᵀy‖ within 1e-9 of
   * ‖b‖ + ‖J‖·‖y‖ (max norms), else `singular` naming the worst row.
   */
  solveTransposed(y: Float64Array): void {
    const { n, pattern } = this.system;
    const b = y.slice();
    this.#jacobian.solver.solveTranspose(y);
    y[n] = 0;
    const { Ap, Ai } = pattern;
    const J = this.#jacobian.A;
    let bNorm = 0;
    let yNorm = 0;
    let jNorm = 0;
    let worst = 0;
    let worstResidual = 0;
    for (let i = 0; i < n; i++) {
      bNorm = Math.max(bNorm, Math.abs(b[i]!));
      yNorm = Math.max(yNorm, Math.abs(y[i]!));
    }
    // (Jᵀy)_j is column j of J against y.
    for (let j = 0; j < n; j++) {
      let r = b[j]!;
      for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
        jNorm = Math.max(jNorm, Math.abs(J[p]!));
        r -= J[p]! * y[Ai[p]!]!;
      }
      if (Math.abs(r) > worstResidual) {
        worstResidual = Math.abs(r);
        worst = j;
      }
    }
    const scale = bNorm + jNorm * yNorm;
    if (!(worstResidual <= 1e-9 * scale) && !(scale === 0 && worstResidual === 0)) {
      throw singularAt(this.system, worst, 'in the transposed Jacobian of the sensitivities');
    }
  }

  /** y ← J⁻¹·y (y of length n + 1; y[n] is set to 0). */
  solveDirect(y: Float64Array): void {
    this.#jacobian.solver.solve(y);
    y[this.system.n] = 0;
  }

  /**
   * Add every device's DC residual share at the solution, with the devices at `at`, into `target`
   * (scaled by `scale`), then leave them at the operating point's conditions again: one side of the
   * central difference over the temperature.
   */
  addResidualAt(at: Conditions, scale: number, target: Float64Array): void {
    const { system, x, scratch } = this;
    const share = this.#share;
    prepareDevices(system, at);
    for (let k = 0; k < system.devices.length; k++) {
      const e = this.unknownsOf(k);
      dcShare(system.devices[k]!, e, x, scratch, system, share);
      for (const u of e.unknowns) target[u]! += scale * share[u]!;
    }
    prepareDevices(system, this.conditions);
  }

  /** Conditions at temperature T (the junction conductance kept). */
  conditionsAt(temperature: number): Conditions {
    return { ...this.conditions, temperature, thermalVoltage: thermalVoltage(temperature) };
  }

  /**
   * The derivative of element k's DC residual share with respect to its parameter, written into
   * `out` on the element's unknowns (zero elsewhere is the caller's business); or null when a change
   * of the parameter alters the unknowns. `devices` receives the perturbed devices (plus, minus, h).
   */
  parameterStep(k: number, parameter: string): ParameterStep | null {
    const record = this.system.records[k]!;
    const p = parameterValue(record, parameter);
    const h = stepOf(p);
    const variant = parameterVariant(record, parameter);
    const plus = rebind(this.system, k, variant(p + h));
    if (plus === null) return null;
    let minus: Device | null;
    let span = 2 * h;
    try {
      minus = rebind(this.system, k, variant(p - h));
    } catch {
      // p − h lies outside the parameter's range (a capacitance of 0): a forward difference.
      minus = this.system.devices[k]!;
      span = h;
    }
    if (minus === null) return null;
    plus.prepare?.(this.conditions);
    minus.prepare?.(this.conditions);
    return { value: p, plus, minus, span };
  }

  /** ∂F/∂p of element k on its unknowns, from a {@link ParameterStep}, into `out`. */
  dcDerivative(k: number, step: ParameterStep, out: Float64Array, work: Float64Array): void {
    const e = this.unknownsOf(k);
    dcShare(step.plus, e, this.x, this.scratch, this.system, out);
    dcShare(step.minus, e, this.x, this.scratch, this.system, work);
    for (const u of e.unknowns) out[u] = (out[u]! - work[u]!) / step.span;
  }
}

/** A parameter's perturbed devices: the device at p + h and at p − h (or p itself), and the span between them. */
interface ParameterStep {
  readonly value: number;
  readonly plus: Device;
  readonly minus: Device;
  readonly span: number;
}

/** How a DC output is read from a solution, with one device optionally replaced. */
interface DcReader {
  /** The element the output belongs to (its own parameters move it directly), or −1 for a node probe. */
  readonly element: number;
  /** Read at x under `conditions`, with `device` standing in for element `element` when given. */
  read(x: Float64Array, conditions: Conditions, device?: Device): number;
}

function dcReader(system: CompiledSystem, output: SensitivityOutput, conditions: Conditions): DcReader {
  if (typeof output === 'string' || (output !== null && typeof output === 'object' && 'node' in output)) {
    const node = typeof output === 'string' ? output : output.node;
    const reference = typeof output === 'string' ? GROUND : (output.reference ?? GROUND);
    const a = nodeAt(system, node);
    const b = nodeAt(system, reference);
    return { element: -1, read: (x) => x[a]! - x[b]! };
  }
  if (
    output !== null &&
    typeof output === 'object' &&
    'element' in output &&
    typeof output.element === 'string'
  ) {
    const k = system.deviceIndex.get(output.element);
    if (k === undefined) throw unknownElement(output.element, undefined, ['output', 'element']);
    const own = system.devices[k]!;
    if (own.current === undefined) {
      throw unknownElement(output.element, 'it has no single current; read a field of its device report', [
        'output',
        'element',
      ]);
    }
    return { element: k, read: (x, at, device = own) => device.current!(x, at) };
  }
  if (
    output !== null &&
    typeof output === 'object' &&
    'device' in output &&
    typeof output.device === 'string'
  ) {
    const { device: name, field } = output;
    const k = system.deviceIndex.get(name);
    if (k === undefined) throw unknownElement(name, undefined, ['output', 'device']);
    const own = system.devices[k]!;
    if (own.report === undefined) {
      throw unknownElement(name, 'only diodes and transistors have a device report', ['output', 'device']);
    }
    const sample = own.report(new Float64Array(system.n + 1), conditions)[field];
    if (typeof sample !== 'number') {
      throw invalidValue(['output', 'field'], field, `a numeric field of the report of '${name}'`);
    }
    return { element: k, read: (x, at, device = own) => device.report!(x, at)[field] as number };
  }
  throw invalidValue(
    ['output'],
    output,
    'a node name, { node, reference? }, { element } or { device, field }',
  );
}

/** ∂y/∂x of a reader on the unknowns of its element (a node probe's is set by the caller). */
function readerGradient(context: AdjointContext, reader: DcReader, out: Float64Array): void {
  const x = context.x.slice();
  for (const u of context.unknownsOf(reader.element).unknowns) {
    const h = 1e-7 * Math.max(1, Math.abs(x[u]!));
    const keep = x[u]!;
    x[u] = keep + h;
    const up = reader.read(x, context.conditions);
    x[u] = keep - h;
    const down = reader.read(x, context.conditions);
    x[u] = keep;
    out[u] = (up - down) / (2 * h);
  }
}

/** One element parameter, by element position: the only one computed when given. */
interface Only {
  readonly k: number;
  readonly parameter: string;
}

function dcSensitivity(op: OperatingPoint, options: DcSensitivityOptions, only?: Only): Sensitivity {
  const context = new AdjointContext(op);
  const { system, x } = context;
  const n = system.n;
  const reader = dcReader(system, options.output, context.conditions);
  const value = reader.read(x, context.conditions);
  // λ = J⁻ᵀ·∂y/∂x.
  const lambda = new Float64Array(n + 1);
  const output = options.output;
  if (reader.element < 0) {
    const node = typeof output === 'string' ? output : (output as { node: string; reference?: string });
    const a = nodeAt(system, typeof node === 'string' ? node : node.node);
    const b = nodeAt(system, typeof node === 'string' ? GROUND : (node.reference ?? GROUND));
    lambda[a]! += 1;
    lambda[b]! -= 1;
    lambda[n] = 0;
  } else {
    readerGradient(context, reader, lambda);
  }
  context.solveTransposed(lambda);

  const entries: SensitivityEntry[] = [];
  const dF = new Float64Array(n + 1);
  const work = new Float64Array(n + 1);
  for (let k = 0; k < system.records.length; k++) {
    if (only !== undefined && k !== only.k) continue;
    const record = system.records[k]!;
    for (const parameter of only === undefined ? parametersOf(record, false) : [only.parameter]) {
      const step = context.parameterStep(k, parameter);
      let derivative: number;
      if (step === null) {
        derivative = dcSensitivity(atThreshold(op, k, parameter), options, { k, parameter }).entries[0]!
          .derivative;
      } else {
        context.dcDerivative(k, step, dF, work);
        derivative = 0;
        for (const u of context.unknownsOf(k).unknowns) derivative -= lambda[u]! * dF[u]!;
        if (reader.element === k)
          derivative +=
            (reader.read(x, context.conditions, step.plus) - reader.read(x, context.conditions, step.minus)) /
            step.span;
      }
      const value = parameterValue(record, parameter);
      entries.push({ element: record.name, parameter, value, derivative, relative: value * derivative });
    }
  }
  if (only === undefined) entries.push(temperatureEntry(context, reader, lambda));
  return new Sensitivity(value, entries);
}

/** A parameter whose derivative of the solution {@link solutionDerivatives} takes. */
export interface SolutionParameter {
  /** The element's position in the circuit, or null for the temperature. */
  readonly element: number | null;
  readonly parameter: string;
}

/**
 * dx/dp = −J⁻¹·∂F/∂p at the operating point, for each parameter: how every unknown moves per unit
 * change of the parameter, to first order (one forward solve each with the converged Jacobian). A
 * parameter whose change alters the unknowns, or whose derivative is not finite, gets zeros. Used as
 * a predictor (a start closer to a nearby solution than the operating point itself), never as an
 * answer: whatever starts from it is solved and checked.
 */
export function solutionDerivatives(
  op: OperatingPoint,
  parameters: readonly SolutionParameter[],
): Float64Array[] {
  const context = new AdjointContext(op);
  const n = context.system.n;
  const work = new Float64Array(n + 1);
  return parameters.map(({ element, parameter }) => {
    const dF = new Float64Array(n + 1);
    if (element === null) {
      // Central difference of the whole residual over the temperature.
      const T = context.conditions.temperature;
      context.addResidualAt(context.conditionsAt(T + TEMPERATURE_STEP), 1 / (2 * TEMPERATURE_STEP), dF);
      context.addResidualAt(context.conditionsAt(T - TEMPERATURE_STEP), -1 / (2 * TEMPERATURE_STEP), dF);
    } else {
      const step = context.parameterStep(element, parameter);
      if (step === null) return dF;
      context.dcDerivative(element, step, dF, work);
    }
    dF[n] = 0;
    context.solveDirect(dF);
    for (let u = 0; u < n; u++) {
      if (!Number.isFinite(dF[u]!)) return dF.fill(0);
      dF[u] = -dF[u]!;
    }
    return dF;
  });
}

/**
 * Where a parameter's derivative is taken when a change from its value alters the unknowns: only a
 * value of 0 does that (a diode's series resistance stepping away from 0 adds an internal node), and
 * the derivative at 0⁺ is taken at this small value instead, in the parameter's SI unit (1 mΩ for a
 * resistance), where a change keeps the unknowns.
 */
export const THRESHOLD_VALUE = 1e-3;

/** The operating point of a copy of the circuit with element k's parameter at {@link THRESHOLD_VALUE}. */
function atThreshold(op: OperatingPoint, k: number, parameter: string): OperatingPoint {
  const system = op.system;
  const prepared = new PreparedCircuit(system.records, system);
  prepared.setValue(system.records[k]!.name, parameter, THRESHOLD_VALUE);
  const conditions = {
    temperature: op.conditions.temperature,
    junctionConductance: op.conditions.junctionConductance,
  };
  // The voltage across so small a resistance is a tiny difference of two node voltages: solve
  // tightly enough to resolve it (the derivative is that voltage over the resistance), and with the
  // usual tolerances only if the tight solve does not converge.
  try {
    return prepared.operatingPoint({ ...conditions, ...THRESHOLD_TOLERANCES });
  } catch (e) {
    if (!(e instanceof QuiescentError) || e.code !== 'no-convergence') throw e;
    return prepared.operatingPoint(conditions);
  }
}

/** Tolerances of the solve at {@link THRESHOLD_VALUE}. */
const THRESHOLD_TOLERANCES = { relativeTolerance: 1e-12, voltageTolerance: 1e-15, currentTolerance: 1e-18 };

function temperatureEntry(context: AdjointContext, reader: DcReader, lambda: Float64Array): SensitivityEntry {
  const { system, x, conditions } = context;
  const T = conditions.temperature;
  const n = system.n;
  const plus = new Float64Array(n + 1);
  const minus = new Float64Array(n + 1);
  const hot = context.conditionsAt(T + TEMPERATURE_STEP);
  const cold = context.conditionsAt(T - TEMPERATURE_STEP);
  context.addResidualAt(hot, 1, plus);
  context.addResidualAt(cold, 1, minus);
  // The reader brings its device to the conditions it is given; then every device goes back.
  const up = reader.read(x, hot);
  const down = reader.read(x, cold);
  prepareDevices(system, conditions);
  let derivative = (up - down) / (2 * TEMPERATURE_STEP);
  for (let u = 0; u < n; u++) derivative -= (lambda[u]! * (plus[u]! - minus[u]!)) / (2 * TEMPERATURE_STEP);
  return { element: null, parameter: 'temperature', value: T, derivative, relative: T * derivative };
}

function acSensitivity(ac: AcAnalysis, options: AcSensitivityOptions): AcSensitivity {
  if (typeof options.frequency !== 'number') {
    throw invalidValue(['options', 'frequency'], options.frequency, 'one of the analysed frequencies');
  }
  const index = analysedFrequencyIndex(ac.frequencies, options.frequency);
  const frequency = ac.frequencies[index]!;
  const op = ac.operatingPoint;
  const context = new AdjointContext(op);
  const { system, x, conditions } = context;
  const n = system.n;
  const stride = n + 1;
  const Xr = ac.re.subarray(index * stride, (index + 1) * stride);
  const Xi = ac.im.subarray(index * stride, (index + 1) * stride);
  const omega = 2 * Math.PI * frequency;

  // The output Y = cᵀX (+ the current reader's own dependence on p and x).
  const output = options.output;
  let outputElement = -1;
  const cr = new Float64Array(n + 1);
  const ci = new Float64Array(n + 1);
  let readCurrent: ((device: Device, at: BiasPoint, out: Float64Array) => void) | undefined;
  if (output !== null && typeof output === 'object' && 'element' in output) {
    currentReader(system, context.op, output.element, false); // checks the element
    outputElement = system.deviceIndex.get(output.element)!;
    readCurrent = (device, at, out) => device.acCurrent!(Xr, Xi, omega, at, out);
    const unit = new Float64Array(n + 1);
    const zero = new Float64Array(n + 1);
    const out = new Float64Array(2);
    const own = system.devices[outputElement]!;
    for (const u of context.unknownsOf(outputElement).unknowns) {
      unit[u] = 1;
      own.acCurrent!(unit, zero, omega, context.op, out);
      unit[u] = 0;
      cr[u] = out[0]!;
      ci[u] = out[1]!;
    }
  } else if (
    typeof output === 'string' ||
    (output !== null && typeof output === 'object' && 'node' in output)
  ) {
    const node = typeof output === 'string' ? output : output.node;
    const reference = typeof output === 'string' ? GROUND : (output.reference ?? GROUND);
    cr[nodeAt(system, node)]! += 1;
    cr[nodeAt(system, reference)]! -= 1;
    cr[n] = 0;
  } else {
    throw invalidValue(['options', 'output'], output, 'a node name, { node, reference? } or { element }');
  }
  let Yr = 0;
  let Yi = 0;
  for (let u = 0; u < n; u++) {
    Yr += cr[u]! * Xr[u]! - ci[u]! * Xi[u]!;
    Yi += cr[u]! * Xi[u]! + ci[u]! * Xr[u]!;
  }
  if (Yr === 0 && Yi === 0) {
    throw invalidValue(['options', 'output'], output, `an output that carries a signal at ${frequency} Hz`);
  }

  // λ = A⁻ᵀc on the small-signal matrix at this frequency.
  const workspace = new AcWorkspace(op);
  workspace.factorAt(frequency);
  const lr = cr.slice();
  const li = ci.slice();
  workspace.solveTranspose(lr, li);

  // w = ∂Y/∂x − λᵀ·∂R/∂x over the unknowns of the nonlinear devices, then η = J⁻ᵀw.
  const wr = new Float64Array(n + 1);
  const wi = new Float64Array(n + 1);
  const Rr = new Float64Array(n + 1);
  const Ri = new Float64Array(n + 1);
  const Sr = new Float64Array(n + 1);
  const Si = new Float64Array(n + 1);
  const xv = x.slice();
  const perturbed: BiasPoint = { x: xv, conditions };
  const two = new Float64Array(2);
  const twoDown = new Float64Array(2);
  for (let k = 0; k < system.devices.length; k++) {
    const device = system.devices[k]!;
    if (!device.nonlinear) continue;
    const e = context.unknownsOf(k);
    for (const u of e.unknowns) {
      const h = 1e-7 * Math.max(1, Math.abs(x[u]!));
      xv[u] = x[u]! + h;
      acShare(device, e, xv, omega, Xr, Xi, conditions, context.scratch, system, Rr, Ri);
      if (k === outputElement) readCurrent!(device, perturbed, two);
      xv[u] = x[u]! - h;
      acShare(device, e, xv, omega, Xr, Xi, conditions, context.scratch, system, Sr, Si);
      if (k === outputElement) readCurrent!(device, perturbed, twoDown);
      xv[u] = x[u]!;
      let dr = 0;
      let di = 0;
      for (const v of e.unknowns) {
        const gr = (Rr[v]! - Sr[v]!) / (2 * h);
        const gi = (Ri[v]! - Si[v]!) / (2 * h);
        dr += lr[v]! * gr - li[v]! * gi;
        di += lr[v]! * gi + li[v]! * gr;
      }
      wr[u]! -= dr;
      wi[u]! -= di;
      if (k === outputElement) {
        wr[u]! += (two[0]! - twoDown[0]!) / (2 * h);
        wi[u]! += (two[1]! - twoDown[1]!) / (2 * h);
      }
    }
    // Leave the device evaluated at the operating point again.
    acShare(device, e, x, omega, Xr, Xi, conditions, context.scratch, system, Rr, Ri);
  }
  const etaR = wr;
  const etaI = wi;
  context.solveTransposed(etaR);
  context.solveTransposed(etaI);

  const entries: AcSensitivityEntry[] = [];
  const dF = new Float64Array(n + 1);
  const work = new Float64Array(n + 1);
  const Y = new Complex(Yr, Yi);
  const toEntry = (
    element: string | null,
    parameter: string,
    value: number,
    dYr: number,
    dYi: number,
  ): AcSensitivityEntry => {
    // p·(dY/dp)/Y: its real part is ∂ln|Y|/∂ln p, its imaginary part ∂arg Y/∂ln p.
    const ratio = new Complex(value * dYr, value * dYi).div(Y);
    return {
      element,
      parameter,
      value,
      magnitudeDb: (20 / Math.LN10) * ratio.re,
      phaseDegrees: (180 / Math.PI) * ratio.im,
    };
  };
  for (let k = 0; k < system.records.length; k++) {
    const record = system.records[k]!;
    const e = context.unknownsOf(k);
    for (const parameter of parametersOf(record, true)) {
      const step = context.parameterStep(k, parameter);
      if (step === null) {
        // Only a value of 0 alters the unknowns when it changes (see THRESHOLD_VALUE): a unit
        // relative change of 0 is no change, so both figures are 0.
        entries.push(toEntry(record.name, parameter, 0, 0, 0));
        continue;
      }
      // −λᵀ·∂R/∂p.
      acShare(step.plus, e, x, omega, Xr, Xi, conditions, context.scratch, system, Rr, Ri);
      acShare(step.minus, e, x, omega, Xr, Xi, conditions, context.scratch, system, Sr, Si);
      let dYr = 0;
      let dYi = 0;
      for (const u of e.unknowns) {
        const gr = (Rr[u]! - Sr[u]!) / step.span;
        const gi = (Ri[u]! - Si[u]!) / step.span;
        dYr -= lr[u]! * gr - li[u]! * gi;
        dYi -= lr[u]! * gi + li[u]! * gr;
      }
      // −ηᵀ·∂F/∂p: the bias shift.
      context.dcDerivative(k, step, dF, work);
      for (const u of e.unknowns) {
        dYr -= etaR[u]! * dF[u]!;
        dYi -= etaI[u]! * dF[u]!;
      }
      if (k === outputElement) {
        readCurrent!(step.plus, context.op, two);
        readCurrent!(step.minus, context.op, twoDown);
        dYr += (two[0]! - twoDown[0]!) / step.span;
        dYi += (two[1]! - twoDown[1]!) / step.span;
      }
      entries.push(toEntry(record.name, parameter, step.value, dYr, dYi));
    }
  }

  // The temperature: every device at T ± h.
  const T = context.conditions.temperature;
  let dYr = 0;
  let dYi = 0;
  for (const sign of [1, -1]) {
    const at = context.conditionsAt(T + sign * TEMPERATURE_STEP);
    prepareDevices(system, at);
    for (let k = 0; k < system.devices.length; k++) {
      const device = system.devices[k]!;
      const e = context.unknownsOf(k);
      acShare(device, e, x, omega, Xr, Xi, at, context.scratch, system, Rr, Ri);
      dcShare(device, e, x, context.scratch, system, dF);
      for (const u of e.unknowns) {
        const gr = (sign * Rr[u]!) / (2 * TEMPERATURE_STEP);
        const gi = (sign * Ri[u]!) / (2 * TEMPERATURE_STEP);
        const f = (sign * dF[u]!) / (2 * TEMPERATURE_STEP);
        dYr -= lr[u]! * gr - li[u]! * gi + etaR[u]! * f;
        dYi -= lr[u]! * gi + li[u]! * gr + etaI[u]! * f;
      }
      if (k === outputElement) {
        readCurrent!(device, { x, conditions: at }, two);
        dYr += (sign * two[0]!) / (2 * TEMPERATURE_STEP);
        dYi += (sign * two[1]!) / (2 * TEMPERATURE_STEP);
      }
    }
  }
  prepareDevices(system, context.conditions);
  entries.push(toEntry(null, 'temperature', T, dYr, dYi));
  return new AcSensitivity(frequency, Y, entries);
}
