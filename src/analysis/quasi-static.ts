/**
 * The large-signal cross-check of the distortion estimate: the full nonlinear DC circuit solved at N
 * evenly spaced phases θ_k = 2πk/N of one period, every independent source set to
 *   dc + s·Re(A·e^{j(θ_k + φ)}) = dc + s·A·cos(θ_k + φ)
 * with A, φ its AC magnitude and phase and s a scale. The output's harmonics follow by a discrete
 * Fourier transform. By default (`reactive: 'hold'`) every capacitor holds its operating-point voltage
 * and every inductor its current (held-reactive.ts), as coupling, bypass and choke elements do in
 * mid-band; `reactive: 'open'` solves the DC circuit instead (capacitors open, inductors shorted), the
 * quasi-static limit at 0 Hz. One compiled system serves every phase, and each phase starts Newton
 * from the solution of the phase before, so the cost grows linearly with the number of phases.
 *
 * The DFT of N samples gives the h-th harmonic's phasor Y_h = (2/N)·Σ_k y_k·e^{−jhθ_k}, so that
 * y(t) ≈ Y₀/2 + Σ_h Re(Y_h·e^{jhθ}); harmonics above N/2 alias, so N ≥ 8 is asked for, and many more
 * (64 by default) keep the aliasing of a smooth periodic output far below the 3rd harmonic. Only the
 * first {@link HARMONICS_KEPT} harmonics are transformed, which keeps the transform linear in N.
 */
import { Complex } from 'complex.js';
import type { Circuit } from '../circuit/circuit.js';
import { GROUND } from '../circuit/elements.js';
import type { Conditions } from '../devices/device.js';
import { invalidValue, noSignal, unknownElement } from '../errors/messages.js';
import type { AcAnalysis, Probe } from './ac-analysis.js';
import { acAnalysis } from './ac-analysis.js';
import { requireCircuit } from './arguments.js';
import { checkDriveScale, type DistortionPoint, distortion } from './distortion.js';
import { describeProbe } from './distortion-probe.js';
import { holdReactive } from './held-reactive.js';
import { conditionsAt, nodeAt, type Solver, solveFromCurrent, startFromGuess } from './operating-point.js';
import { type OperatingPointOptions, resolveOptions } from './options.js';
import { operatingPoint, solverFor } from './prepared.js';
import { settleHeld } from './settle-reactive.js';

/** Default number of phases per period. */
export const DEFAULT_PHASES = 64;

/** How many harmonics the transform keeps (fewer when the phases cannot resolve them). */
export const HARMONICS_KEPT = 16;

/**
 * Newton tolerances of the check unless given: tight enough that rounding, not the iteration, limits
 * a 3rd harmonic some 1e-6 below the fundamental, and loose enough (1 pV, 0.1 pA absolute) that a node
 * or branch crossing zero, whose value rounding blurs by some 1e-14 of the supply, still converges.
 */
const CHECK_TOLERANCES = {
  relativeTolerance: 1e-12,
  voltageTolerance: 1e-12,
  currentTolerance: 1e-13,
} as const;

/** Relative size below which a fundamental is taken for the solver's rounding, not a signal. */
const NO_SIGNAL_LEVEL = 1e-9;

/** What the check does with capacitors and inductors. */
export type ReactiveTreatment = 'hold' | 'settle' | 'open';

/** Options of {@link quasiStaticHarmonics}. */
export interface QuasiStaticOptions extends OperatingPointOptions {
  /** Where the harmonics are read: a node, a node pair or an element current. */
  readonly output: Probe;
  /** Phases per period, an integer ≥ 8 (default 64). */
  readonly phases?: number;
  /** Scale every AC source by this finite factor > 0 (default 1). */
  readonly scale?: number;
  /**
   * `'hold'` (default): capacitors hold their operating-point voltage and inductors their current, as
   * in mid-band; `'settle'`: held too, at the voltage (current) where their mean current (voltage)
   * over the period is zero, the periodic steady state (settle-reactive.ts); `'open'`: the DC circuit,
   * capacitors open and inductors shorted.
   */
  readonly reactive?: ReactiveTreatment;
}

