/** The voltage-controlled voltage source, described once. */
import type { KindDescriptor } from '../descriptor.js';
import { Vcvs } from './controlled-sources.js';

/** The vcvs kind: v(outPlus) − v(outMinus) = gain·(v(controlPlus) − v(controlMinus)). */
export const VCVS: KindDescriptor<'vcvs'> = {
  kind: 'vcvs',
  noun: 'a vcvs',
  terminals: [
    { field: 'outPlus', role: 'positive output' },
    { field: 'outMinus', role: 'negative output' },
    { field: 'controlPlus', role: 'positive control input' },
    { field: 'controlMinus', role: 'negative control input' },
  ],
  internalNodes: [],
  currentUnknown: true,
  controlField: null,
  dcPaths: (r) => [[r.outPlus, r.outMinus]],
  voltageBranch: (r) => [r.outPlus, r.outMinus],
  values: { gain: { unit: 'none', range: 'any' } },
  parameters: null,
  parameterField: null,
  json: {
    outPlus: 'string',
    outMinus: 'string',
    controlPlus: 'string',
    controlMinus: 'string',
    gain: 'number',
  },
  documentPaths: {
    'out[0]': ['outPlus'],
    'out[1]': ['outMinus'],
    'control[0]': ['controlPlus'],
    'control[1]': ['controlMinus'],
  },
  replay: (builder, name, f) =>
    builder.vcvs(
      name,
      [f.outPlus as string, f.outMinus as string],
      [f.controlPlus as string, f.controlMinus as string],
      f.gain as number,
    ),
  currentDirection: (r) => `${r.outPlus} → ${r.outMinus}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new Vcvs(record),
};
