/** The resistor, described once: terminals, DC paths, JSON fields, currents and its compiled device. */
import type { KindDescriptor } from '../descriptor.js';
import { Resistor } from './resistor.js';

/** The resistor kind. */
export const RESISTOR: KindDescriptor<'resistor'> = {
  kind: 'resistor',
  noun: 'a resistor',
  terminals: [
    { field: 'a', role: 'first terminal (positive current flows from a to b)' },
    { field: 'b', role: 'second terminal' },
  ],
  internalNodes: [],
  currentUnknown: false,
  controlField: null,
  dcPaths: (r) => [[r.a, r.b]],
  voltageBranch: () => undefined,
  values: { resistance: { unit: 'Ω', range: 'positive' } },
  parameters: null,
  parameterField: null,
  json: { a: 'string', b: 'string', resistance: 'number', 'noiseless?': 'boolean' },
  documentPaths: {},
  replay: (builder, name, f) =>
    f.noiseless === undefined
      ? builder.resistor(name, f.a as string, f.b as string, f.resistance as number)
      : builder.resistor(name, f.a as string, f.b as string, f.resistance as number, {
          noiseless: f.noiseless,
        }),
  currentDirection: (r) => `${r.a} → ${r.b}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new Resistor(record),
};
