/**
 * The numeric parameters of an element by name: the scalar value of a passive element or controlled
 * source, the DC and AC values of an independent source, and every model parameter of a diode,
 * transistor or op-amp. Turning a parameter value into the element's record with that value is what
 * parameter sweeps and value changes on a prepared circuit share, checked as the builder checks it.
 */
import type { ElementRecord } from '../circuit/elements.js';
import { BJT_PARAMETERS } from '../devices/bjt/bjt-model.js';
import { DIODE_PARAMETERS } from '../devices/diode/diode-model.js';
import { MOSFET_PARAMETERS } from '../devices/mosfet/mosfet-model.js';
import {
  checkOpAmpOptions,
  FINITE_MODEL_OPTIONS,
  isIdealOpAmp,
  OP_AMP_PARAMETERS,
} from '../devices/op-amp/op-amp-model.js';
import { type ParameterTable, parseParameters } from '../devices/parameters.js';
import { invalidValue } from '../errors/messages.js';
import type { QuiescentError } from '../errors/quiescent-error.js';

/** The element's scalar parameters (outside a model), with the range the builder enforces. */
const SCALAR_PARAMETERS: Readonly<
  Record<string, Readonly<Record<string, 'positive' | 'non-negative' | 'any'>>>
> = {
  resistor: { resistance: 'positive' },
  capacitor: { capacitance: 'non-negative' },
  inductor: { inductance: 'non-negative' },
  vcvs: { gain: 'any' },
  vccs: { transconductance: 'any' },
  ccvs: { transresistance: 'any' },
  cccs: { gain: 'any' },
};

const RANGE_WORDS = {
  positive: 'a finite number greater than 0',
  'non-negative': 'a finite number of 0 or more',
  any: 'a finite number',
} as const;

/**
 * A function from a parameter value to the element's record with that value, checking the value as
 * the builder does. Throws `invalid-value` naming the element when it has no such parameter.
 */
export function parameterVariant(record: ElementRecord, parameter: string): (value: number) => ElementRecord {
  if (typeof parameter !== 'string')
    throw invalidValue(['options', 'parameter'], parameter, 'a parameter name');
  // Own properties only: 'toString', 'constructor' or '__proto__' must not find Object's members.
  const scalars = Object.hasOwn(SCALAR_PARAMETERS, record.kind) ? SCALAR_PARAMETERS[record.kind] : undefined;
  const path = [record.name, parameter];
  if (scalars !== undefined) {
    const range = Object.hasOwn(scalars, parameter) ? scalars[parameter] : undefined;
    if (range === undefined) throw noSuchParameter(record, parameter, Object.keys(scalars));
    return (value) => {
      const ok = range === 'positive' ? value > 0 : range === 'non-negative' ? value >= 0 : true;
      if (!ok) throw invalidValue(path, value, RANGE_WORDS[range]);
      return { ...record, [parameter]: value || 0 } as ElementRecord;
    };
  }
  const modelOf = (table: ParameterTable<string>, kindName: string, given: object | undefined) => {
    if (!Object.hasOwn(table, parameter)) throw noSuchParameter(record, parameter, Object.keys(table));
    return (value: number) => {
      const parsed = parseParameters(table, { [parameter]: value }, [record.name, 'model'], kindName);
      return { ...given, ...parsed };
    };
  };
  switch (record.kind) {
    case 'diode': {
      const model = modelOf(DIODE_PARAMETERS, 'diode', record.model);
      return (value) => ({ ...record, model: model(value) });
    }
    case 'bjt': {
      const model = modelOf(BJT_PARAMETERS, 'bipolar transistor', record.model);
      return (value) => ({ ...record, model: model(value) });
    }
    case 'mosfet': {
      const model = modelOf(MOSFET_PARAMETERS, 'MOSFET', record.model);
      return (value) => ({ ...record, model: model(value) });
    }
    case 'op-amp': {
      const model = modelOf(OP_AMP_PARAMETERS, 'op-amp', record.options);
      return (value) => ({ ...record, options: checkOpAmpOptions(model(value), [record.name, 'options']) });
    }
    case 'voltage-source':
    case 'current-source': {
      if (parameter === 'dc') return (value) => ({ ...record, dc: value || 0 });
      if (parameter === 'ac') {
        return (value) => {
          if (!(value >= 0)) throw invalidValue(path, value, RANGE_WORDS['non-negative']);
          return { ...record, ac: Object.freeze({ magnitude: value, phase: record.ac.phase }) };
        };
      }
      throw noSuchParameter(record, parameter, ['dc', 'ac']);
    }
    default:
      throw noSuchParameter(record, parameter, []);
  }
}

export function noSuchParameter(
  record: ElementRecord,
  parameter: string,
  known: readonly string[],
): QuiescentError {
  return invalidValue(
    ['options', 'parameter'],
    parameter,
    `a parameter of ${record.kind} '${record.name}' (${known.join(', ')})`,
  );
}

/** The present value of a parameter of `record` (a model parameter's default when not given). */
export function parameterValue(record: ElementRecord, parameter: string): number {
  parameterVariant(record, parameter); // checks the name
  switch (record.kind) {
    case 'voltage-source':
    case 'current-source':
      return parameter === 'dc' ? record.dc : record.ac.magnitude;
    case 'diode':
      return (
        record.model[parameter as keyof typeof record.model] ??
        DIODE_PARAMETERS[parameter as keyof typeof DIODE_PARAMETERS].defaultValue
      );
    case 'bjt':
      return (
        record.model[parameter as keyof typeof record.model] ??
        BJT_PARAMETERS[parameter as keyof typeof BJT_PARAMETERS].defaultValue
      );
    case 'mosfet':
      return (
        record.model[parameter as keyof typeof record.model] ??
        MOSFET_PARAMETERS[parameter as keyof typeof MOSFET_PARAMETERS].defaultValue
      );
    case 'op-amp':
      return (
        record.options?.[parameter as keyof NonNullable<typeof record.options>] ??
        OP_AMP_PARAMETERS[parameter as keyof typeof OP_AMP_PARAMETERS].defaultValue
      );
    default:
      return (record as unknown as Record<string, number>)[parameter]!;
  }
}

/**
 * The numeric parameters of `record` a sensitivity lists: its scalar value, a source's `dc` (and `ac`
 * when `withAc`), every model parameter of a diode, transistor or finite-gain op-amp whether given or
 * defaulted, except those whose value is infinite or not given (an absent effect, the square law's
 * missing slope factor). An ideal op-amp lists its input errors and noise, not its finite-gain
 * parameters: they would change its model, not move it.
 */
export function parametersOf(record: ElementRecord, withAc: boolean): string[] {
  const scalars = SCALAR_PARAMETERS[record.kind];
  if (scalars !== undefined) return Object.keys(scalars);
  let names: string[];
  switch (record.kind) {
    case 'voltage-source':
    case 'current-source':
      return withAc ? ['dc', 'ac'] : ['dc'];
    case 'diode':
      names = Object.keys(DIODE_PARAMETERS);
      break;
    case 'bjt':
      names = Object.keys(BJT_PARAMETERS);
      break;
    case 'mosfet':
      names = Object.keys(MOSFET_PARAMETERS);
      break;
    case 'op-amp':
      // An ideal op-amp's finite-gain parameters would change its model, not move it.
      names = Object.keys(OP_AMP_PARAMETERS).filter(
        (name) =>
          !isIdealOpAmp(record.options) || !(FINITE_MODEL_OPTIONS as readonly string[]).includes(name),
      );
      break;
    default:
      return [];
  }
  return names.filter((name) => Number.isFinite(parameterValue(record, name)));
}
