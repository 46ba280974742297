/**
 * The large-signal cross-check of the distortion estimate: the full nonlinear DC circuit solved at N
 * evenly spaced phases θ_k = 2πk/N of one period, every independent source set to
 *   dc + s·Re(A·e^{j(θ_k + φ)}) = dc + s·A·cos(θ_k + φ)
 * with A, φ its AC magnitude and phase and s a scale. The output's harmonics follow by a discrete
 * Fourier transform. It holds where the circuit is quasi-static at the drive frequency: capacitors
 * charge and inductors fluxes change too little to matter (at low frequency, or with no reactive
 * elements). Each phase starts Newton from the solution of the phase before.
 *
 * The DFT of N samples gives the h-th harmonic's phasor Y_h = (2/N)·Σ_k y_k·e^{−jhθ_k}, so that
 * y(t) ≈ Y₀/2 + Σ_h Re(Y_h·e^{jhθ}); harmonics above N/2 alias, so N ≥ 8 is asked for, and many more
 * (64 by default) keep the aliasing of a smooth periodic output far below the 3rd harmonic.
 */
import Complex from 'complex.js';
import type { Circuit } from '../circuit/circuit.js';
import { GROUND } from '../circuit/elements.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import type { AcAnalysis, Probe } from './ac-analysis.js';
import { acAnalysis } from './ac-analysis.js';
import { requireCircuit } from './arguments.js';
import { checkDriveScale, type DistortionPoint, distortion } from './distortion.js';
import { describeProbe } from './distortion-probe.js';
import {
  conditionsAt,
  nodeAt,
  type OperatingPoint,
  operatingPoint,
  prepareSolver,
  type Solver,
  solveFromCurrent,
  startFromGuess,
} from './operating-point.js';
import type { OperatingPointOptions } from './options.js';

/** Default number of phases per period. */
export const DEFAULT_PHASES = 64;

/**
 * Newton tolerances of the check unless given: tight enough that rounding, not the iteration, limits
 * a 3rd harmonic some 1e-6 below the fundamental.
 */
const CHECK_TOLERANCES = {
  relativeTolerance: 1e-12,
  voltageTolerance: 1e-14,
  currentTolerance: 1e-17,
} as const;

/** Options of {@link quasiStaticHarmonics}. */
export interface QuasiStaticOptions extends OperatingPointOptions {
  /** Where the harmonics are read: a node, a node pair or an element current. */
  readonly output: Probe;
  /** Phases per period, an integer ≥ 8 (default 64). */
  readonly phases?: number;
  /** Scale every AC source by this finite factor > 0 (default 1). */
  readonly scale?: number;
}

/** The harmonics of an output over one period of a quasi-static drive. */
export interface QuasiStaticHarmonics {
  /** The output probe, and its description. */
  readonly output: Probe;
  /** The output's description, such as `v(out)`. */
  readonly outputName: string;
  /** Phases per period and the drive scale. */
  readonly phases: number;
  /** The factor applied to every AC source's amplitude. */
  readonly scale: number;
  /** The output at each phase θ_k = 2πk/N (V or A). */
  readonly samples: Float64Array;
  /** The output at the operating point (no drive). */
  readonly quiescent: number;
  /** The mean of the output over the period, minus its quiescent value (rectification). */
  readonly meanShift: number;
  /** Harmonic phasors 1 … ⌊(N−1)/2⌋ at index h − 1 (peak, phase of cos). */
  readonly harmonics: readonly Complex[];
  /** The 1st, 2nd and 3rd harmonics. */
  readonly fundamental: Complex;
  /** The 2nd harmonic (peak phasor). */
  readonly second: Complex;
  /** The 3rd harmonic (peak phasor). */
  readonly third: Complex;
  /** |second| / |fundamental| and |third| / |fundamental|. */
  readonly secondRatio: number;
  /** |third| / |fundamental|. */
  readonly thirdRatio: number;
}

/**
 * Drive the full nonlinear circuit through one period of its AC sources, quasi-statically, and take
 * the harmonics of an output by a DFT.
 *
 * @param circuit - the circuit; its sources' AC values set the drive
 * @param options - `output` probe, `phases` (default 64), `scale` (default 1), and operating-point
 *   options (tolerances default tighter than the operating point's, see the docs)
 * @returns the samples and harmonics of the output
 * @throws QuiescentError `invalid-value`, `unknown-node`, `unknown-element`, the operating-point errors
 *   (`no-convergence` naming the phase's devices)
 *
 * @example
 * ```ts
 * const check = quasiStaticHarmonics(circuit, { output: 'out', phases: 64 });
 * check.secondRatio; // 2nd harmonic over the fundamental, large-signal
 * ```
 */