/** The harmonics of an output over one period of a quasi-static drive. */
export interface QuasiStaticHarmonics {
  /** The output probe. */
  readonly output: Probe;
  /** The output's description, such as `out`, `out − ref` or `current in Rload`. */
  readonly outputName: string;
  /** Phases per period. */
  readonly phases: number;
  /** The factor applied to every AC source's amplitude. */
  readonly scale: number;
  /** How capacitors and inductors were treated. */
  readonly reactive: ReactiveTreatment;
  /** The capacitors and inductors held at their operating-point voltage or current (`'hold'` only). */
  readonly held: readonly string[];
  /** Those left open (capacitors) or shorted (inductors) by the exceptions of `'hold'`, or all with `'open'`. */
  readonly kept: readonly string[];
  /** The output at each phase θ_k = 2πk/N (V or A). */
  readonly samples: Float64Array;
  /** The output at the operating point (no drive). */
  readonly quiescent: number;
  /** The peak amplitude of the output's fundamental (V or A), as the linearity report's `output.fundamental`. */
  readonly fundamental: number;
  /** |2nd harmonic| / fundamental. */
  readonly secondHarmonic: number;
  /** |3rd harmonic| / fundamental. */
  readonly thirdHarmonic: number;
  /** |mean of the waveform − the quiescent output| / fundamental. */
  readonly meanShift: number;
  /** The mean of the output over the period minus its quiescent value, signed (V or A). */
  readonly meanOffset: number;
  /**
   * The small-signal fundamental of the same (held or open) circuit at the same scale: the phasor the
   * linear answer gives, against which `compression` is measured.
   */
  readonly linearFundamental: Complex;
  /** Re(Y1/linear) − 1: the relative change of the fundamental against the linear answer. */
  readonly compression: number;
  /**
   * meanShift + secondHarmonic + |Y1/linear − 1| + thirdHarmonic: the measured counterpart of the
   * linearity report's output error bound.
   */
  readonly errorBound: number;
  /** Harmonic phasors 1 … min(16, ⌊(N−1)/2⌋) at index h − 1 (peak, phase of cos). */
  readonly harmonics: readonly Complex[];
  /** The 1st harmonic (peak phasor). */
  readonly fundamentalPhasor: Complex;
  /** The 2nd harmonic (peak phasor). */
  readonly second: Complex;
  /** The 3rd harmonic (peak phasor). */
  readonly third: Complex;
  /** Same as `secondHarmonic`. */
  readonly secondRatio: number;
  /** Same as `thirdHarmonic`. */
  readonly thirdRatio: number;
}

/** An independent source with an AC excitation: what the check drives. */
interface Drive {
  readonly name: string;
  readonly dc: number;
  readonly amplitude: number;
  readonly phase: number;
}

/**
 * The circuit prepared for many large-signal solves: one compiled system (held or open), its drives,
 * the output reader, the quiescent output and the linear fundamental. Shared by the one-tone and the
 * two-tone checks.
 */
export interface QuasiStaticDriver {
  readonly solver: Solver;
  readonly drives: readonly Drive[];
  readonly outputName: string;
  readonly reactive: ReactiveTreatment;
  readonly held: readonly string[];
  readonly kept: readonly string[];
  readonly quiescent: number;
  /** The small-signal output phasor (unscaled), at 0 Hz of the held or open circuit. */
  readonly linear: Complex;
  /** The absolute tolerance of the output's quantity (V or A). */
  readonly tolerance: number;
  /** The held capacitors and inductors: what they hold at the operating point, and how to read them. */
  readonly heldElements: readonly HeldElement[];
  /** Σ over the solves since the last reset of each held element's current (capacitor) or voltage (inductor). */
  readonly heldSums: Float64Array;
  /** Solve with each drive at dc + value[d] (a warm start from the last solve) and read the output. */
  solve(offsets: Float64Array): number;
  /** Hold each held element at its operating-point value + offsets[h] from the next solve on. */
  setHeld(offsets: Float64Array): void;
}

