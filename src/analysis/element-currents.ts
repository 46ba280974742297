/**
 * Which elements of an operating point have a current, and which way it is counted, for the report
 * tables and the JSON form.
 */
import type { ElementRecord } from '../circuit/elements.js';
import { descriptorOf } from '../devices/registry.js';
import { requireShape } from '../errors/arguments.js';

/**
 * The direction in which an element's current is counted, in words: `'a → b'` for a two-terminal
 * element, the output branch of a controlled source, `'out of n'` for an op-amp's output; undefined
 * for a transistor, which has no single current.
 *
 * @param record - the element
 * @returns the direction, or undefined
 */
export function currentDirection(record: ElementRecord): string | undefined {
  requireShape(record, 'record', 'an element record (circuit.element(name))', ['kind', 'name']);
  return descriptorOf(record).currentDirection(record);
}

/** Whether an element has a device report (a diode or a transistor). */
export function hasDeviceReport(record: ElementRecord): boolean {
  return descriptorOf(record).report !== null;
}
