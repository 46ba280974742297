/** The voltage-controlled current source, described once. */
import type { KindDescriptor } from '../descriptor.js';
import { Vccs } from './controlled-sources.js';

/** The vccs kind: gm·(v(controlPlus) − v(controlMinus)) flows from outFrom through the source into outTo. */
export const VCCS: KindDescriptor<'vccs'> = {
  kind: 'vccs',
  noun: 'a vccs',
  terminals: [
    { field: 'outFrom', role: 'the output node the current is drawn from' },
    { field: 'outTo', role: 'the output node the current is delivered into' },
    { field: 'controlPlus', role: 'positive control input' },
    { field: 'controlMinus', role: 'negative control input' },
  ],
  internalNodes: [],
  currentUnknown: false,
  controlField: null,
  dcPaths: () => [],
  voltageBranch: () => undefined,
  values: { transconductance: { unit: 'S', range: 'any' } },
  parameters: null,
  parameterField: null,
  json: {
    outFrom: 'string',
    outTo: 'string',
    controlPlus: 'string',
    controlMinus: 'string',
    transconductance: 'number',
  },
  documentPaths: {
    'out[0]': ['outFrom'],
    'out[1]': ['outTo'],
    'control[0]': ['controlPlus'],
    'control[1]': ['controlMinus'],
  },
  replay: (builder, name, f) =>
    builder.vccs(
      name,
      [f.outFrom as string, f.outTo as string],
      [f.controlPlus as string, f.controlMinus as string],
      f.transconductance as number,
    ),
  currentDirection: (r) => `${r.outFrom} → ${r.outTo}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new Vccs(record),
};
