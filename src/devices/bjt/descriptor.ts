/** The bipolar transistor, described once. */
import type { KindDescriptor } from '../descriptor.js';
import { Bjt } from './bjt.js';
import { BJT_PARAMETERS } from './bjt-model.js';

/** The bjt kind. */
export const BJT: KindDescriptor<'bjt'> = {
  kind: 'bjt',
  noun: 'a bipolar transistor',
  terminals: [
    { field: 'collector', role: 'collector' },
    { field: 'base', role: 'base' },
    { field: 'emitter', role: 'emitter' },
  ],
  internalNodes: [],
  currentUnknown: false,
  controlField: null,
  // Both junctions conduct at DC.
  dcPaths: (r) => [
    [r.base, r.emitter],
    [r.base, r.collector],
  ],
  voltageBranch: () => undefined,
  values: {},
  parameters: BJT_PARAMETERS,
  parameterField: 'model',
  json: { collector: 'string', base: 'string', emitter: 'string', polarity: 'polarity', 'model?': 'object' },
  documentPaths: {},
  replay: (builder, name, f) =>
    builder.bjt(
      name,
      { collector: f.collector, base: f.base, emitter: f.emitter } as never,
      { ...(f.model as object | undefined), polarity: f.polarity } as never,
    ),
  currentDirection: () => undefined,
  report: {
    title: 'Bipolar transistors',
    withRegion: true,
    columns: [
      { field: 'vbe', header: 'v_BE', unit: 'V' },
      { field: 'vce', header: 'v_CE', unit: 'V' },
      { field: 'ic', header: 'i_C', unit: 'A' },
      { field: 'ib', header: 'i_B', unit: 'A' },
      { field: 'gm', header: 'g_m', unit: 'S' },
      { field: 'rpi', header: 'r_π', unit: 'Ω' },
      { field: 'ro', header: 'r_o', unit: 'Ω' },
      { field: 'cpi', header: 'C_π', unit: 'F' },
      { field: 'cmu', header: 'C_μ', unit: 'F' },
    ],
  },
  frequencyAffine: true,
  mirrored: (r) => r.polarity === 'pnp',
  create: (record) => new Bjt(record),
};
