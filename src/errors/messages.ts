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
  return show(value);
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
    ? new QuiescentError({ code, path: [argument] }, message)
    : new QuiescentError({ code, path: [argument], value }, message);
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

/** Nothing connects to ground; `groundLikeNodes` are nodes named as if they were meant to be it. */
export function noGround(groundLikeNodes: readonly string[] = []): QuiescentError {
  const hint =
    groundLikeNodes.length > 0
      ? `; node ${listNames(groundLikeNodes)} looks meant as ground: name it 'gnd' (or use the GROUND constant)`
      : '';
  return new QuiescentError(
    { code: 'no-ground', groundLikeNodes },
    `no element connects to ground (node 'gnd'); every circuit needs a reference node${hint}`,
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
  valueRange?: number,
): QuiescentError {
  const parts: string[] = [];
  if (nodes.length > 0) parts.push(`node${nodes.length > 1 ? 's' : ''} ${listNames(nodes)}`);
  if (elements.length > 0) parts.push(`element${elements.length > 1 ? 's' : ''} ${listNames(elements)}`);
  // Entries more than about 1e16 apart lose the smaller when added: the dependence may be rounding.
  const hint =
    valueRange !== undefined && valueRange > 1e15
      ? `; the matrix entries span ${valueRange.toExponential(0)}, beyond the 16 digits of double precision, ` +
        'so a conductance or gain that small beside one that large is lost when they are added: ' +
        'the dependence may come from the values, not the topology'
      : '';
  return new QuiescentError(
    valueRange === undefined
      ? { code: 'singular', elements, nodes, reason: 'matrix' }
      : { code: 'singular', elements, nodes, reason: 'matrix', valueRange },
    `the circuit equations have no unique solution ${context}; the trouble involves ${parts.join(' and ')}${hint}`,
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
  const tried = details.strategies.map((s) => `${s.strategy} (${s.iterations} iterations)`).join(', ');
  const worst = details.worstResiduals
    .map((r) => `${r.kind} '${r.name}' (${r.residual.toExponential(2)} ${r.kind === 'node' ? 'A' : 'V'})`)
    .join(', ');
  const where = details.residualsWithinTolerance
    ? `every residual is within tolerance but the updates never settled; closest to their limit: ${worst}`
    : `largest residuals at ${worst}`;
  const devices = details.devices.length > 0 ? `; devices still moving: ${listNames(details.devices)}` : '';
  return new QuiescentError(
    { code: 'no-convergence', ...details },
    `the operating point could not be found after ${tried}; ${where}${devices}`,
  );
}

/** A ratio to a fundamental was asked where the output carries no signal. */
export function noSignal(output: string, frequencies: readonly number[], why: string): QuiescentError {
  const where =
    frequencies.length === 0
      ? ''
      : frequencies.length === 1
        ? ` at ${frequencies[0]} Hz`
        : ` at any of the ${frequencies.length} frequencies from ${Math.min(...frequencies)} Hz to ${Math.max(...frequencies)} Hz`;
  return new QuiescentError(
    { code: 'no-signal', output, frequencies },
    `the output ${output} carries no signal${where} (${why}), so no ratio to its fundamental exists`,
  );
}

/** A long run was stopped through its AbortSignal. */
export function cancelled(run: string, done: number, total: number): QuiescentError {
  return new QuiescentError(
    { code: 'cancelled', run },
    `the ${run} run was stopped through its AbortSignal after ${done} of ${total} samples`,
  );
}
