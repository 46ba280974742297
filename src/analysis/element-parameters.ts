/**
 * The numeric parameters of an element by name, read from its kind's descriptor: the number fields of
 * its record (a resistance, a gain, a source's DC value), a source's AC magnitude, and every model
 * parameter of its table. Turning a parameter value into the element's record with that value is what
 * parameter sweeps, value changes on a prepared circuit and sensitivities share, checked as the
 * builder checks it; a new kind's parameters come with its descriptor.
 */
import type { ElementRecord } from '../circuit/elements.js';
import type { ValueSpec } from '../devices/descriptor.js';
import { checkOpAmpOptions, FINITE_MODEL_OPTIONS, isIdealOpAmp } from '../devices/op-amp/op-amp-model.js';
import { checkParameter, inRange, type ParameterTable } from '../devices/parameters.js';
import { descriptorOf } from '../devices/registry.js';
import { invalidValue } from '../errors/messages.js';
import type { QuiescentError } from '../errors/quiescent-error.js';

/** The record's number fields, by the descriptor (own keys only). */
function valueSpecs(record: ElementRecord): Readonly<Record<string, ValueSpec>> {
  return descriptorOf(record).values as Readonly<Record<string, ValueSpec>>;
}

/** Whether `record` is an independent source, whose AC magnitude is a parameter too. */
function isSource(record: ElementRecord): record is Extract<ElementRecord, { ac: unknown }> {
  return record.kind === 'voltage-source' || record.kind === 'current-source';
}

/** The model table and the record field that holds it, or null. */
function modelOf(record: ElementRecord): { table: ParameterTable<string>; field: string } | null {
  const d = descriptorOf(record);
  return d.parameters === null || d.parameterField === null
    ? null
    : { table: d.parameters, field: d.parameterField };
}

/**
 * A function from a parameter value to the element's record with that value, checking the value as
 * the builder does. Throws `invalid-value` naming the element when it has no such parameter.
 */
export function parameterVariant(record: ElementRecord, parameter: string): (value: number) => ElementRecord {
  if (typeof parameter !== 'string')
    throw invalidValue(['options', 'parameter'], parameter, 'a parameter name');
  const path = [record.name, parameter];
  // Own properties only: 'toString', 'constructor' or '__proto__' must not find Object's members.
  const specs = valueSpecs(record);
  if (Object.hasOwn(specs, parameter)) {
    const spec = specs[parameter]!;
    return (value) => {
      if (!inRange(value, spec.range))
        throw invalidValue(path, value, { range: spec.range, unit: spec.unit });
      return { ...record, [parameter]: value || 0 } as ElementRecord;
    };
  }
  if (isSource(record) && parameter === 'ac') {
    return (value) => {
      if (!(Number.isFinite(value) && value >= 0)) {
        throw invalidValue(path, value, {
          range: 'non-negative',
          unit: record.kind === 'voltage-source' ? 'V' : 'A',
        });
      }
      return { ...record, ac: Object.freeze({ magnitude: value, phase: record.ac.phase }) } as ElementRecord;
    };
  }
  const model = modelOf(record);
  if (model === null || !Object.hasOwn(model.table, parameter)) {
    throw noSuchParameter(record, parameter, knownParameters(record));
  }
  const given = (record as unknown as Record<string, object | undefined>)[model.field];
  const spec = model.table[parameter]!;
  const modelPath = [record.name, model.field, parameter];
  return (value) => {
    // The check the builder makes of a given parameter, for this one parameter.
    const checked = checkParameter(spec, value, modelPath);
    let parameters = { ...given, [parameter]: checked } as Record<string, number>;
    // The op-amp's limits must leave room between them, a check across two parameters.
    if (record.kind === 'op-amp') parameters = checkOpAmpOptions(parameters, [record.name, model.field]);
    return { ...record, [model.field]: parameters } as ElementRecord;
  };
}

/** Every parameter name of `record`, for messages. */
function knownParameters(record: ElementRecord): string[] {
  const names = Object.keys(valueSpecs(record));
  if (isSource(record)) names.push('ac');
  const model = modelOf(record);
  if (model !== null) names.push(...Object.keys(model.table));
  return names;
}

/** `invalid-value` for a parameter the element does not have, listing those it has. */
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

/**
 * The function of a parameter of `record` its circuit's solution follows most nearly linearly (see
 * `ParameterSpec.solutionFollows`): `'linear'` for the parameter itself.
 */
export function solutionFollows(
  record: ElementRecord,
  parameter: string,
): 'linear' | 'reciprocal' | 'logarithm' {
  const model = modelOf(record);
  if (model === null || !Object.hasOwn(model.table, parameter)) return 'linear';
  return model.table[parameter]!.solutionFollows ?? 'linear';
}

/** The present value of a parameter of `record` (a model parameter's default when not given). */
export function parameterValue(record: ElementRecord, parameter: string): number {
  parameterVariant(record, parameter); // checks the name
  if (Object.hasOwn(valueSpecs(record), parameter))
    return (record as unknown as Record<string, number>)[parameter]!;
  if (isSource(record) && parameter === 'ac') return record.ac.magnitude;
  const model = modelOf(record)!;
  const given = (record as unknown as Record<string, Record<string, number> | undefined>)[model.field];
  return given?.[parameter] ?? model.table[parameter]!.defaultValue;
}

/**
 * The numeric parameters of `record` a sensitivity lists: its number fields, a source's `ac` when
 * `withAc`, every model parameter whether given or defaulted, except those whose value is infinite or
 * not given (an absent effect, the square law's missing slope factor). An ideal op-amp lists its
 * input errors and noise, not its finite-gain parameters: they would change its model, not move it.
 */
export function parametersOf(record: ElementRecord, withAc: boolean): string[] {
  const names = Object.keys(valueSpecs(record));
  if (withAc && isSource(record)) names.push('ac');
  const model = modelOf(record);
  if (model !== null) {
    const ideal = record.kind === 'op-amp' && isIdealOpAmp(record.options);
    for (const name of Object.keys(model.table)) {
      if (ideal && (FINITE_MODEL_OPTIONS as readonly string[]).includes(name)) continue;
      if (Number.isFinite(parameterValue(record, name))) names.push(name);
    }
  }
  return names;
}
