/** The junction diode, described once. */
import type { KindDescriptor } from '../descriptor.js';
import { Diode } from './diode.js';
import { DIODE_PARAMETERS } from './diode-model.js';

/** The diode kind. */
export const DIODE: KindDescriptor<'diode'> = {
  kind: 'diode',
  noun: 'a diode',
  terminals: [
    { field: 'anode', role: 'anode' },
    { field: 'cathode', role: 'cathode' },
  ],
  // With a series resistance, the junction sits between the resistance and the cathode.
  internalNodes: ['junction'],
  currentUnknown: false,
  controlField: null,
  dcPaths: (r) => [[r.anode, r.cathode]],
  voltageBranch: () => undefined,
  values: {},
  parameters: DIODE_PARAMETERS,
  parameterField: 'model',
  json: { anode: 'string', cathode: 'string', 'model?': 'object' },
  documentPaths: {},
  replay: (builder, name, f) =>
    builder.diode(name, f.anode as string, f.cathode as string, (f.model ?? {}) as never),
  currentDirection: (r) => `${r.anode} → ${r.cathode}`,
  report: {
    title: 'Diodes',
    withRegion: false,
    columns: [
      { field: 'voltage', header: 'voltage', unit: 'V' },
      { field: 'current', header: 'current', unit: 'A' },
      { field: 'resistance', header: 'r_d', unit: 'Ω' },
      { field: 'capacitance', header: 'capacitance', unit: 'F' },
    ],
  },
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new Diode(record),
};
