/**
 * The English of every error, built from its details alone: a check says what it found as data,
 * and this module words it, so one rule reads one way everywhere and a path is printed once.
 */
import type { ErrorDetails, ResidualEntry, ValueRange } from './quiescent-error.js';

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

const RANGE_WORDS: Readonly<Record<ValueRange, string>> = {
  positive: 'a positive value',
  'non-negative': 'a value of 0 or more',
  'positive-or-infinite': 'a positive value (Infinity removes the effect)',
  'at-least-one': 'a value of 1 or more',
  grading: 'a value between 0 and 1 (exclusive)',
  any: 'a finite value',
};

/**
 * A shared range in words, without a unit.
 *
 * @param range - the range
 * @returns such as `'a positive value'`
 */
export function rangeWords(range: ValueRange): string {
  return RANGE_WORDS[range];
}

/** `R1.resistance: `, or with the element of a document path `elements[3].resistance ('R2'): `. */
const at = (path: readonly (string | number)[] | undefined, element?: string): string => {
  if (path === undefined || path.length === 0) return '';
  return `${formatPath(path)}${element === undefined ? '' : ` ('${element}')`}: `;
};

function show(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') return String(value);
  if (value === undefined) return 'undefined';
  if (value === null) return 'null';
  return typeof value;
}

/** ` in Ω`, or for a pure number ` (a pure number, written without a unit)`. */
function inUnit(unit: string | undefined): string {
  if (unit === undefined) return '';
  return unit === 'none' ? ' (a pure number, written without a unit)' : ` in ${unit}`;
}

function residual(r: ResidualEntry): string {
  return `${r.kind} '${r.name}' (${r.residual.toExponential(2)} ${r.kind === 'node' ? 'A' : 'V'})`;
}

/**
 * The message of an error, worded from its details.
 *
 * @param d - the details
 * @returns the message, led by the path where there is one
 */
export function describeError(d: ErrorDetails): string {
  switch (d.code) {
    case 'invalid-value':
      return `${at(d.path, d.element)}${show(d.value)} is not ${d.expected}${inUnit(d.unit)}${d.reason === undefined ? '' : ` (${d.reason})`}`;
    case 'duplicate-name':
      return `an element named '${d.name}' already exists; element names must be unique`;
    case 'invalid-circuit':
      return `${at(d.path, d.element)}${d.problem}`;
    case 'unknown-node':
      return `${at(d.path)}the circuit has no node named '${d.node}'`;
    case 'unknown-element':
      return `${at(d.path)}'${d.element}': ${d.reason}`;
    case 'no-ground':
      return "no element connects to ground (node 'gnd'); every circuit needs a reference node";
    case 'floating-node': {
      const n = d.nodes;
      const which = n.length === 1 ? `node ${listNames(n)} has` : `nodes ${listNames(n)} have`;
      return (
        `${which} no DC path to ground (capacitors, current sources and transistor gates carry no DC current); ` +
        'add a resistor to ground or connect them to the rest of the circuit'
      );
    }
    case 'singular': {
      const { elements, nodes } = d;
      if (d.reason === 'voltage-loop') {
        return (
          `${elements.length === 1 ? `element ${listNames(elements)} forms` : `elements ${listNames(elements)} form`} ` +
          'a loop of voltage sources, inductors or driven outputs ' +
          `through node${nodes.length === 1 ? '' : 's'} ${listNames(nodes)}, so ${elements.length === 1 ? 'its current is' : 'their currents are'} not determined`
        );
      }
      const parts: string[] = [];
      if (nodes.length > 0) parts.push(`node${nodes.length > 1 ? 's' : ''} ${listNames(nodes)}`);
      if (elements.length > 0) parts.push(`element${elements.length > 1 ? 's' : ''} ${listNames(elements)}`);
      const context = d.context === undefined ? '' : ` ${d.context}`;
      return `the circuit equations have no unique solution${context}; the trouble involves ${parts.join(' and ')}`;
    }
    case 'no-convergence': {
      const tried = d.strategies.map((s) => `${s.strategy} (${s.iterations} iterations)`).join(', ');
      const worst = d.worstResiduals.map(residual).join(', ');
      const devices = d.devices.length > 0 ? `; devices still moving: ${listNames(d.devices)}` : '';
      return `the operating point could not be found after ${tried}; largest residuals at ${worst || 'no node'}${devices}`;
    }
    case 'no-signal':
      return `the output ${d.output} carries no signal${d.frequency === undefined ? '' : ` at ${d.frequency} Hz`}, so a ratio or level of it is not defined`;
    case 'cancelled':
      return `cancelled after ${d.done} of ${d.total} steps`;
  }
}
