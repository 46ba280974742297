/**
 * A stability report for one feedback loop: the loop gain and its margins at a loop probe, the
 * circuit's dominant poles, and a verdict. The poles decide: a pole in the right half-plane makes the
 * circuit unstable whatever the margins say (a loop that is stable only conditionally, or a second loop
 * the probe does not break). Otherwise a phase margin below 45° is reported as too small: the closed
 * loop then peaks and rings (docs/stability.md, "What the margins mean").
 */
import { invalidValue } from '../errors/messages.js';
import { type LoopGain, type LoopGainJson, type LoopGainOptions, loopGain } from './loop-gain.js';
import { DENSE_LIMIT, poles, type Root } from './natural-frequencies.js';
import type { OperatingPoint } from './operating-point.js';

/** The phase margin below which the verdict is `'low-margin'`, in degrees. */
export const PHASE_MARGIN_TARGET = 45;

/** The verdict of a {@link StabilityReport}. */
export type StabilityVerdict = 'stable' | 'low-margin' | 'unstable';

/** Options of {@link stabilityReport}. */
export interface StabilityReportOptions extends LoopGainOptions {
  /** How many poles, lowest frequency first, the report lists as dominant (default 6); right-half-plane poles are always listed. */
  readonly dominantPoles?: number;
}

/** A stability report as plain JSON (an infinite Q is `null`). */
export interface StabilityReportJson {
  /** See {@link StabilityReport.verdict}. */
  readonly verdict: StabilityVerdict;
  /** The loop gain and its margins. */
  readonly loop: LoopGainJson;
  /** The dominant poles. */
  readonly dominantPoles: readonly RootJson[];
  /** The poles in the right half-plane. */
  readonly unstablePoles: readonly RootJson[];
  /** Whether every pole of the circuit was examined (false above the dense size). */
  readonly allPolesExamined: boolean;
}

/** A pole or zero as JSON: a {@link Root} with an infinite Q written as `null`. */
export interface RootJson {
  /** Re s/(2π), in Hz. */
  readonly real: number;
  /** Im s/(2π), in Hz. */
  readonly imaginary: number;
  /** |s|/(2π), in Hz. */
  readonly frequency: number;
  /** 1/(2·dampingRatio); null on the imaginary axis. */
  readonly q: number | null;
  /** −Re s/|s|. */
  readonly dampingRatio: number;
}

/** A root as JSON. */
export function rootToJson(root: Root): RootJson {
  return { ...root, q: Number.isFinite(root.q) ? root.q : null };
}

/** Whether a pole lies in the right half-plane (beyond rounding of the imaginary axis). */
export function isRightHalfPlane(root: Root): boolean {
  return root.real > 1e-9 * root.frequency;
}

/** Margins, dominant poles and a verdict for one feedback loop. Immutable. */
export class StabilityReport {
  /** The loop gain at the probe, with its crossover and margins. */
  readonly loop: LoopGain;
  /** The lowest-frequency poles of the circuit (sorted as {@link poles} sorts). */
  readonly dominantPoles: readonly Root[];
  /** Every pole found in the right half-plane. */
  readonly unstablePoles: readonly Root[];
  /**
   * Whether every pole of the circuit was examined: true up to 1,000 unknowns; above, the poles
   * nearest the crossover frequency (or 0 Hz) were, and a right-half-plane pole far from it may be missed.
   */
  readonly allPolesExamined: boolean;
  /**
   * `'unstable'` with a pole in the right half-plane; otherwise `'low-margin'` when the phase margin
   * is below 45°; otherwise `'stable'`.
   */
  readonly verdict: StabilityVerdict;

  /** @internal Built by {@link stabilityReport}. */
  constructor(loop: LoopGain, allPoles: readonly Root[], dominantCount: number, allPolesExamined: boolean) {
    this.loop = loop;
    this.unstablePoles = allPoles.filter(isRightHalfPlane);
    this.dominantPoles = allPoles.slice(0, dominantCount);
    this.allPolesExamined = allPolesExamined;
    this.verdict =
      this.unstablePoles.length > 0
        ? 'unstable'
        : loop.phaseMargin !== null && loop.phaseMargin < PHASE_MARGIN_TARGET
          ? 'low-margin'
          : 'stable';
  }

  /** Plain data: the verdict, the loop gain and the poles. */
  toJSON(): StabilityReportJson {
    return {
      verdict: this.verdict,
      loop: this.loop.toJSON(),
      dominantPoles: this.dominantPoles.map(rootToJson),
      unstablePoles: this.unstablePoles.map(rootToJson),
      allPolesExamined: this.allPolesExamined,
    };
  }
}

/**
 * Measure a feedback loop at a loop probe and judge its stability from the margins and the poles.
 *
 * @param op - the operating point to linearize at
 * @param options - `probe` and `frequencies` as {@link loopGain}; `dominantPoles`, how many poles to list
 * @returns the {@link StabilityReport}
 * @throws QuiescentError as {@link loopGain} and {@link poles}; `invalid-value` for a bad `dominantPoles`
 */
export function stabilityReport(op: OperatingPoint, options: StabilityReportOptions): StabilityReport {
  const loop = loopGain(op, options);
  const count = options.dominantPoles ?? 6;
  if (!(Number.isInteger(count) && count >= 0)) {
    throw invalidValue(['dominantPoles'], count, 'a whole number of poles, 0 or more');
  }
  const dense = op.system.n <= DENSE_LIMIT;
  const found = dense
    ? poles(op)
    : poles(op, { limit: Math.max(2 * count, 20), near: loop.crossoverFrequency ?? 0 });
  return new StabilityReport(loop, found, count, dense);
}
