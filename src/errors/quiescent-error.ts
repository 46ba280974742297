/**
 * The one error type of the library. Every failure carries a `code` that programs switch on, a
 * message that names the elements and nodes involved, and `details` shaped by the code.
 */

/** The codes a {@link QuiescentError} can carry, as listed in the public contract. */
export type ErrorCode =
  | 'invalid-value'
  | 'duplicate-name'
  | 'unknown-node'
  | 'unknown-element'
  | 'no-ground'
  | 'floating-node'
  | 'singular'
  | 'no-convergence'
  | 'invalid-circuit';

/** One fallback strategy of the operating-point search and how it ended. */
export interface StrategyAttempt {
  /** `'newton'`, `'conductance-stepping'` or `'source-ramping'`. */
  readonly strategy: string;
  /** Newton iterations it used. */
  readonly iterations: number;
  /** Whether it reached a converged solution. */
  readonly converged: boolean;
}

/** A node or device with a large residual when the operating point could not be found. */
export interface ResidualEntry {
  /** The node name (for a KCL residual) or element name (for a branch equation). */
  readonly name: string;
  /** `'node'` for a KCL residual in amperes, `'branch'` for a branch equation in volts. */
  readonly kind: 'node' | 'branch';
  /** The residual value. */
  readonly residual: number;
}

/** Structured data for programs, discriminated by `code`. */
export type ErrorDetails =
  | { readonly code: 'invalid-value'; readonly path: readonly (string | number)[]; readonly value: unknown }
  | { readonly code: 'duplicate-name'; readonly name: string }
  | { readonly code: 'unknown-node'; readonly node: string }
  | {
      readonly code: 'unknown-element';
      readonly element: string;
      readonly path?: readonly (string | number)[];
    }
  | { readonly code: 'no-ground' }
  | { readonly code: 'floating-node'; readonly nodes: readonly string[] }
  | {
      readonly code: 'singular';
      readonly elements: readonly string[];
      readonly nodes: readonly string[];
      readonly reason: 'voltage-loop' | 'current-cut-set' | 'matrix';
    }
  | {
      readonly code: 'no-convergence';
      readonly strategies: readonly StrategyAttempt[];
      readonly worstResiduals: readonly ResidualEntry[];
      readonly devices: readonly string[];
      readonly lastUpdateNorm: number;
      readonly lastResidualNorm: number;
    }
  | { readonly code: 'invalid-circuit'; readonly path: readonly (string | number)[] };

/** The details type that belongs to one code. */
export type DetailsOf<C extends ErrorCode> = Extract<ErrorDetails, { code: C }>;

/**
 * Thrown by every public function on failure.
 *
 * @example
 * ```ts
 * try { operatingPoint(circuit); } catch (e) {
 *   if (e instanceof QuiescentError && e.code === 'floating-node') console.log(e.details);
 * }
 * ```
 */
export class QuiescentError extends Error {
  /** What went wrong, as a stable machine-readable code. */
  readonly code: ErrorCode;
  /** Structured data about the failure; its shape depends on `code`. */
  readonly details: ErrorDetails;

  /** Builds an error from its details and a message that names what is involved. */
  constructor(details: ErrorDetails, message: string) {
    super(message);
    this.name = 'QuiescentError';
    this.code = details.code;
    this.details = details;
  }
}

/** Formats a path such as `['Q1', 'model', 'forwardBeta']` as `Q1.model.forwardBeta`. */
export function formatPath(path: readonly (string | number)[]): string {
  let out = '';
  for (const part of path) {
    if (typeof part === 'number') out += `[${part}]`;
    else out += out === '' ? part : `.${part}`;
  }
  return out;
}

/** Lists names in words: `a`, `a and b`, `a, b and c`. */
export function listNames(names: readonly string[]): string {
  const quoted = names.map((n) => `'${n}'`);
  if (quoted.length <= 1) return quoted.join('');
  return `${quoted.slice(0, -1).join(', ')} and ${quoted[quoted.length - 1]}`;
}
