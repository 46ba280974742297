/**
 * Tolerances: which parameters vary, between which ends, with which distribution. A tolerance names
 * one element, every element of a kind, or the temperature; resolving it against the circuit's
 * records gives one varied parameter per element, each with its own draw stream, in a fixed order
 * (tolerances in the order given, elements of a kind in the circuit's order).
 */

import { parameterValue, parameterVariant } from '../analysis/element-parameters.js';
import type { ElementKind, ElementRecord } from '../circuit/elements.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import type { Draws } from './draws.js';
import { NORMAL_LIMIT } from './draws.js';

/** How a varied parameter is spread between its ends. */
export type Distribution = 'uniform' | 'normal';

/**
 * One tolerance. `relative` r about the nominal p: uniform draws p·(1 + r·u), u uniform on [−1, 1];
 * normal draws p·(1 + (r/3)·z), z standard normal truncated to [−3, 3]. `min`/`max`: uniform on
 * [min, max], or normal with mean (min + max)/2 and standard deviation (max − min)/6, truncated to
 * [min, max]. The default distribution is uniform. See docs/tolerances.md.
 */
export type Tolerance =
  | {
      /** The element's name, or `{ kind }` for every element of that kind, each varied independently. */
      readonly element:
        | string
        | {
            /** Every element of this kind (`'resistor'`, `'bjt'`, …). */
            readonly kind: ElementKind;
          };
      /** The parameter: `resistance`, `dc`, `forwardBeta`, … (the names of `PreparedCircuit.setValue`). */
      readonly parameter: string;
      /** The tolerance relative to the nominal value (0.01 for ±1 %). */
      readonly relative?: number;
      /** The lower end, in the parameter's SI unit (with `max`, instead of `relative`). */
      readonly min?: number;
      /** The upper end, in the parameter's SI unit. */
      readonly max?: number;
      /** `'uniform'` (default) or `'normal'`. */
      readonly distribution?: Distribution;
    }
  | {
      /** The analysis temperature. */
      readonly parameter: 'temperature';
      /** The lowest temperature, K. */
      readonly min: number;
      /** The highest temperature, K. */
      readonly max: number;
      /** `'uniform'` (default) or `'normal'`. */
      readonly distribution?: Distribution;
    };

/** A parameter a run varies, resolved against the circuit. */
export interface VariedParameter {
  /** `${element}.${parameter}`, or `'temperature'`. */
  readonly key: string;
  /** The element, or null for the temperature. */
  readonly element: string | null;
  readonly parameter: string;
  /** The value in the circuit as given (the analysis temperature for `'temperature'`). */
  readonly nominal: number;
  /** The relative tolerance r, or null for a tolerance given by its ends. */
  readonly relative: number | null;
  readonly distribution: Distribution;
  /** The two ends of the range, low ≤ high (a relative tolerance: p·(1 ∓ r)). */
  readonly low: number;
  readonly high: number;
}

const KINDS: ReadonlySet<string> = new Set([
  'resistor',
  'capacitor',
  'inductor',
  'voltage-source',
  'current-source',
  'vcvs',
  'vccs',
  'ccvs',
  'cccs',
  'op-amp',
  'diode',
  'bjt',
  'mosfet',
]);

/**
 * The varied parameters of `tolerances` for the circuit of `records` at nominal temperature
 * `temperature`, checked: elements exist, parameters exist, ends are finite and ordered.
 *
 * @throws QuiescentError `unknown-element`, `invalid-value`
 */
export function resolveTolerances(
  tolerances: unknown,
  records: readonly ElementRecord[],
  temperature: number,
): VariedParameter[] {
  if (!Array.isArray(tolerances)) {
    throw invalidValue(['options', 'tolerances'], tolerances, 'a list of tolerances');
  }
  const out: VariedParameter[] = [];
  const seen = new Set<string>();
  tolerances.forEach((given: unknown, index) => {
    const path = ['options', 'tolerances', index];
    if (given === null || typeof given !== 'object') throw invalidValue(path, given, 'a tolerance object');
    const t = given as Record<string, unknown>;
    const distribution = t.distribution ?? 'uniform';
    if (distribution !== 'uniform' && distribution !== 'normal') {
      throw invalidValue([...path, 'distribution'], distribution, "'uniform' or 'normal'");
    }
    const add = (element: string | null, parameter: string, nominal: number) => {
      const key = element === null ? 'temperature' : `${element}.${parameter}`;
      if (seen.has(key)) throw invalidValue(path, key, 'a parameter not varied by an earlier tolerance');
      seen.add(key);
      out.push(spread(key, element, parameter, nominal, t, distribution, path));
    };
    if (t.parameter === 'temperature' && t.element === undefined) {
      if (t.relative !== undefined) {
        throw invalidValue(
          [...path, 'relative'],
          t.relative,
          'absent: a temperature tolerance takes min and max',
        );
      }
      add(null, 'temperature', temperature);
      return;
    }
    if (typeof t.parameter !== 'string') {
      throw invalidValue([...path, 'parameter'], t.parameter, 'a parameter name');
    }
    const parameter = t.parameter;
    for (const record of selected(t.element, records, path)) {
      parameterVariant(record, parameter); // throws invalid-value naming the element's parameters
      add(record.name, parameter, parameterValue(record, parameter));
    }
  });
  return out;
}

