/** The inductor, described once: terminals, DC paths, JSON fields, currents and its compiled device. */
import type { KindDescriptor } from '../descriptor.js';
import { Inductor } from './inductor.js';

/** The inductor kind. */
export const INDUCTOR: KindDescriptor<'inductor'> = {
  kind: 'inductor',
  noun: 'an inductor',
  terminals: [
    { field: 'a', role: 'first terminal (positive current flows from a to b)' },
    { field: 'b', role: 'second terminal' },
  ],
  internalNodes: [],
  currentUnknown: true,
  controlField: null,
  dcPaths: (r) => [[r.a, r.b]],
  voltageBranch: (r) => [r.a, r.b],
  values: { inductance: { unit: 'H', range: 'non-negative' } },
  parameters: null,
  parameterField: null,
  json: { a: 'string', b: 'string', inductance: 'number' },
  documentPaths: {},
  replay: (builder, name, f) => builder.inductor(name, f.a as string, f.b as string, f.inductance as number),
  currentDirection: (r) => `${r.a} → ${r.b}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new Inductor(record),
};
