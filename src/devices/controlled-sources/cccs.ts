/** The current-controlled current source, described once. */
import type { KindDescriptor } from '../descriptor.js';
import { Cccs } from './controlled-sources.js';

/** The cccs kind: gain · (current of the controlling element) flows from outFrom through the source into outTo. */
export const CCCS: KindDescriptor<'cccs'> = {
  kind: 'cccs',
  noun: 'a cccs',
  terminals: [
    { field: 'outFrom', role: 'the output node the current is drawn from' },
    { field: 'outTo', role: 'the output node the current is delivered into' },
  ],
  internalNodes: [],
  currentUnknown: false,
  controlField: 'control',
  dcPaths: () => [],
  voltageBranch: () => undefined,
  values: { gain: { unit: 'none', range: 'any' } },
  parameters: null,
  parameterField: null,
  json: { outFrom: 'string', outTo: 'string', control: 'string', gain: 'number' },
  documentPaths: { 'out[0]': ['outFrom'], 'out[1]': ['outTo'] },
  replay: (builder, name, f) =>
    builder.cccs(name, [f.outFrom as string, f.outTo as string], f.control as string, f.gain as number),
  currentDirection: (r) => `${r.outFrom} → ${r.outTo}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new Cccs(record),
};