/** The records a selector names: one element by name, or every element of a kind. */
function selected(
  selector: unknown,
  records: readonly ElementRecord[],
  path: readonly (string | number)[],
): ElementRecord[] {
  if (typeof selector === 'string') {
    const record = records.find((r) => r.name === selector);
    if (record === undefined) {
      throw unknownElement(selector, 'the circuit has no element of that name', [...path, 'element']);
    }
    return [record];
  }
  if (selector !== null && typeof selector === 'object' && 'kind' in selector) {
    const kind = (selector as { kind: unknown }).kind;
    if (typeof kind !== 'string' || !KINDS.has(kind)) {
      throw invalidValue([...path, 'element', 'kind'], kind, `an element kind (${[...KINDS].join(', ')})`);
    }
    const matching = records.filter((r) => r.kind === kind);
    if (matching.length === 0) {
      throw invalidValue([...path, 'element', 'kind'], kind, 'a kind the circuit has elements of');
    }
    return matching;
  }
  throw invalidValue([...path, 'element'], selector, "an element name or { kind: 'resistor' }");
}

function finite(value: unknown, path: readonly (string | number)[], expected: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw invalidValue(path, value, expected);
  return value;
}

function spread(
  key: string,
  element: string | null,
  parameter: string,
  nominal: number,
  t: Record<string, unknown>,
  distribution: Distribution,
  path: readonly (string | number)[],
): VariedParameter {
  const hasRange = t.min !== undefined || t.max !== undefined;
  if (t.relative !== undefined) {
    if (hasRange) throw invalidValue(path, key, 'either relative or min and max, not both');
    const r = finite(t.relative, [...path, 'relative'], 'a finite number of 0 or more');
    if (r < 0) throw invalidValue([...path, 'relative'], r, 'a finite number of 0 or more');
    if (!Number.isFinite(nominal)) {
      throw invalidValue(path, nominal, `a finite nominal value of '${key}' for a relative tolerance`);
    }
    return {
      key,
      element,
      parameter,
      nominal,
      relative: r,
      distribution,
      // For a negative nominal value p·(1 + r) is the lower end.
      low: Math.min(nominal * (1 - r), nominal * (1 + r)),
      high: Math.max(nominal * (1 - r), nominal * (1 + r)),
    };
  }
  if (!hasRange) throw invalidValue(path, key, 'a tolerance with relative, or with min and max');
  const min = finite(t.min, [...path, 'min'], 'a finite number');
  const max = finite(t.max, [...path, 'max'], 'a finite number');
  if (!(min <= max)) throw invalidValue([...path, 'max'], max, `a number of at least min (${min})`);
  return {
    key,
    element,
    parameter,
    nominal,
    relative: null,
    distribution,
    low: min,
    high: max,
  };
}

/**
 * The value of varied parameter `p` (draw stream `stream`) in sample `sample`, kept within [low, high]
 * (the formulas stay inside it but for the rounding of their last bit).
 */
export function drawValue(p: VariedParameter, draws: Draws, sample: number, stream: number): number {
  const r = p.relative;
  let v: number;
  if (p.distribution === 'uniform') {
    const u = draws.uniform(sample, stream);
    v = r === null ? p.low + (p.high - p.low) * u : p.nominal * (1 + r * (2 * u - 1));
  } else {
    const z = draws.normal(sample, stream);
    v =
      r === null
        ? (p.low + p.high) / 2 + ((p.high - p.low) / (2 * NORMAL_LIMIT)) * z
        : p.nominal * (1 + (r / NORMAL_LIMIT) * z);
  }
  return Math.min(p.high, Math.max(p.low, v));
}
