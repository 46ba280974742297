/** The op-amp, described once: ideal without options, single-pole with them. */

import { GROUND } from '../../values/ground.js';
import type { KindDescriptor } from '../descriptor.js';
import { OpAmp } from './op-amp.js';
import { OP_AMP_PARAMETERS } from './op-amp-model.js';

/** The op-amp kind. Its output is driven with respect to ground; its inputs draw no current. */
export const OP_AMP: KindDescriptor<'op-amp'> = {
  kind: 'op-amp',
  noun: 'an op-amp',
  terminals: [
    { field: 'plus', role: 'non-inverting input' },
    { field: 'minus', role: 'inverting input' },
    { field: 'output', role: 'output' },
  ],
  internalNodes: [],
  currentUnknown: false,
  controlField: null,
  dcPaths: (r) => [[r.output, GROUND]],
  // With an output resistance the output is no longer an imposed voltage.
  voltageBranch: (r) => (r.options?.outputResistance ? undefined : [r.output, GROUND]),
  values: {},
  parameters: OP_AMP_PARAMETERS,
  parameterField: 'options',
  json: { plus: 'string', minus: 'string', output: 'string', 'options?': 'object' },
  documentPaths: {},
  replay: (builder, name, f) => {
    const terminals = { plus: f.plus, minus: f.minus, output: f.output } as never;
    if (f.options === undefined) builder.opAmp(name, terminals);
    else builder.opAmp(name, terminals, f.options as never);
  },
  currentDirection: (r) => `out of ${r.output}`,
  report: null,
  // A finite gain-bandwidth makes the gain depend on ω.
  frequencyAffine: false,
  mirrored: () => false,
  create: (record) => new OpAmp(record),
};
