/** The independent current source, described once. */
import type { KindDescriptor } from '../descriptor.js';
import { sourceSpec } from '../voltage-source/descriptor.js';
import { CurrentSource } from './current-source.js';

/** The current-source kind. */
export const CURRENT_SOURCE: KindDescriptor<'current-source'> = {
  kind: 'current-source',
  noun: 'a current source',
  terminals: [
    { field: 'from', role: 'the node the source current is drawn from' },
    { field: 'to', role: 'the node the source current enters' },
  ],
  internalNodes: [],
  currentUnknown: false,
  controlField: null,
  dcPaths: () => [],
  voltageBranch: () => undefined,
  values: { dc: { unit: 'A', range: 'any' } },
  parameters: null,
  parameterField: null,
  json: { from: 'string', to: 'string', 'dc?': 'number', 'ac?': 'ac' },
  documentPaths: {},
  replay: (builder, name, f) => builder.currentSource(name, f.from as string, f.to as string, sourceSpec(f)),
  currentDirection: (r) => `${r.from} → ${r.to}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new CurrentSource(record),
};
