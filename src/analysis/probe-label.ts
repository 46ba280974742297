/**
 * Names for probes that read as words in table headings, plot legends and assertion messages: a node
 * voltage is its node's name, a voltage between two nodes is `out − ref`, a current is
 * `current in Rload`, and a ratio of two probes is `collector ÷ input`.
 */

import { GROUND } from '../circuit/elements.js';
import { wrongArgument } from '../errors/messages.js';
import type { Probe } from './ac-analysis.js';

/**
 * The label of a probe: the node name for a node voltage to ground, `node − reference` for a
 * voltage between two nodes, `current in element` for an element current.
 *
 * @param probe - a node name, `{ node, reference }` or `{ element }`
 * @returns the label
 * @example
 * ```ts
 * probeLabel('collector');                           // 'collector'
 * probeLabel({ node: 'out', reference: 'midrail' }); // 'out − midrail'
 * probeLabel({ element: 'Rload' });                  // 'current in Rload'
 * ```
 */
export function probeLabel(probe: Probe): string {
  requireProbe(probe, 'probe');
  if (typeof probe === 'string') return probe;
  if ('element' in probe) return `current in ${probe.element}`;
  const reference = probe.reference ?? GROUND;
  return reference === GROUND ? probe.node : `${probe.node} − ${reference}`;
}

/**
 * The label of a ratio of two probes, `output ÷ input`, or the output's label alone without an input.
 *
 * @param output - the probe on top
 * @param input - the probe below, if any
 * @returns the label
 * @example
 * ```ts
 * ratioLabel('collector', 'input'); // 'collector ÷ input'
 * ```
 */
export function ratioLabel(output: Probe, input?: Probe): string {
  requireProbe(output, 'output');
  if (input !== undefined) requireProbe(input, 'input');
  return input === undefined ? probeLabel(output) : `${probeLabel(output)} ÷ ${probeLabel(input)}`;
}

/** Require a probe: a node name, `{ node, reference? }` or `{ element }`, named `argument` in the error. */
function requireProbe(probe: unknown, argument: string): void {
  if (typeof probe === 'string') return;
  if (probe === null || typeof probe !== 'object' || !('node' in probe || 'element' in probe)) {
    throw wrongArgument(argument, probe, 'a node name, { node, reference? } or { element }');
  }
}
