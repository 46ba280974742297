/** Options of the operating-point search, their defaults and their checks. */
import { invalidValue } from '../errors/messages.js';

/** Options of {@link operatingPoint} (and of the sweeps built on it). */
export interface OperatingPointOptions {
  /** Temperature in kelvin (default 298.15, 25 °C). */
  temperature?: number;
  /**
   * The small conductance across every junction and MOSFET channel, in S (default 1e-12), which keeps
   * the equations regular when junctions are reverse-biased.
   */
  junctionConductance?: number;
  /** Relative tolerance of updates and residuals (default 1e-6). */
  relativeTolerance?: number;
  /** Absolute tolerance of node-voltage updates and branch-equation residuals, in V (default 1e-9). */
  voltageTolerance?: number;
  /** Absolute tolerance of branch-current updates and KCL residuals, in A (default 1e-12). */
  currentTolerance?: number;
  /**
   * Newton iterations allowed to each attempt. When given, a strict limit. By default 200, extended
   * 200 at a time (up to one extension per hundred unknowns) while the last 200 brought more
   * equations within tolerance or halved the residual, so that a long chain settling stage by stage
   * is not cut short (docs/analyses.md, "Strategies").
   */
  maxIterations?: number;
  /** Starting voltage of chosen nodes, in V (default 0 for every node). */
  initialGuess?: Readonly<Record<string, number>>;
}

/** The options with every default filled in. */
export interface ResolvedOptions {
  readonly temperature: number;
  readonly junctionConductance: number;
  readonly relativeTolerance: number;
  readonly voltageTolerance: number;
  readonly currentTolerance: number;
  readonly maxIterations: number;
  /** Whether a Newton run may go past maxIterations while it makes progress (maxIterations not given). */
  readonly growIterations: boolean;
  readonly initialGuess: Readonly<Record<string, number>>;
}

/** Default analysis temperature, 25 °C (where data sheets specify parts), in kelvin. */
export const DEFAULT_TEMPERATURE = 298.15;

function positiveOption(options: object, key: string, fallback: number): number {
  const v = (options as Record<string, unknown>)[key];
  if (v === undefined) return fallback;
  if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) {
    throw invalidValue(['options', key], v, 'a finite positive number');
  }
  return v;
}

/** Check the options and fill in defaults. */
export function resolveOptions(options: OperatingPointOptions = {}): ResolvedOptions {
  const guess = options.initialGuess ?? {};
  for (const [node, v] of Object.entries(guess)) {
    if (typeof v !== 'number' || !Number.isFinite(v))
      throw invalidValue(['options', 'initialGuess', node], v, 'a finite voltage');
  }
  const maxIterations = positiveOption(options, 'maxIterations', 200);
  if (!Number.isInteger(maxIterations))
    throw invalidValue(['options', 'maxIterations'], maxIterations, 'a whole number');
  return {
    temperature: positiveOption(options, 'temperature', DEFAULT_TEMPERATURE),
    junctionConductance: positiveOption(options, 'junctionConductance', 1e-12),
    relativeTolerance: positiveOption(options, 'relativeTolerance', 1e-6),
    voltageTolerance: positiveOption(options, 'voltageTolerance', 1e-9),
    currentTolerance: positiveOption(options, 'currentTolerance', 1e-12),
    maxIterations,
    growIterations: options.maxIterations === undefined,
    initialGuess: guess,
  };
}
