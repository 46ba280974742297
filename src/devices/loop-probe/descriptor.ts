/** The loop probe, described once: a 0 V element in series with a feedback loop. */
import type { KindDescriptor } from '../descriptor.js';
import { LoopProbe } from './loop-probe.js';

/** The loop-probe kind: a short at DC and in AC whose current is an unknown. */
export const LOOP_PROBE: KindDescriptor<'loop-probe'> = {
  kind: 'loop-probe',
  noun: 'a loop probe',
  terminals: [
    {
      field: 'from',
      role: 'the side that drives the loop (an amplifier output); the current flows from here',
    },
    { field: 'to', role: 'the side the loop feeds' },
  ],
  internalNodes: [],
  currentUnknown: true,
  controlField: null,
  dcPaths: (r) => [[r.from, r.to]],
  voltageBranch: (r) => [r.from, r.to],
  values: {},
  parameters: null,
  parameterField: null,
  json: { from: 'string', to: 'string' },
  documentPaths: {},
  replay: (builder, name, f) => builder.loopProbe(name, f.from as string, f.to as string),
  currentDirection: (r) => `${r.from} → ${r.to}`,
  report: null,
  frequencyAffine: true,
  mirrored: () => false,
  create: (record) => new LoopProbe(record),
};