/** A capacitor or inductor held by a source of its own name. */
export interface HeldElement {
  /** The element (and source) name. */
  readonly name: string;
  /** The voltage (capacitor) or current (inductor) held at the operating point. */
  readonly dc: number;
  /** Whether it is a capacitor (held voltage, its current read) or an inductor (held current, its voltage read). */
  readonly capacitor: boolean;
  /** The quantity that must average to zero: the capacitor's current, or the inductor's voltage. */
  read(x: Float64Array): number;
}

/** Check the common options and prepare the compiled system. */
export function prepareDriver(circuit: Circuit, options: QuasiStaticOptions): QuasiStaticDriver {
  const { output, phases: _phases, scale: _scale, reactive = 'hold', ...rest } = options;
  if (reactive !== 'hold' && reactive !== 'settle' && reactive !== 'open') {
    throw invalidValue(['reactive'], reactive, "'hold', 'settle' or 'open'");
  }
  const given = Object.fromEntries(Object.entries(rest).filter(([, v]) => v !== undefined));
  const resolved = resolveOptions({ ...CHECK_TOLERANCES, ...given });
  const base = conditionsAt(resolved.temperature, resolved);
  let records = circuit.elements;
  let held: readonly string[] = [];
  let kept: readonly string[] = records
    .filter((r) => r.kind === 'capacitor' || r.kind === 'inductor')
    .map((r) => r.name);
  if (reactive !== 'open') {
    const open = solverFor(records, resolved);
    startFromGuess(open);
    const heldCircuit = holdReactive(records, solveFromCurrent(open, base));
    records = heldCircuit.records;
    held = heldCircuit.held;
    kept = heldCircuit.kept;
  }
  const solver = solverFor(records, resolved);
  const read = outputReader(solver, output, base);
  const drives = solver.system.records.flatMap((r) =>
    (r.kind === 'voltage-source' || r.kind === 'current-source') && r.ac.magnitude !== 0
      ? [{ name: r.name, dc: r.dc, amplitude: r.ac.magnitude, phase: (r.ac.phase * Math.PI) / 180 }]
      : [],
  );
  const sourceValues = new Map<string, number>();
  const conditions = { ...base, sourceValues };
  startFromGuess(solver);
  const op = solveFromCurrent(solver, base);
  const quiescent = read(op.x);
  const linear = acAnalysis(op, { frequencies: [0] }).response(output)[0]!;
  const voltage = typeof output === 'string' || 'node' in output;
  const heldElements = held.map((name): HeldElement => {
    const record = solver.system.deviceByName.get(name)!.record;
    if (record.kind === 'voltage-source') {
      const device = solver.system.deviceByName.get(name)!;
      return { name, dc: record.dc, capacitor: true, read: (x) => device.current!(x, base) };
    }
    const from = record.kind === 'current-source' ? nodeAt(solver.system, record.from) : 0;
    const to = record.kind === 'current-source' ? nodeAt(solver.system, record.to) : 0;
    const dc = record.kind === 'current-source' ? record.dc : 0;
    return { name, dc, capacitor: false, read: (x) => x[from]! - x[to]! };
  });
  const heldSums = new Float64Array(heldElements.length);
  return {
    solver,
    drives,
    outputName: describeProbe(output),
    reactive,
    held,
    kept,
    quiescent,
    linear,
    tolerance: voltage ? resolved.voltageTolerance : resolved.currentTolerance,
    heldElements,
    heldSums,
    solve(offsets) {
      for (let d = 0; d < drives.length; d++) sourceValues.set(drives[d]!.name, drives[d]!.dc + offsets[d]!);
      const x = solveFromCurrent(solver, conditions).x;
      for (let h = 0; h < heldElements.length; h++) heldSums[h]! += heldElements[h]!.read(x);
      return read(x);
    },
    setHeld(offsets) {
      for (let h = 0; h < heldElements.length; h++) {
        sourceValues.set(heldElements[h]!.name, heldElements[h]!.dc + offsets[h]!);
      }
    },
  };
}

