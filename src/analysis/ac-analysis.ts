/**
 * Small-signal AC analysis: every nonlinear part replaced by its linear model at the operating point,
 * capacitors as jωC and inductors as jωL, solved at each frequency with the AC excitations of the
 * independent sources. One symbolic analysis serves the whole sweep; each frequency costs one complex
 * numeric refactorization and one solve, whose residual is checked.
 */
import { Complex } from 'complex.js';
import { GROUND } from '../circuit/elements.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import { AcWorkspace } from './ac-workspace.js';
import { requireInstance } from './arguments.js';
import { currentReader, type ProbeReader, probeReader, voltageReader } from './distortion-probe.js';
import { checkFrequencies } from './frequency-grid.js';
import { checkAscending, crossings, decibels, unwrappedPhase } from './frequency-response.js';
import { nodeAt, OperatingPoint } from './operating-point.js';
import {
  type PassBand,
  type PassBandOptions,
  passBand,
  type ResponsePeak,
  responsePeak,
} from './resonance.js';
import { type AcAnalysisJson, acAnalysisToJson } from './result-json.js';

/** Options of {@link acAnalysis}. */
export interface AcAnalysisOptions {
  /** The frequencies to solve at, in Hz (0 allowed: the small-signal DC solution), in any order. */
  readonly frequencies: readonly number[] | Float64Array;
}

/**
 * Where a response is read: a node name (its voltage to ground), a node voltage against a reference
 * node, or the current of an element (by the sign conventions of `OperatingPoint.current`).
 */
export type Probe =
  | string
  | {
      /** The node whose voltage is read. */
      readonly node: string;
      /** The node it is measured against (default ground). */
      readonly reference?: string;
    }
  | {
      /** The element whose current is read. */
      readonly element: string;
    };

/** A Bode table: magnitude, magnitude in dB and unwrapped phase at each frequency of the sweep. */
export interface BodeTable {
  /** In Hz, in the order of the analysis. */
  readonly frequencies: Float64Array;
  /** |H|, dimensionless for a ratio of like quantities. */
  readonly magnitude: Float64Array;
  /** 20·log10|H|. */
  readonly magnitudeDb: Float64Array;
  /** arg H in degrees, unwrapped along the sweep. */
  readonly phaseDegrees: Float64Array;
}

/** Options of {@link AcAnalysis.cutoffFrequencies}. */
export interface CutoffOptions {
  /** How far below the reference level the cutoff lies, in dB. Default 3 (more exactly, 10·log10 2 is used when omitted). */
  readonly dropDb?: number;
  /** The reference level in dB; default the largest level of the sweep (the passband of a low-, high- or band-pass). */
  readonly referenceDb?: number;
}

/** The small-signal response of a circuit at a list of frequencies. Immutable. */
export class AcAnalysis {
  /** The operating point the circuit was linearized at. */
  readonly operatingPoint: OperatingPoint;
  /** The analysed frequencies in Hz, in the order given. */
  readonly frequencies: Float64Array;
  /** @internal Solution real parts: frequency k occupies [k·(n+1), (k+1)·(n+1)). */
  readonly re: Float64Array;
  /** @internal Solution imaginary parts, laid out as {@link AcAnalysis.re}. */
  readonly im: Float64Array;

  /** @internal Built by {@link acAnalysis}. */
  constructor(op: OperatingPoint, frequencies: Float64Array, re: Float64Array, im: Float64Array) {
    this.operatingPoint = op;
    this.frequencies = frequencies;
    this.re = re;
    this.im = im;
  }

  /** The peak voltage phasor of `node` against `reference` (ground by default) at every frequency, in V. */
  voltage(node: string, reference: string = GROUND): Complex[] {
    const system = this.operatingPoint.system;
    return this.#phasors(voltageReader(nodeAt(system, node), nodeAt(system, reference)));
  }

  /**
   * The peak current phasor of an element at every frequency, in A, by the sign conventions of
   * `OperatingPoint.current` (two-terminal elements from their first node to their second, controlled
   * sources their output branch, an op-amp the current out of its output).
   */
  current(element: string): Complex[] {
    const op = this.operatingPoint;
    return this.#phasors(currentReader(op.system, op, element, false));
  }

  /** The phasor a {@link Probe} reads at every frequency (V for voltages, A for currents). */
  response(probe: Probe): Complex[] {
    const op = this.operatingPoint;
    return this.#phasors(probeReader(op.system, op, probe, false, 'probe'));
  }

