/** The capacitor, described once: terminals, DC paths, JSON fields, currents and its compiled device. */
import type { KindDescriptor } from '../descriptor.js';
import { Capacitor } from './capacitor.js';

/** The capacitor kind. */
export const CAPACITOR: KindDescriptor<'capacitor'> = {
  kind: 'capacitor',
  noun: 'a capacitor',
  terminals: [
    { field: 'a', role: 'first terminal (positive current flows from a to b)' },
    { field: 'b', role: 'second terminal' },
  ],
  internalNodes: [],
  currentUnknown: false,
  controlField: null,
  dcPaths: () => [],
  voltageBranch: () => undefined,
  values: { capacitance: { unit: 'F', range: 'non-negative' } },
  parameters: null,
  parameterField: null,
  json: { a: 'string', b: 'string', capacitance: 'number' },
  documentPaths: {},
  replay: (builder, name, f) =>
    builder.capacitor(name, f.a as string, f.b as string, f.capacitance as number),
  currentDirection: (r) => `${r.a} → ${r.b}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new Capacitor(record),
};