export function quasiStaticHarmonics(circuit: Circuit, options: QuasiStaticOptions): QuasiStaticHarmonics {
  requireCircuit(circuit);
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the output to analyse');
  }
  const { output, phases = DEFAULT_PHASES, scale = 1, ...rest } = options;
  if (typeof phases !== 'number' || !Number.isInteger(phases) || phases < 8) {
    throw invalidValue(['phases'], phases, 'a whole number of phases ≥ 8');
  }
  checkDriveScale(scale);
  const given = Object.fromEntries(Object.entries(rest).filter(([, v]) => v !== undefined));
  const solver = prepareSolver(circuit, { ...CHECK_TOLERANCES, ...given });
  const read = outputReader(solver, output);
  const drives = solver.system.records.flatMap((r) =>
    (r.kind === 'voltage-source' || r.kind === 'current-source') && r.ac.magnitude !== 0
      ? [{ name: r.name, dc: r.dc, amplitude: scale * r.ac.magnitude, phase: (r.ac.phase * Math.PI) / 180 }]
      : [],
  );
  const base = conditionsAt(solver.options.temperature, solver.options);
  startFromGuess(solver);
  const quiescent = read(solveFromCurrent(solver, base));
  const samples = new Float64Array(phases);
  for (let k = 0; k < phases; k++) {
    const theta = (2 * Math.PI * k) / phases;
    const sourceValues = new Map(drives.map((d) => [d.name, d.dc + d.amplitude * Math.cos(theta + d.phase)]));
    samples[k] = read(solveFromCurrent(solver, { ...base, sourceValues }));
  }
  const harmonics: Complex[] = [];
  let mean = 0;
  for (const y of samples) mean += y;
  mean /= phases;
  for (let h = 1; 2 * h < phases; h++) {
    let re = 0;
    let im = 0;
    for (let k = 0; k < phases; k++) {
      const angle = (2 * Math.PI * ((h * k) % phases)) / phases;
      re += samples[k]! * Math.cos(angle);
      im -= samples[k]! * Math.sin(angle);
    }
    harmonics.push(new Complex((2 * re) / phases, (2 * im) / phases));
  }
  const [fundamental, second, third] = harmonics as [Complex, Complex, Complex];
  const size = fundamental.abs();
  return {
    output,
    outputName: describeProbe(output),
    phases,
    scale,
    samples,
    quiescent,
    meanShift: mean - quiescent,
    harmonics,
    fundamental,
    second,
    third,
    secondRatio: size === 0 ? 0 : second.abs() / size,
    thirdRatio: size === 0 ? 0 : third.abs() / size,
  };
}

/** Reads a probe from an operating point, checked once against the compiled circuit. */
function outputReader(solver: Solver, probe: Probe): (op: OperatingPoint) => number {
  const system = solver.system;
  if (typeof probe === 'string') {
    nodeAt(system, probe);
    return (op) => op.voltage(probe);
  }
  if (probe !== null && typeof probe === 'object') {
    if ('element' in probe && typeof probe.element === 'string') {
      const device = system.deviceByName.get(probe.element);
      if (device === undefined) throw unknownElement(probe.element);
      if (device.current === undefined) {
        throw unknownElement(probe.element, 'a transistor has no single current; read it through voltages');
      }
      const element = probe.element;
      return (op) => op.current(element);
    }
    if ('node' in probe && typeof probe.node === 'string') {
      const node = probe.node;
      const reference = probe.reference ?? GROUND;
      nodeAt(system, node);
      nodeAt(system, reference);
      return (op) => op.voltage(node, reference);
    }
  }
  throw invalidValue(['output'], probe, 'a node name, { node, reference? } or { element }');
}

/** Options of {@link checkDistortion}. */
export interface DistortionCheckOptions extends QuasiStaticOptions {
  /** The drive frequency of the estimate, in Hz (default 0: the quasi-static limit itself). */
  readonly frequency?: number;
}

/** The distortion estimate beside its quasi-static check. */
export interface DistortionCheck {
  /** The method-of-nonlinear-currents estimate at the drive frequency. */
  readonly estimate: DistortionPoint;
  /** The large-signal harmonics, quasi-static. */
  readonly check: QuasiStaticHarmonics;
  /** (estimate − check)/check of the 2nd- and 3rd-harmonic ratios. */
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
  const { frequency = 0, output, phases, scale = 1, ...operating } = options;
  const op = operatingPoint(circuit, operating);
  const ac = acAnalysis(op, { frequencies: [frequency] });
  const estimate = distortion(ac, { output, scale }).points[0]!;
  const check = quasiStaticHarmonics(circuit, {
    ...operating,
    output,
    scale,
    ...(phases === undefined ? {} : { phases }),
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
