/**
 * Model parameters as data: each device kind lists its parameters with unit, default and range, and
 * one resolver turns what the user gave (numbers or SI strings) into checked numbers.
 */
import { invalidCircuit, invalidValue } from '../errors/messages.js';
import type { ValueRange } from '../errors/quiescent-error.js';
import { checkMagnitude } from '../values/magnitude.js';
import { readValue } from '../values/parse.js';
import type { Unit } from '../values/units.js';

/** The admissible range of a parameter (see `ValueRange`). */
export type ParameterRange = ValueRange;

/** What one model parameter is: its unit (`'none'` for a pure number), default and admissible range. */
export interface ParameterSpec {
  readonly unit: Unit | 'none';
  readonly defaultValue: number;
  readonly range: ParameterRange;
  /**
   * The function of the parameter a circuit's solution follows most nearly linearly, where that is
   * not the parameter itself: a current gain acts through the base current I_C/β, so through 1/β
   * (`'reciprocal'`); a saturation current moves a junction's voltage by n·Vt·ln of its ratio
   * (`'logarithm'`). A first-order prediction of the solution after a large change (a Monte Carlo
   * sample's start) extrapolates in it.
   */
  readonly solutionFollows?: 'reciprocal' | 'logarithm';
}

/** A table of parameter specifications, keyed by parameter name. */
export type ParameterTable<K extends string> = Readonly<Record<K, ParameterSpec>>;

/** Whether `value` lies in `range`. */
export function inRange(value: number, range: ParameterRange): boolean {
  switch (range) {
    case 'positive':
      return Number.isFinite(value) && value > 0;
    case 'non-negative':
      return Number.isFinite(value) && value >= 0;
    case 'positive-or-infinite':
      return value > 0;
    case 'at-least-one':
      return Number.isFinite(value) && value >= 1;
    case 'grading':
      return value > 0 && value < 1;
    case 'any':
      return Number.isFinite(value);
    case 'any-or-infinite':
      return !Number.isNaN(value);
    case 'above-one':
      return Number.isFinite(value) && value > 1;
  }
}

/**
 * Parse and check the parameters a user gave. Returns only the given ones, as numbers; unknown keys
 * are rejected with the path of the offending key. `skip` names keys handled elsewhere (polarity).
 */
export function parseParameters<K extends string>(
  table: ParameterTable<K>,
  given: unknown,
  path: readonly (string | number)[],
  kindName: string,
  skip: readonly string[] = [],
): Partial<Record<K, number>> {
  if (given === undefined) return {};
  if (given === null || typeof given !== 'object' || Array.isArray(given)) {
    throw invalidCircuit(path, { kind: 'not-an-object', what: 'model', of: article(kindName) });
  }
  const out: Partial<Record<K, number>> = {};
  for (const key of Object.keys(given)) {
    if (skip.includes(key)) continue;
    if (!Object.hasOwn(table, key)) {
      throw invalidCircuit([...path, key], {
        kind: 'unknown-key',
        what: 'parameter',
        of: article(kindName),
        known: Object.keys(table),
      });
    }
    const raw = (given as Record<string, unknown>)[key];
    if (raw === undefined) continue;
    out[key as K] = checkParameter(table[key as K], raw, [...path, key]);
  }
  return out;
}

/**
 * One parameter value as given (a number or an SI string), checked against its specification: the
 * number, or `invalid-value` at `path` (the parameter's own path).
 */
export function checkParameter(
  spec: ParameterSpec,
  raw: unknown,
  path: readonly (string | number)[],
): number {
  let value: number;
  if (
    typeof raw === 'number' &&
    ((spec.range === 'positive-or-infinite' && raw === Number.POSITIVE_INFINITY) ||
      (spec.range === 'any-or-infinite' && Math.abs(raw) === Number.POSITIVE_INFINITY))
  ) {
    value = raw;
  } else if (typeof raw === 'number' || typeof raw === 'string') {
    value = readValue(raw, spec.unit, path);
  } else {
    throw invalidValue(path, raw, { range: spec.range, unit: spec.unit });
  }
  if (!inRange(value, spec.range)) throw invalidValue(path, raw, { range: spec.range, unit: spec.unit });
  checkMagnitude(value, path, raw);
  return value;
}

