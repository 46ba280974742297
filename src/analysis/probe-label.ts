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
  const probeShape = (p: unknown, name: string) => {
    if (typeof p === 'string') return;
    if (p === null || typeof p !== 'object' || !('node' in p || 'element' in p)) {
      throw wrongArgument(name, p, 'a node name, { node, reference? } or { element }');
    }
  };
  probeShape(probe, 'probe');
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
  const probeShape = (p: unknown, name: string) => {
    if (typeof p === 'string') return;
    if (p === null || typeof p !== 'object' || !('node' in p || 'element' in p)) {
      throw wrongArgument(name, p, 'a node name, { node, reference? } or { element }');
    }
  };
  probeShape(output, 'output');
  if (input !== undefined) probeShape(input, 'input');
  return input === undefined ? probeLabel(output) : `${probeLabel(output)} ÷ ${probeLabel(input)}`;
}
