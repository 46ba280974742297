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
import { describeGiven, listNames, rangeWords } from './wording.js';

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

/** How a value given where another was expected reads in a message: its class, or its kind. */
function kindOf(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'an array';
  if (typeof value === 'object') {
    const name = (Object.getPrototypeOf(value) as { constructor?: { name?: unknown } } | null)?.constructor
      ?.name;
    if (typeof name !== 'string' || name === 'Object' || name === '') return 'a plain object';
    return `${/^[AEIOU]/.test(name) ? 'an' : 'a'} ${name}`;
  }
  return describeGiven(value);
}

/**
 * A public function was handed the wrong kind of argument: `invalid-circuit` for a circuit
 * argument, `invalid-value` for any other, with the argument's name as the path.
 */
export function wrongArgument(
  argument: string,
  value: unknown,
  expected: string,
  code: 'invalid-circuit' | 'invalid-value' = 'invalid-value',
): QuiescentError {
  const message = `${argument}: expected ${expected}, got ${kindOf(value)}`;
  return code === 'invalid-circuit'
    ? new QuiescentError({ code, path: [argument], problem: { kind: 'other', text: message } }, message)
    : new QuiescentError({ code, path: [argument], value, expected }, message);
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

/** Nothing connects to ground; `groundLikeNodes` are nodes named as if they were meant to be it. */
export function noGround(groundLikeNodes: readonly string[] = []): QuiescentError {
  return new QuiescentError({ code: 'no-ground', groundLikeNodes });
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
  valueRange?: number,
): QuiescentError {
  return new QuiescentError(
    valueRange === undefined
      ? { code: 'singular', elements, nodes, reason: 'matrix', context }
      : { code: 'singular', elements, nodes, reason: 'matrix', context, valueRange },
  );
}

/** The equations cannot be regular whatever the values: an equation or unknown has no partner. */
export function structurallySingular(d: {
  equations: readonly string[];
  equationKinds: readonly ('node' | 'branch')[];
  unknowns: readonly string[];
  unknownKinds: readonly ('node' | 'branch')[];
  elements: readonly string[];
  context: string;
}): QuiescentError {
  const equations = d.equations.map((name, i) =>
    d.equationKinds[i] === 'node'
      ? `the current balance at node '${name}'`
      : `the branch equation of '${name}'`,
  );
  const unknowns = d.unknowns.map((name, i) =>
    d.unknownKinds[i] === 'node' ? `the voltage of node '${name}'` : `the current of '${name}'`,
  );
  const nodes = d.unknowns.filter((_, i) => d.unknownKinds[i] === 'node');
  return new QuiescentError(
    { code: 'singular', elements: d.elements, nodes, reason: 'structural' },
    `the circuit equations have no unique solution ${d.context}, whatever the element values: ` +
      `${equations.join(', ')} ${equations.length === 1 ? 'determines' : 'determine'} nothing that is not already fixed, ` +
      `leaving ${unknowns.join(', ')} undetermined (for a branch equation: a controlled source or amplifier ` +
      `whose output is its own input says 0 = 0); elements involved: ${listNames(d.elements)}`,
  );
}

/** The equations are regular in structure but too ill-conditioned for double precision. */
export function illConditioned(d: {
  elements: readonly string[];
  nodes: readonly string[];
  conditionEstimate: number;
  context: string;
}): QuiescentError {
  const where = d.nodes.length > 0 ? ` at node${d.nodes.length > 1 ? 's' : ''} ${listNames(d.nodes)}` : '';
  return new QuiescentError(
    {
      code: 'singular',
      elements: d.elements,
      nodes: d.nodes,
      reason: 'ill-conditioned',
      conditionEstimate: d.conditionEstimate,
    },
    `the circuit equations ${d.context} are sound in structure but too ill-conditioned for double precision ` +
      `(condition number about ${d.conditionEstimate.toExponential(1)}; double precision carries about ` +
      `16 digits, so fewer than 3 would be left)${where}; look for gains or conductance ratios beyond about 1e13 among ${listNames(d.elements)}: ` +
      'this is not a fault of the topology',
  );
}

/** The operating point could not be found. */
export function noConvergence(details: {
  strategies: readonly StrategyAttempt[];
  worstResiduals: readonly ResidualEntry[];
  devices: readonly string[];
  lastUpdateNorm: number;
  lastResidualNorm: number;
  residualsWithinTolerance: boolean;
}): QuiescentError {
  return new QuiescentError({ code: 'no-convergence', ...details });
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

/** A long run (`'Monte Carlo'`, say) was stopped through its AbortSignal after `done` of `total` steps. */
export function cancelled(run: string, done: number, total: number): QuiescentError {
  return new QuiescentError({ code: 'cancelled', run, done, total });
}