/** Fill in defaults: every parameter of the table, the given value where there is one. */
export function withDefaults<K extends string>(
  table: ParameterTable<K>,
  given: Partial<Record<K, number>>,
): Record<K, number> {
  let listed = listedTables.get(table);
  if (listed === undefined) {
    const keys = Object.keys(table);
    listed = { keys, defaults: keys.map((key) => table[key as K].defaultValue) };
    listedTables.set(table, listed);
  }
  const { keys, defaults } = listed;
  const out = {} as Record<K, number>;
  for (let k = 0; k < keys.length; k++) {
    const key = keys[k] as K;
    const v = given[key];
    out[key] = v === undefined ? defaults[k]! : v;
  }
  return out;
}

/**
 * Turn `out`, the result of {@link withDefaults} for the parameters `before`, into the result for
 * `given`, touching only the keys either of them names: a value change on a compiled device (a Monte
 * Carlo sample) changes a parameter or two of a table of dozens.
 */
export function updateWithDefaults<K extends string>(
  table: ParameterTable<K>,
  out: Record<K, number>,
  before: Partial<Record<K, number>>,
  given: Partial<Record<K, number>>,
): void {
  for (const key in before) {
    if (given[key] === undefined && Object.hasOwn(table, key)) out[key] = table[key].defaultValue;
  }
  for (const key in given) {
    const v = given[key];
    if (v !== undefined && Object.hasOwn(table, key)) out[key] = v;
  }
}

/**
 * {@link withDefaults} once per table and model object: the devices built from one model (the
 * builder gives the elements made from one model object one frozen parsed model) share one table of
 * values instead of a table each. A device that takes other values copies it first
 * ({@link revaluedDefaults}).
 */
export function sharedDefaults<K extends string>(
  table: ParameterTable<K>,
  given: Partial<Record<K, number>>,
): Readonly<Record<K, number>> {
  let byModel = sharedTables.get(table);
  if (byModel === undefined) {
    byModel = new WeakMap();
    sharedTables.set(table, byModel);
  }
  let values = byModel.get(given);
  if (values === undefined) {
    values = Object.freeze(withDefaults(table, given));
    byModel.set(given, values);
  }
  return values as Readonly<Record<K, number>>;
}

const sharedTables = new WeakMap<ParameterTable<string>, WeakMap<object, Readonly<Record<string, number>>>>();

/**
 * The table of values for `given`, from `values`, the table for `before`: a shared table (frozen,
 * from {@link sharedDefaults}) is copied first and never changed; a device's own table (one this
 * returned before) is changed in place. The device owns the table returned.
 */
export function revaluedDefaults<K extends string>(
  table: ParameterTable<K>,
  values: Readonly<Record<K, number>>,
  before: Partial<Record<K, number>>,
  given: Partial<Record<K, number>>,
): Record<K, number> {
  const out = Object.isFrozen(values) ? { ...values } : (values as Record<K, number>);
  updateWithDefaults(table, out, before, given);
  return out;
}

/** Each table's keys and defaults, listed once: a value change re-reads a model often. */
const listedTables = new WeakMap<
  ParameterTable<string>,
  { readonly keys: readonly string[]; readonly defaults: readonly number[] }
>();

/** 'a diode', 'an op-amp': the indefinite article for a kind name in messages. */
function article(kindName: string): string {
  return /^[aeiou]/i.test(kindName) ? `an ${kindName}` : `a ${kindName}`;
}

/** Numeric parameters of a model, as given (the polarity is a field of the element, not a parameter). */
export type GivenParameters<M> = { readonly [K in Exclude<keyof M, 'polarity'>]?: number };
