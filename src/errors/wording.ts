/**
 * The English of every error, built from its details alone: a check says what it found as data,
 * and this module words it, so one rule reads one way everywhere and a path is printed once.
 */
import type { CircuitProblem, ErrorDetails, ResidualEntry, ValueRange } from './quiescent-error.js';

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
  'any-or-infinite': 'a number (±Infinity removes the limit)',
  'above-one': 'a finite value greater than 1',
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
      return `${at(d.path, d.element)}${problemWords(d.problem, d.path)}`;
    case 'unknown-node':
      return `${at(d.path)}the circuit has no node named '${d.node}'`;
    case 'unknown-element':
      return `${at(d.path)}'${d.element}': ${d.reason}`;
    case 'no-ground': {
      const like = d.groundLikeNodes ?? [];
      const hint =
        like.length > 0
          ? `; node ${listNames(like)} looks meant as ground: name it 'gnd' (or use the GROUND constant)`
          : '';
      return `no element connects to ground (node 'gnd'); every circuit needs a reference node${hint}`;
    }
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
      // Entries more than about 1e16 apart lose the smaller when added: the dependence may be rounding.
      const hint =
        d.valueRange !== undefined && d.valueRange > 1e15
          ? `; the matrix entries span ${d.valueRange.toExponential(0)}, beyond the 16 digits of double precision, ` +
            'so a conductance or gain that small beside one that large is lost when they are added: ' +
            'the dependence may come from the values, not the topology'
          : '';
      return `the circuit equations have no unique solution${context}; the trouble involves ${parts.join(' and ')}${hint}`;
    }
    case 'no-convergence': {
      const tried = d.strategies.map((s) => `${s.strategy} (${s.iterations} iterations)`).join(', ');
      const worst = d.worstResiduals.map(residual).join(', ');
      const where = d.residualsWithinTolerance
        ? `every residual is within tolerance but the updates never settled; closest to their limit: ${worst}`
        : `largest residuals at ${worst}`;
      const devices = d.devices.length > 0 ? `; devices still moving: ${listNames(d.devices)}` : '';
      return `the operating point could not be found after ${tried}; ${where}${devices}`;
    }
    case 'no-signal': {
      const f = d.frequencies ?? [];
      const where =
        f.length === 0
          ? ''
          : f.length === 1
            ? ` at ${f[0]} Hz`
            : ` at any of the ${f.length} frequencies from ${Math.min(...f)} Hz to ${Math.max(...f)} Hz`;
      const why = d.reason === undefined ? '' : ` (${d.reason})`;
      return `the output ${d.output} carries no signal${where}${why}, so no ratio to its fundamental exists`;
    }
    case 'cancelled':
      return d.run === undefined
        ? `cancelled after ${d.done} of ${d.total} steps`
        : `the ${d.run} run was stopped through its AbortSignal after ${d.done} of ${d.total} samples`;
  }
}

const quoted = (values: readonly string[]): string => values.map((v) => `'${v}'`).join(' or ');

/** A circuit problem in words; `path` gives the field a missing or misplaced field is named by. */
function problemWords(p: CircuitProblem, path: readonly (string | number)[]): string {
  const field = String(path[path.length - 1] ?? '');
  switch (p.kind) {
    case 'not-a-name':
      return p.what === 'controlling element'
        ? `must name the controlling element, not ${p.got}`
        : `${p.what === 'element' ? 'an element' : 'a node'} name must be a non-empty string, not ${p.got}`;
    case 'not-a-pair':
      return 'must be a pair of node names [plus, minus]';
    case 'not-an-object':
      switch (p.what) {
        case 'terminals':
          return `terminals must be an object with ${(p.keys ?? []).join(', ')}`;
        case 'model':
          return p.keys !== undefined
            ? `a model object with a polarity (${p.keys.join(' or ')}) is required`
            : `the model of ${p.of} must be an object of parameters`;
        case 'options':
          return `options must be an object { ${(p.keys ?? []).map((k) => `${k}?`).join(', ')} }`;
        case 'source':
          return 'a source takes an object { dc?, ac? }';
        case 'ac':
          return 'must be a magnitude or { magnitude, phase }';
        case 'document':
          return 'a circuit document must be a JSON object';
        case 'elements':
          return 'must be an array of elements';
        case 'element':
          return 'must be an object';
      }
      break;
    case 'unknown-key':
      switch (p.what) {
        case 'terminal':
          return `is not a terminal; the terminals are ${p.known.join(', ')}`;
        case 'parameter':
          return `is not a parameter of ${p.of}; the parameters are ${p.known.join(', ')}`;
        case 'option':
          return `is not an option; the options are ${p.known.join(', ')}`;
        case 'source setting':
          return 'is not a source setting; use dc and ac';
        case 'AC setting':
          return 'is not an AC setting; use magnitude and phase (degrees)';
        case 'field':
          return `is not a field of a ${p.of}`;
        case 'document field':
          return `is not a field of a circuit document (${p.known.join(', ')})`;
      }
      break;
    case 'not-one-of':
      switch (p.what) {
        case 'polarity':
          return `must be ${quoted(p.allowed)}, not ${p.got}`;
        case 'format':
          return `must be ${quoted(p.allowed)}`;
        case 'kind':
          return `${p.got} is not a kind of element (${p.allowed.join(', ')})`;
      }
      break;
    case 'missing':
      return `is missing (a ${p.of} needs ${field})`;
    case 'wrong-type':
      if (p.expected === 'boolean') return 'must be true or false';
      return `must be ${p.expected === 'ac' ? 'a number or { magnitude, phase }' : `a ${p.expected}`}`;
    case 'unsupported-version':
      return `version ${p.got} is not supported (this release reads ${p.supported})`;
    case 'polarity-in-model':
      return 'is not a model parameter; polarity is a field of the element';
    case 'other':
      return p.text;
  }
}

/**
 * Describes a given value for a message: strings quoted, numbers as written, otherwise its type.
 *
 * @param value - anything
 * @returns such as `'"NPN"'`, `'5'`, `'null'`, `'object'`
 */
export function describeGiven(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (value === null) return 'null';
  return typeof value;
}
