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
  | 'invalid-circuit'
  | 'no-signal'
  | 'cancelled';

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
  | {
      /** A value is not finite, has a wrong unit or is out of range. */
      readonly code: 'invalid-value';
      /** Where the value was given, such as `['Q1', 'model', 'forwardBeta']`. */
      readonly path: readonly (string | number)[];
      /** The rejected value, as given. */
      readonly value: unknown;
    }
  | {
      /** An element name is used twice. */
      readonly code: 'duplicate-name';
      /** The name used twice. */
      readonly name: string;
    }
  | {
      /** An analysis asks for a node the circuit lacks. */
      readonly code: 'unknown-node';
      /** The node asked for. */
      readonly node: string;
    }
  | {
      /** An element is missing, or has no current unknown where one is needed. */
      readonly code: 'unknown-element';
      /** The element named. */
      readonly element: string;
      /** Where it was named, when it was named in a circuit (the controlling element of a ccvs, say). */
      readonly path?: readonly (string | number)[];
    }
  | {
      /** Nothing connects to ground. */
      readonly code: 'no-ground';
      /** Nodes named like a ground ('0', 'GND', 'ground' …), which were probably meant to be it. */
      readonly groundLikeNodes?: readonly string[];
    }
  | {
      /** Some nodes have no DC path to ground. */
      readonly code: 'floating-node';
      /** Every floating node. */
      readonly nodes: readonly string[];
    }
  | {
      /** The equations have no unique solution. */
      readonly code: 'singular';
      /** The elements involved (the loop, the cut set, or those touching the singular row). */
      readonly elements: readonly string[];
      /** The nodes involved. */
      readonly nodes: readonly string[];
      /**
       * A loop of voltage sources, a cut set of current sources, equations that no values could
       * make regular (`'structural'`: some equation or unknown has no partner in any arrangement),
       * equations whose values make them exactly dependent (`'matrix'`), or equations too
       * ill-conditioned for double precision (`'ill-conditioned'`, with `conditionEstimate`).
       */
      readonly reason: 'voltage-loop' | 'current-cut-set' | 'matrix' | 'structural' | 'ill-conditioned';
      /** For `'ill-conditioned'`: the estimated 1-norm condition number of the row-equilibrated equations. */
      readonly conditionEstimate?: number;
      /** For `'matrix'` found while solving: the ratio of the largest to the smallest non-zero matrix entry. */
      readonly valueRange?: number;
    }
  | {
      /** The operating point could not be found. */
      readonly code: 'no-convergence';
      /** Every strategy tried, in order. */
      readonly strategies: readonly StrategyAttempt[];
      /** The unknowns with the largest residuals at the end, largest first. */
      readonly worstResiduals: readonly ResidualEntry[];
      /** The nonlinear devices touching those unknowns. */
      readonly devices: readonly string[];
      /** The norm of the last Newton update. */
      readonly lastUpdateNorm: number;
      /** The norm of the last residual. */
      readonly lastResidualNorm: number;
      /**
       * Whether every residual was within tolerance at the point reached (only the updates failed
       * to settle); `worstResiduals` then lists the rows closest to their tolerance.
       */
      readonly residualsWithinTolerance: boolean;
    }
  | {
      /** A JSON document or builder call is malformed in another way. */
      readonly code: 'invalid-circuit';
      /** Where the problem is, such as `['elements', 3, 'kind']`. */
      readonly path: readonly (string | number)[];
    }
  | {
      /** A ratio to a fundamental was asked where the output carries no signal. */
      readonly code: 'no-signal';
      /** The output, as a report names it. */
      readonly output: string;
      /** The frequencies looked at, in Hz (empty for the large-signal check, which has none). */
      readonly frequencies: readonly number[];
    }
  | {
      /** A long run was stopped through its AbortSignal. */
      readonly code: 'cancelled';
      /** What was stopped, such as `'monte-carlo'`. */
      readonly run: string;
    };

/** The details type that belongs to one code. */
export type DetailsOf<C extends ErrorCode> = Extract<
  ErrorDetails,
  {
    /** The code to select. */
    code: C;
  }
>;

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
