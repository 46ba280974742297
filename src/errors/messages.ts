/**
 * The English of every error, in one place. Checks build details as data and call these at the
 * boundary, so that wording stays consistent and can be reviewed at a glance.
 */
import {
  formatPath,
  listNames,
  QuiescentError,
  type ResidualEntry,
  type StrategyAttempt,
} from './quiescent-error.js';

const at = (path: readonly (string | number)[]): string => (path.length > 0 ? `${formatPath(path)}: ` : '');

function show(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') return String(value);
  if (value === undefined) return 'undefined';
  if (value === null) return 'null';
  return typeof value;
}

/** A value is missing, mistyped or out of range. */
export function invalidValue(
  path: readonly (string | number)[],
  value: unknown,
  expected: string,
): QuiescentError {
  return new QuiescentError(
    { code: 'invalid-value', path, value },
    `${at(path)}${show(value)} is not ${expected}`,
  );
}

/** An element name is used twice. */
export function duplicateName(name: string): QuiescentError {
  return new QuiescentError(
    { code: 'duplicate-name', name },
    `an element named '${name}' already exists; element names must be unique`,
  );
}

/** A builder call or JSON document is malformed. */
export function invalidCircuit(path: readonly (string | number)[], problem: string): QuiescentError {
  return new QuiescentError({ code: 'invalid-circuit', path }, `${at(path)}${problem}`);
}

/** An analysis names a node the circuit lacks. */
export function unknownNode(node: string, path: readonly (string | number)[] = []): QuiescentError {
  return new QuiescentError(
    { code: 'unknown-node', node },
    `${at(path)}the circuit has no node named '${node}'`,
  );
}

/** An analysis or controlled source names an element the circuit lacks, or one without the needed quantity. */
export function unknownElement(
  element: string,
  why = 'the circuit has no element of that name',
  path: readonly (string | number)[] = [],
): QuiescentError {
  return new QuiescentError({ code: 'unknown-element', element, path }, `${at(path)}'${element}': ${why}`);
}

/** Nothing connects to ground. */
export function noGround(): QuiescentError {
  return new QuiescentError(
    { code: 'no-ground' },
    "no element connects to ground (node 'gnd'); every circuit needs a reference node",
  );
}

/** Some nodes have no DC path to ground. */
export function floatingNodes(nodes: readonly string[]): QuiescentError {
  const which = nodes.length === 1 ? `node ${listNames(nodes)} has` : `nodes ${listNames(nodes)} have`;
  return new QuiescentError(
    { code: 'floating-node', nodes },
    `${which} no DC path to ground (capacitors, current sources and transistor gates carry no DC current); ` +
      'add a resistor to ground or connect them to the rest of the circuit',
  );
}

/** A loop of voltage-defined branches (voltage sources, inductors, controlled-source and op-amp outputs). */
export function voltageLoop(elements: readonly string[], nodes: readonly string[]): QuiescentError {
  return new QuiescentError(
    { code: 'singular', elements, nodes, reason: 'voltage-loop' },
    `${elements.length === 1 ? `element ${listNames(elements)} forms` : `elements ${listNames(elements)} form`} ` +
      'a loop of voltage sources, inductors or driven outputs ' +
      `through node${nodes.length === 1 ? '' : 's'} ${listNames(nodes)}, so ${elements.length === 1 ? 'its current is' : 'their currents are'} not determined`,
  );
}

/** The matrix became singular while solving. */
export function singularMatrix(
  elements: readonly string[],
  nodes: readonly string[],
  context: string,
): QuiescentError {
  const parts: string[] = [];
  if (nodes.length > 0) parts.push(`node${nodes.length > 1 ? 's' : ''} ${listNames(nodes)}`);
  if (elements.length > 0) parts.push(`element${elements.length > 1 ? 's' : ''} ${listNames(elements)}`);
  return new QuiescentError(
    { code: 'singular', elements, nodes, reason: 'matrix' },
    `the circuit equations have no unique solution ${context}; the trouble involves ${parts.join(' and ')}`,
  );
}

/** The operating point could not be found. */
export function noConvergence(details: {
  strategies: readonly StrategyAttempt[];
  worstResiduals: readonly ResidualEntry[];
  devices: readonly string[];
  lastUpdateNorm: number;
  lastResidualNorm: number;
}): QuiescentError {
  const tried = details.strategies.map((s) => `${s.strategy} (${s.iterations} iterations)`).join(', ');
  const worst = details.worstResiduals
    .map((r) => `${r.kind} '${r.name}' (${r.residual.toExponential(2)} ${r.kind === 'node' ? 'A' : 'V'})`)
    .join(', ');
  const devices = details.devices.length > 0 ? `; devices still moving: ${listNames(details.devices)}` : '';
  return new QuiescentError(
    { code: 'no-convergence', ...details },
    `the operating point could not be found after ${tried}; largest residuals at ${worst || 'no node'}${devices}`,
  );
}

/** A long run was stopped through its AbortSignal. */
export function cancelled(run: string, done: number, total: number): QuiescentError {
  return new QuiescentError(
    { code: 'cancelled', run },
    `the ${run} run was stopped through its AbortSignal after ${done} of ${total} samples`,
  );
}