/** Check a number of phases: a whole number ≥ `least`. */
export function checkPhases(phases: unknown, least: number): number {
  if (typeof phases !== 'number' || !Number.isInteger(phases) || phases < least) {
    throw invalidValue(['phases'], phases, `a whole number of phases ≥ ${least}`);
  }
  return phases;
}

/**
 * Drive the full nonlinear circuit through one period of its AC sources, quasi-statically, and take
 * the harmonics of an output by a DFT.
 *
 * @param circuit - the circuit; its sources' AC values set the drive
 * @param options - `output` probe, `phases` (default 64), `scale` (default 1), `reactive` (default
 *   `'hold'`), and operating-point options (tolerances default tighter than the operating point's)
 * @returns the samples and harmonics of the output
 * @throws QuiescentError `invalid-value`, `unknown-node`, `unknown-element`, the operating-point errors
 *   (`no-convergence` naming the phase's devices); `no-signal` when the output's fundamental is below
 *   the solver's rounding
 *
 * @example
 * ```ts
 * const check = quasiStaticHarmonics(circuit, { output: 'out', phases: 64 });
 * check.secondHarmonic; // 2nd harmonic over the fundamental, large-signal
 * ```
 */
export function quasiStaticHarmonics(circuit: Circuit, options: QuasiStaticOptions): QuasiStaticHarmonics {
  requireCircuit(circuit);
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the output to analyse');
  }
  const phases = checkPhases(options.phases ?? DEFAULT_PHASES, 8);
  const scale = checkDriveScale(options.scale ?? 1);
  const driver = prepareDriver(circuit, options);
  const { drives } = driver;
  const offsets = new Float64Array(drives.length);
  const samples = new Float64Array(phases);
  const period = (): void => {
    for (let k = 0; k < phases; k++) {
      const theta = (2 * Math.PI * k) / phases;
      for (let d = 0; d < drives.length; d++) {
        offsets[d] = scale * drives[d]!.amplitude * Math.cos(theta + drives[d]!.phase);
      }
      samples[k] = driver.solve(offsets);
    }
  };
  if (driver.reactive === 'settle') settleHeld(driver, period, phases);
  period();
  let mean = 0;
  let largest = Math.abs(driver.quiescent);
  for (const y of samples) {
    mean += y;
    largest = Math.max(largest, Math.abs(y));
  }
  mean /= phases;
  const harmonics: Complex[] = [];
  for (let h = 1; 2 * h < phases && h <= HARMONICS_KEPT; h++) {
    let re = 0;
    let im = 0;
    for (let k = 0; k < phases; k++) {
      const angle = (2 * Math.PI * ((h * k) % phases)) / phases;
      re += samples[k]! * Math.cos(angle);
      im -= samples[k]! * Math.sin(angle);
    }
    harmonics.push(new Complex((2 * re) / phases, (2 * im) / phases));
  }
  const [fundamentalPhasor, second, third] = harmonics as [Complex, Complex, Complex];
  const size = fundamentalPhasor.abs();
  if (!(size > NO_SIGNAL_LEVEL * largest + driver.tolerance)) {
    throw noSignal(driver.outputName, [], "its fundamental is within the solver's rounding of zero");
  }
  const linearFundamental = driver.linear.mul(scale);
  const relative = linearFundamental.isZero() ? Complex.INFINITY : fundamentalPhasor.div(linearFundamental);
  const secondHarmonic = second.abs() / size;
  const thirdHarmonic = third.abs() / size;
  const meanShift = Math.abs(mean - driver.quiescent) / size;
  const change = relative.sub(1).abs();
  return {
    output: options.output,
    outputName: driver.outputName,
    phases,
    scale,
    reactive: driver.reactive,
    held: driver.held,
    kept: driver.kept,
    samples,
    quiescent: driver.quiescent,
    fundamental: size,
    secondHarmonic,
    thirdHarmonic,
    meanShift,
    meanOffset: mean - driver.quiescent,
    linearFundamental,
    compression: relative.re - 1,
    errorBound: meanShift + secondHarmonic + change + thirdHarmonic,
    harmonics,
    fundamentalPhasor,
    second,
    third,
    secondRatio: secondHarmonic,
    thirdRatio: thirdHarmonic,
  };
}

