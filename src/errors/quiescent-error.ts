/**
 * The one error type of the library. Every failure carries a `code` that programs switch on, a
 * message that names the elements and nodes involved, and `details` shaped by the code.
 */
import { describeError } from './wording.js';

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
      /** What was expected, in words without the unit (`'a positive value'`, `'a resistance'`). */
      readonly expected: string;
      /** The admissible range, when the rule is one of the shared ranges. */
      readonly range?: ValueRange;
      /** The unit the value is expected in (`'Ω'`, `'A/V²'`; `'none'` for a pure number), when it has one. */
      readonly unit?: string;
      /** Why the value was rejected, when more than the range explains it (a wrong unit symbol, say). */
      readonly reason?: string;
      /** The element the value belongs to, when the path is a document's (`['elements', 3, 'resistance']`). */
      readonly element?: string;
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
      /** Where it was named, when that is known (an analysis option, say). */
      readonly path?: readonly (string | number)[];
    }
  | {
      /** An element is missing, or has no current unknown where one is needed. */
      readonly code: 'unknown-element';
      /** The element named. */
      readonly element: string;
      /** Where it was named, when it was named in a circuit (the controlling element of a ccvs, say). */
      readonly path?: readonly (string | number)[];
      /** Why it cannot serve: missing, or lacking the quantity asked for. */
      readonly reason: string;
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
      /** When a singular matrix was met: where, in words (`'at the operating point'`, `'at 1 kHz'`). */
      readonly context?: string;
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
      /** What is wrong there. */
      readonly problem: CircuitProblem;
      /** The element concerned, when the path is a document's (`['elements', 3, 'kind']`). */
      readonly element?: string;
    }
  | {
      /** An output carries no signal where a ratio or a level of it is asked for. */
      readonly code: 'no-signal';
      /** The output, as a report names it. */
      readonly output: string;
      /** The frequencies looked at, in Hz (empty for the large-signal check, which has none). */
      readonly frequencies?: readonly number[];
      /** Why there is no signal, when it is known (`'the input carries none'`). */
      readonly reason?: string;
    }
  | {
      /** A long computation was cancelled by its caller. */
      readonly code: 'cancelled';
      /** What was stopped, such as `'monte-carlo'`. */
      readonly run?: string;
      /** How many steps (samples, points) were done. */
      readonly done: number;
      /** How many steps there were to do. */
      readonly total: number;
    };

/** What is wrong with a builder call or a JSON document, as data; `what` says which part it concerns. */
export type CircuitProblem =
  | {
      /** A name that is not a non-empty string. */
      readonly kind: 'not-a-name';
      /** Which name: an element's, a node's or a controlling element's. */
      readonly what: 'element' | 'node' | 'controlling element';
      /** What was given instead, described (`'5'`, `'null'`, `'""'`). */
      readonly got: string;
    }
  | {
      /** Not a pair of node names. */
      readonly kind: 'not-a-pair';
    }
  | {
      /** Not an object (or array) where one is needed. */
      readonly kind: 'not-an-object';
      /** Which part: terminals, model parameters, a source's settings, an AC setting, a document, its elements or one element. */
      readonly what:
        | 'terminals'
        | 'model'
        | 'options'
        | 'source'
        | 'ac'
        | 'document'
        | 'elements'
        | 'element';
      /** The kind in words for a model (`'a diode'`), or the keys expected for terminals. */
      readonly of?: string;
      /** The keys expected (terminals, model polarity values). */
      readonly keys?: readonly string[];
    }
  | {
      /** A key that is not one of those known. */
      readonly kind: 'unknown-key';
      /** What kind of key. */
      readonly what:
        | 'terminal'
        | 'parameter'
        | 'option'
        | 'source setting'
        | 'AC setting'
        | 'field'
        | 'document field';
      /** The owner in words (`'a diode'`, `'resistor'`), where it matters. */
      readonly of?: string;
      /** The known keys. */
      readonly known: readonly string[];
    }
  | {
      /** A value that is not one of the values allowed. */
      readonly kind: 'not-one-of';
      /** Which value. */
      readonly what: 'polarity' | 'format' | 'kind';
      /** The values allowed. */
      readonly allowed: readonly string[];
      /** What was given, described. */
      readonly got: string;
    }
  | {
      /** A required field is missing. */
      readonly kind: 'missing';
      /** The kind that needs it. */
      readonly of: string;
    }
  | {
      /** A field of the wrong JSON type. */
      readonly kind: 'wrong-type';
      /** The type expected. */
      readonly expected: 'string' | 'number' | 'boolean' | 'object' | 'ac';
    }
  | {
      /** A document version this release does not read. */
      readonly kind: 'unsupported-version';
      /** The version given, described. */
      readonly got: string;
      /** The version this release reads. */
      readonly supported: number;
    }
  | {
      /** A polarity inside a document's model, where it would contradict the element's field. */
      readonly kind: 'polarity-in-model';
    }
  | {
      /** A one-off rule of an analysis, stated in words. */
      readonly kind: 'other';
      /** What is wrong. */
      readonly text: string;
    };

/** The codes a {@link QuiescentError} can carry: one per shape of {@link ErrorDetails}. */
export type ErrorCode = ErrorDetails['code'];

/**
 * The shared ranges of numeric values: `'positive'` (> 0, finite), `'non-negative'` (≥ 0, finite),
 * `'positive-or-infinite'` (> 0, Infinity allowed where it removes an effect), `'at-least-one'`
 * (≥ 1), `'grading'` (strictly between 0 and 1), `'any'` (any finite number), `'any-or-infinite'`
 * (any number, ±Infinity removing a limit) and `'above-one'` (> 1, finite).
 */
export type ValueRange =
  | 'positive'
  | 'non-negative'
  | 'positive-or-infinite'
  | 'at-least-one'
  | 'grading'
  | 'any'
  | 'any-or-infinite'
  | 'above-one';

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

  /**
   * Builds an error from its details; the message is worded from them (see `describeError`), or
   * given when a caller adds context to an error it passes on.
   */
  constructor(details: ErrorDetails, message: string = describeError(details)) {
    super(message);
    this.name = 'QuiescentError';
    this.code = details.code;
    this.details = details;
  }
}
