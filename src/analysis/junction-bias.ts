/**
 * The forward sense of a junction probe: a pnp transistor and a p-channel MOSFET obey the equations of
 * their n-type twins in mirrored voltages (veb for vbe, vsg for vgs), so their probes read the other way.
 */
import type { ElementRecord } from '../circuit/elements.js';
import type { JunctionProbe } from '../devices/device.js';
import { descriptorOf } from '../devices/registry.js';

/** The DC voltage of `probe` at `x` in its forward sense (anode − cathode, vbe, veb, vgs, vsg …), in V. */
export function forwardBias(record: ElementRecord, probe: JunctionProbe, x: Float64Array): number {
  const mirrored = descriptorOf(record).mirrored(record);
  return (mirrored ? -1 : 1) * (x[probe.plus]! - x[probe.minus]!);
}
