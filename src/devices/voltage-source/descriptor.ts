/** The independent voltage source, described once. */
import type { KindDescriptor } from '../descriptor.js';
import { VoltageSource } from './voltage-source.js';

/** The voltage-source kind. */
export const VOLTAGE_SOURCE: KindDescriptor<'voltage-source'> = {
  kind: 'voltage-source',
  noun: 'a voltage source',
  terminals: [
    {
      field: 'plus',
      role: 'positive terminal (the source current flows from plus through the source to minus)',
    },
    { field: 'minus', role: 'negative terminal' },
  ],
  internalNodes: [],
  currentUnknown: true,
  controlField: null,
  dcPaths: (r) => [[r.plus, r.minus]],
  voltageBranch: (r) => [r.plus, r.minus],
  values: { dc: { unit: 'V', range: 'any' } },
  parameters: null,
  parameterField: null,
  json: { plus: 'string', minus: 'string', 'dc?': 'number', 'ac?': 'ac' },
  documentPaths: {},
  replay: (builder, name, f) =>
    builder.voltageSource(name, f.plus as string, f.minus as string, sourceSpec(f)),
  currentDirection: (r) => `${r.plus} → ${r.minus}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new VoltageSource(record),
};

/** The `{ dc?, ac? }` argument of a source's builder call, from its document fields. */
export function sourceSpec(f: Readonly<Record<string, unknown>>): object {
  const spec: Record<string, unknown> = {};
  if (f.dc !== undefined) spec.dc = f.dc;
  if (f.ac !== undefined) spec.ac = f.ac;
  return spec;
}
