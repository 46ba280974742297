/**
 * The constructors of every error: each takes what a check found, as data, and returns the error;
 * the words come from `describeError` (wording.ts), so call sites never write a message.
 */
import {
  type CircuitProblem,
  QuiescentError,
  type ResidualEntry,
  type StrategyAttempt,
  type ValueRange,
} from './quiescent-error.js';
import { rangeWords } from './wording.js';

/** What a value was expected to be: a shared range with its unit, or a phrase for a one-off rule. */
export type Expectation =
  | string
  | {
      /** The admissible range. */
      readonly range: ValueRange;
      /** The unit, `'none'` for a pure number; left out when the value has no unit rule. */
      readonly unit?: string;
    }
  | {
      /** What was expected, in words, without the unit (`'a resistance'`). */
      readonly expected: string;
      /** The unit, `'none'` for a pure number. */
      readonly unit?: string;
      /** Why the value was rejected (a wrong unit symbol, say). */
      readonly reason?: string;
    };

/** A value is missing, mistyped, in a wrong unit or out of range. */
export function invalidValue(
  path: readonly (string | number)[],
  value: unknown,
  expected: Expectation,
): QuiescentError {
  if (typeof expected === 'string')
    return new QuiescentError({ code: 'invalid-value', path, value, expected });
  if ('range' in expected) {
    const { range, unit } = expected;
    return new QuiescentError({
      code: 'invalid-value',
      path,
      value,
      expected: rangeWords(range),
      range,
      ...(unit === undefined ? {} : { unit }),
    });
  }
  return new QuiescentError({ code: 'invalid-value', path, value, ...expected });
}

/** An element name is used twice. */
export function duplicateName(name: string): QuiescentError {
  return new QuiescentError({ code: 'duplicate-name', name });
}

/** A builder call or JSON document is malformed: `problem` says how, as data. */
export function invalidCircuit(
  path: readonly (string | number)[],
  problem: CircuitProblem | string,
  element?: string,
): QuiescentError {
  if (typeof problem === 'string') problem = { kind: 'other', text: problem };
  return new QuiescentError(
    element === undefined
      ? { code: 'invalid-circuit', path, problem }
      : { code: 'invalid-circuit', path, problem, element },
  );
}

/** An analysis names a node the circuit lacks. */
export function unknownNode(node: string, path: readonly (string | number)[] = []): QuiescentError {
  return new QuiescentError(
    path.length > 0 ? { code: 'unknown-node', node, path } : { code: 'unknown-node', node },
  );
}

/** An analysis or controlled source names an element the circuit lacks, or one without the needed quantity. */
export function unknownElement(
  element: string,
  reason = 'the circuit has no element of that name',
  path: readonly (string | number)[] = [],
): QuiescentError {
  return new QuiescentError({ code: 'unknown-element', element, path, reason });
}

/** Nothing connects to ground. */
export function noGround(): QuiescentError {
  return new QuiescentError({ code: 'no-ground' });
}

/** Some nodes have no DC path to ground. */
export function floatingNodes(nodes: readonly string[]): QuiescentError {
  return new QuiescentError({ code: 'floating-node', nodes });
}

/** A loop of voltage-defined branches (voltage sources, inductors, controlled-source and op-amp outputs). */
export function voltageLoop(elements: readonly string[], nodes: readonly string[]): QuiescentError {
  return new QuiescentError({ code: 'singular', elements, nodes, reason: 'voltage-loop' });
}

/** The matrix became singular while solving; `context` says where (`'at the operating point'`). */
export function singularMatrix(
  elements: readonly string[],
  nodes: readonly string[],
  context: string,
): QuiescentError {
  return new QuiescentError({ code: 'singular', elements, nodes, reason: 'matrix', context });
}

/** The operating point could not be found. */
export function noConvergence(details: {
  strategies: readonly StrategyAttempt[];
  worstResiduals: readonly ResidualEntry[];
  devices: readonly string[];
  lastUpdateNorm: number;
  lastResidualNorm: number;
}): QuiescentError {
  return new QuiescentError({ code: 'no-convergence', ...details });
}

/** A long computation was cancelled after `done` of `total` steps. */
export function cancelled(done: number, total: number): QuiescentError {
  return new QuiescentError({ code: 'cancelled', done, total });
}

/** A ratio to a fundamental was asked where the output carries no signal. */
export function noSignal(
  output: string,
  frequencies: readonly number[] = [],
  reason?: string,
): QuiescentError {
  return new QuiescentError(
    reason === undefined
      ? { code: 'no-signal', output, frequencies }
      : { code: 'no-signal', output, frequencies, reason },
  );
}