/** Reads a probe from a solution vector, checked once against the compiled circuit. */
function outputReader(solver: Solver, probe: Probe, conditions: Conditions): (x: Float64Array) => number {
  const system = solver.system;
  if (typeof probe === 'string') {
    const a = nodeAt(system, probe);
    return (x) => x[a]!;
  }
  if (probe !== null && typeof probe === 'object') {
    if ('element' in probe && typeof probe.element === 'string') {
      const device = system.deviceByName.get(probe.element);
      if (device === undefined) throw unknownElement(probe.element);
      const current = device.current;
      if (current === undefined) {
        throw unknownElement(probe.element, 'a transistor has no single current; read it through voltages');
      }
      return (x) => current.call(device, x, conditions);
    }
    if ('node' in probe && typeof probe.node === 'string') {
      const a = nodeAt(system, probe.node);
      const b = nodeAt(system, probe.reference ?? GROUND);
      return (x) => x[a]! - x[b]!;
    }
  }
  throw invalidValue(['output'], probe, 'a node name, { node, reference? } or { element }');
}

/** Options of {@link checkDistortion}. */
export interface DistortionCheckOptions extends QuasiStaticOptions {
  /**
   * The drive frequency of the estimate, in Hz (default 0: the quasi-static limit itself). With
   * `reactive: 'hold'` choose a mid-band frequency, where the coupling capacitors pass the signal.
   */
  readonly frequency?: number;
}

/** The distortion estimate beside its quasi-static check. */
export interface DistortionCheck {
  /** The method-of-nonlinear-currents estimate at the drive frequency. */
  readonly estimate: DistortionPoint;
  /** The large-signal harmonics, quasi-static. */
  readonly check: QuasiStaticHarmonics;
  /** (estimate − check)/check of the 2nd-harmonic ratio. */
  readonly secondDeviation: number;
  /** (estimate − check)/check of the 3rd-harmonic ratio. */
  readonly thirdDeviation: number;
  /** The AC analysis the estimate rests on. */
  readonly ac: AcAnalysis;
}

/**
 * Run the distortion estimate and the quasi-static check of the same output at the same drive, side
 * by side: where they part, the drive is too large for the estimate's leading terms (or reactive
 * elements matter at the frequency asked for).
 *
 * @param circuit - the circuit; its sources' AC values set the drive
 * @param options - as {@link quasiStaticHarmonics}, plus the estimate's `frequency` (default 0 Hz)
 * @returns the estimate, the check and the relative deviation of the ratios
 * @throws QuiescentError as {@link quasiStaticHarmonics} and {@link distortion}
 */
export function checkDistortion(circuit: Circuit, options: DistortionCheckOptions): DistortionCheck {
  requireCircuit(circuit);
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the output to analyse');
  }
  const { frequency = 0, output, phases, scale = 1, reactive, ...operating } = options;
  const op = operatingPoint(circuit, operating);
  const ac = acAnalysis(op, { frequencies: [frequency] });
  const estimate = distortion(ac, { output, scale }).points[0]!;
  const check = quasiStaticHarmonics(circuit, {
    ...operating,
    output,
    scale,
    ...(phases === undefined ? {} : { phases }),
    ...(reactive === undefined ? {} : { reactive }),
  });
  const deviation = (a: number, b: number): number =>
    b === 0 ? (a === 0 ? 0 : Number.POSITIVE_INFINITY) : (a - b) / b;
  return {
    estimate,
    check,
    secondDeviation: deviation(estimate.secondRatio, check.secondRatio),
    thirdDeviation: deviation(estimate.thirdRatio, check.thirdRatio),
    ac,
  };
}
