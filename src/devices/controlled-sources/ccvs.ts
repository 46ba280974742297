/** The current-controlled voltage source, described once. */
import type { KindDescriptor } from '../descriptor.js';
import { Ccvs } from './controlled-sources.js';

/** The ccvs kind: v(outPlus) − v(outMinus) = transresistance · (current of the controlling element). */
export const CCVS: KindDescriptor<'ccvs'> = {
  kind: 'ccvs',
  noun: 'a ccvs',
  terminals: [
    { field: 'outPlus', role: 'positive output' },
    { field: 'outMinus', role: 'negative output' },
  ],
  internalNodes: [],
  currentUnknown: true,
  controlField: 'control',
  dcPaths: (r) => [[r.outPlus, r.outMinus]],
  voltageBranch: (r) => [r.outPlus, r.outMinus],
  values: { transresistance: { unit: 'Ω', range: 'any' } },
  parameters: null,
  parameterField: null,
  json: { outPlus: 'string', outMinus: 'string', control: 'string', transresistance: 'number' },
  documentPaths: { 'out[0]': ['outPlus'], 'out[1]': ['outMinus'] },
  replay: (builder, name, f) =>
    builder.ccvs(
      name,
      [f.outPlus as string, f.outMinus as string],
      f.control as string,
      f.transresistance as number,
    ),
  currentDirection: (r) => `${r.outPlus} → ${r.outMinus}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new Ccvs(record),
};
