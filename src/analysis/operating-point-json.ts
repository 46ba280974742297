/** The plain-data form of an operating point, for storage, other languages and snapshot tests. */

import { GROUND } from '../circuit/elements.js';
import { requireShape } from '../errors/arguments.js';
import { currentDirection, hasDeviceReport } from './element-currents.js';
import type { OperatingPoint } from './operating-point.js';

/** A device report as JSON: every number of the report, with `null` where the value is infinite. */
export type DeviceJson = Readonly<Record<string, string | number | null>>;

/**
 * An operating point as plain JSON. Values are in SI units (V, A, S, Ω, F, K). JSON has no
 * Infinity, so an infinite value (a bipolar transistor's `ro` without the Early effect) is `null`.
 */
export interface OperatingPointJson {
  /** The analysis temperature, in K. */
  readonly temperature: number;
  /** k·T/q at that temperature, in V. */
  readonly thermalVoltage: number;
  /** The strategy that found the solution. */
  readonly strategy: string;
  /** Newton iterations taken, over all strategies tried. */
  readonly iterations: number;
  /** Every node's voltage to ground, in V, ground left out, in the circuit's node order. */
  readonly nodes: Readonly<Record<string, number>>;
  /** The current of every element that has one, in A, by the sign conventions of docs/building-circuits.md. */
  readonly currents: Readonly<Record<string, number>>;
  /** The report of every diode and transistor, by name, with its `kind`. */
  readonly devices: Readonly<Record<string, DeviceJson>>;
}

/**
 * The plain-data form of an operating point: node voltages, element currents and device reports.
 * `JSON.stringify(op)` writes the same object, through `OperatingPoint.toJSON`.
 *
 * @param op - the operating point
 * @returns a new plain object
 * @example
 * ```ts
 * const data = operatingPointToJson(operatingPoint(circuit));
 * data.nodes['out'];        // V
 * data.devices['Q1']?.ic;   // A
 * ```
 */
export function operatingPointToJson(op: OperatingPoint): OperatingPointJson {
  requireShape(op, 'op', 'an OperatingPoint (the result of operatingPoint(circuit))', [
    'system',
    'x',
    'voltage',
  ]);
  const nodes: Record<string, number> = {};
  for (const node of op.nodes) if (node !== GROUND) nodes[node] = op.voltage(node);
  const currents: Record<string, number> = {};
  const devices: Record<string, DeviceJson> = {};
  for (const record of op.system.records) {
    if (currentDirection(record) !== undefined) currents[record.name] = op.current(record.name);
    if (hasDeviceReport(record)) {
      const device: Record<string, string | number | null> = {};
      for (const [key, value] of Object.entries(op.device(record.name))) {
        device[key] = typeof value === 'number' && !Number.isFinite(value) ? null : value;
      }
      devices[record.name] = device;
    }
  }
  return {
    temperature: op.temperature,
    thermalVoltage: op.thermalVoltage,
    strategy: op.strategy,
    iterations: op.iterations,
    nodes,
    currents,
    devices,
  };
}
