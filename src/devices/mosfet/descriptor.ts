/** The MOSFET, described once. */
import type { KindDescriptor } from '../descriptor.js';
import { Mosfet } from './mosfet.js';
import { MOSFET_PARAMETERS } from './mosfet-model.js';

/** The mosfet kind. */
export const MOSFET: KindDescriptor<'mosfet'> = {
  kind: 'mosfet',
  noun: 'a MOSFET',
  terminals: [
    { field: 'drain', role: 'drain' },
    { field: 'gate', role: 'gate' },
    { field: 'source', role: 'source' },
    { field: 'body', role: 'body (bulk); the source unless given' },
  ],
  internalNodes: [],
  currentUnknown: false,
  controlField: null,
  // The channel and the body tie carry a small conductance; the insulated gate carries none.
  dcPaths: (r) => [
    [r.drain, r.source],
    [r.body, r.source],
  ],
  voltageBranch: () => undefined,
  values: {},
  parameters: MOSFET_PARAMETERS,
  parameterField: 'model',
  json: {
    drain: 'string',
    gate: 'string',
    source: 'string',
    'body?': 'string',
    polarity: 'polarity',
    'model?': 'object',
  },
  documentPaths: {},
  replay: (builder, name, f) => {
    const terminals: Record<string, unknown> = { drain: f.drain, gate: f.gate, source: f.source };
    if (f.body !== undefined) terminals.body = f.body;
    builder.mosfet(
      name,
      terminals as never,
      { ...(f.model as object | undefined), polarity: f.polarity } as never,
    );
  },
  currentDirection: () => undefined,
  report: {
    title: 'MOSFETs',
    withRegion: true,
    columns: [
      { field: 'vgs', header: 'v_GS', unit: 'V' },
      { field: 'vds', header: 'v_DS', unit: 'V' },
      { field: 'id', header: 'i_D', unit: 'A' },
      { field: 'thresholdVoltage', header: 'V_th', unit: 'V' },
      { field: 'overdrive', header: 'V_ov', unit: 'V' },
      { field: 'gm', header: 'g_m', unit: 'S' },
      { field: 'gds', header: 'g_ds', unit: 'S' },
      { field: 'gmb', header: 'g_mb', unit: 'S' },
      { field: 'cgs', header: 'C_gs', unit: 'F' },
      { field: 'cgd', header: 'C_gd', unit: 'F' },
    ],
  },
  frequencyAffine: true,
  mirrored: (r) => r.polarity === 'pmos',
  create: (record) => new Mosfet(record),
};