  /** What `read` finds in the stored solution at every frequency. */
  #phasors(read: ProbeReader): Complex[] {
    const stride = this.operatingPoint.system.n + 1;
    const out: Complex[] = new Array(this.frequencies.length);
    const value = new Float64Array(2);
    for (let k = 0; k < this.frequencies.length; k++) {
      const xr = this.re.subarray(k * stride, (k + 1) * stride);
      const xi = this.im.subarray(k * stride, (k + 1) * stride);
      read(xr, xi, 2 * Math.PI * this.frequencies[k]!, value);
      out[k] = new Complex(value[0]!, value[1]!);
    }
    return out;
  }

  /** output/input at every frequency: a voltage gain for two node probes, a transimpedance for a voltage over a current, … */
  gain(output: Probe, input: Probe): Complex[] {
    const num = this.response(output);
    const den = this.response(input);
    return num.map((value, k) => {
      const d = den[k]!;
      if (d.re === 0 && d.im === 0) {
        throw invalidValue(
          ['input'],
          input,
          `a probe with a non-zero response (it is zero at ${this.frequencies[k]} Hz)`,
        );
      }
      return value.div(d);
    });
  }

  /** 20·log10 of |output| (or of |output/input| when `input` is given), in dB. */
  magnitudeDb(output: Probe, input?: Probe): Float64Array {
    return decibels(this.#ratio(output, input));
  }

  /** The phase of output (or of output/input) in degrees, unwrapped along the sweep in the order given. */
  phaseDegrees(output: Probe, input?: Probe): Float64Array {
    return unwrappedPhase(this.#ratio(output, input));
  }

  /** Magnitude, dB and unwrapped phase of output (or output/input) at every frequency. */
  bode(output: Probe, input?: Probe): BodeTable {
    const h = this.#ratio(output, input);
    return {
      frequencies: this.frequencies.slice(),
      magnitude: Float64Array.from(h, (value) => value.abs()),
      magnitudeDb: decibels(h),
      phaseDegrees: unwrappedPhase(h),
    };
  }

  /**
   * Every frequency where the response falls `dropDb` below its reference level (the −3 dB points),
   * interpolated between sweep points linearly in dB against log frequency. Empty when the response
   * never crosses that level inside the sweep. The frequencies must be ascending.
   */
  cutoffFrequencies(output: Probe, input?: Probe, options: CutoffOptions = {}): number[] {
    checkAscending(this.frequencies);
    const level = decibels(this.#ratio(output, input));
    const drop = options.dropDb ?? 10 * Math.log10(2);
    if (!Number.isFinite(drop)) throw invalidValue(['dropDb'], drop, 'a finite number of dB');
    let reference = options.referenceDb;
    if (reference === undefined) {
      reference = -Infinity;
      for (const value of level) reference = Math.max(reference, value);
    } else if (!Number.isFinite(reference)) {
      throw invalidValue(['referenceDb'], reference, 'a finite level in dB');
    }
    return crossings(this.frequencies, level, reference - drop);
  }

  /** The highest point of |output| (or |output/input|), refined between sweep points (docs/analyses-ac.md, "Peaks and pass bands"). */
  peak(output: Probe, input?: Probe): ResponsePeak {
    checkAscending(this.frequencies);
    return responsePeak(this.frequencies, this.magnitudeDb(output, input));
  }

  /** The pass band around the peak: −3 dB edges, centre, bandwidth and Q; `null` unless both edges lie in the sweep. */
  passBand(output: Probe, input?: Probe, options?: PassBandOptions): PassBand | null {
    checkAscending(this.frequencies);
    return passBand(this.frequencies, this.magnitudeDb(output, input), options);
  }

  /**
   * The first frequency where |output| (or |output/input|) crosses 1 (0 dB), interpolated as
   * {@link AcAnalysis.cutoffFrequencies}; `null` when it never does inside the sweep.
   */
  unityGainFrequency(output: Probe, input?: Probe): number | null {
    checkAscending(this.frequencies);
    return crossings(this.frequencies, decibels(this.#ratio(output, input)), 0)[0] ?? null;
  }

  /**
   * The impedance the rest of the circuit presents to an independent source at its terminals, in Ω:
   * v(plus) − v(minus) over the current the source drives into `plus` for a voltage source, and
   * v(to) − v(from) over the source's current for a current source. This is the input impedance of
   * the port that the source drives (its own internal resistance excluded: put it in as a resistor),
   * with every other source as it is. `Complex.INFINITY` where no current flows (a voltage source's
   * current below the rounding error of the currents meeting at its node counts as none).
   *
   * @throws QuiescentError `unknown-element` for an element that is not an independent source;
   *   `invalid-value` for a source without an AC excitation
   */
  sourceImpedance(source: string): Complex[] {
    const record = this.operatingPoint.system.deviceByName.get(source)?.record;
    if (record === undefined) throw unknownElement(source);
    if (record.kind !== 'voltage-source' && record.kind !== 'current-source') {
      throw unknownElement(source, 'an impedance is seen by an independent voltage or current source only');
    }
    if (!(record.ac.magnitude > 0)) {
      throw invalidValue([source, 'ac'], record.ac.magnitude, 'a source with a non-zero AC magnitude');
    }
    const i = this.current(source);
    if (record.kind === 'current-source') {
      const v = this.voltage(record.to, record.from);
      return v.map((value, k) => value.div(i[k]!));
    }
    const v = this.voltage(record.plus, record.minus);
    const system = this.operatingPoint.system;
    const plus = nodeAt(system, record.plus);
    const row = plus < system.n ? plus : nodeAt(system, record.minus);
    const workspace = new AcWorkspace(this.operatingPoint);
    return v.map((value, k) => {
      workspace.assembleAt(this.frequencies[k]!);
      const noise = ROUNDING_MARGIN * Number.EPSILON * this.#rowCurrentScale(workspace, row, k);
      const drive = i[k]!.neg();
      return drive.abs() <= noise ? Complex.INFINITY : value.div(drive);
    });
  }

  /** Σ_j |A(row, j)·x_j| at frequency index k: the size of the currents whose balance is row `row`. */
  #rowCurrentScale(workspace: AcWorkspace, row: number, k: number): number {
    const { n, pattern } = this.operatingPoint.system;
    const { Ap, Ai: rows } = pattern;
    const stride = n + 1;
    let scale = 0;
    for (let j = 0; j < n; j++) {
      const xr = this.re[k * stride + j]!;
      const xi = this.im[k * stride + j]!;
      for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
        if (rows[p] !== row) continue;
        scale += Math.hypot(workspace.Ar[p]!, workspace.Ai[p]!) * Math.hypot(xr, xi);
      }
    }
    return scale;
  }

  /** Plain data: the frequencies and the phasors of every node voltage and element current. */
  toJSON(): AcAnalysisJson {
    return acAnalysisToJson(this);
  }

  #ratio(output: Probe, input?: Probe): Complex[] {
    return input === undefined ? this.response(output) : this.gain(output, input);
  }
}

/** Multiple of the unit roundoff below which a source current is indistinguishable from zero. */
const ROUNDING_MARGIN = 64;

/**
 * Solve the small-signal circuit at the operating point `op` for every frequency.
 *
 * @param op - the operating point to linearize at
 * @param options - `frequencies` in Hz (number[] or Float64Array, any order; 0 gives the small-signal DC solution)
 * @returns the immutable {@link AcAnalysis}
 * @throws QuiescentError `invalid-value` for an empty list or a negative or non-finite frequency;
 *   `singular` when the small-signal circuit has no unique solution at some frequency
 *
 * @example
 * ```ts
 * const ac = acAnalysis(op, { frequencies: logSweep(10, 1e6, 20) });
 * ac.magnitudeDb('out', 'in');       // the voltage gain in dB
 * ac.cutoffFrequencies('out', 'in'); // its −3 dB points, in Hz
 * ```
 */
export function acAnalysis(op: OperatingPoint, options: AcAnalysisOptions): AcAnalysis {
  requireInstance(op, OperatingPoint, 'op', 'an OperatingPoint (the result of operatingPoint(circuit))');
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the frequencies to analyse');
  }
  const frequencies = checkFrequencies(options.frequencies);
  const workspace = new AcWorkspace(op);
  const stride = op.system.n + 1;
  const re = new Float64Array(frequencies.length * stride);
  const im = new Float64Array(frequencies.length * stride);
  for (let k = 0; k < frequencies.length; k++) {
    workspace.factorAt(frequencies[k]!);
    const xr = re.subarray(k * stride, (k + 1) * stride);
    const xi = im.subarray(k * stride, (k + 1) * stride);
    xr.set(workspace.sourceRe);
    xi.set(workspace.sourceIm);
    workspace.solve(xr, xi);
  }
  return new AcAnalysis(op, frequencies, re, im);
}
