/**
 * Reading a {@link Probe} from any complex solution of the small-signal equations, not only from the
 * stored solutions of an AC analysis: the distortion estimate reads its output at 2f and 3f from
 * solutions whose only excitation is the injected nonlinear currents.
 */
import { GROUND } from '../circuit/elements.js';
import type { BiasPoint } from '../devices/device.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import type { CompiledSystem } from '../mna/system.js';
import type { Probe } from './ac-analysis.js';
import { nodeAt } from './operating-point.js';
import { probeLabel } from './probe-label.js';

/** Writes the probe's phasor for solution (xr, xi) at angular frequency ω into out[0], out[1]. */
export type ProbeReader = (xr: Float64Array, xi: Float64Array, omega: number, out: Float64Array) => void;

/**
 * A reader for `probe`, checked at once. `AcAnalysis.response` reads the stored solutions through
 * it too, so the two never disagree on what a probe means.
 *
 * @param system - the compiled circuit
 * @param at - the operating point the devices are linearized at, and its conditions
 * @param probe - a node name, `{ node, reference? }` or `{ element }`
 * @param harmonic - whether the solutions read carry no source excitation (the 2nd and 3rd harmonic):
 *   an independent current source then carries no current, whatever its AC value
 * @param option - the option name an unreadable probe is reported under (default `'output'`)
 * @throws QuiescentError `unknown-node`, `unknown-element`, `invalid-value`
 */
export function probeReader(
  system: CompiledSystem,
  at: BiasPoint,
  probe: Probe,
  harmonic: boolean,
  option = 'output',
): ProbeReader {
  if (typeof probe === 'string') return voltageReader(nodeAt(system, probe), system.n);
  if (probe !== null && typeof probe === 'object') {
    if ('element' in probe && typeof probe.element === 'string') {
      return currentReader(system, at, probe.element, harmonic);
    }
    if ('node' in probe && typeof probe.node === 'string') {
      return voltageReader(nodeAt(system, probe.node), nodeAt(system, probe.reference ?? GROUND));
    }
  }
  throw invalidValue([option], probe, 'a node name, { node, reference? } or { element }');
}

/** Reads v(a) − v(b), two unknown indices (the ground index n for ground). */
export function voltageReader(a: number, b: number): ProbeReader {
  return (xr, xi, _omega, out) => {
    out[0] = xr[a]! - xr[b]!;
    out[1] = xi[a]! - xi[b]!;
  };
}

/**
 * Reads the small-signal current of `element` by the sign conventions of `OperatingPoint.current`.
 *
 * @throws QuiescentError `unknown-element` for a missing element, one without a single current, or
 *   (with `harmonic`) a nonlinear one
 */
export function currentReader(
  system: CompiledSystem,
  at: BiasPoint,
  element: string,
  harmonic: boolean,
): ProbeReader {
  const device = system.deviceByName.get(element);
  if (device === undefined) throw unknownElement(element);
  const acCurrent = device.acCurrent?.bind(device);
  if (acCurrent === undefined) {
    throw unknownElement(
      element,
      'it has no single small-signal current; read its terminals through voltages',
    );
  }
  if (harmonic && device.nonlinear) {
    // At 2f and 3f a nonlinear element's current holds its own nonlinear current besides the
    // linear response, which acCurrent does not know of.
    throw unknownElement(
      element,
      'the harmonics of a nonlinear device current are not estimated; read a linear element in series with it',
    );
  }
  if (harmonic && device.record.kind === 'current-source') {
    return (_xr, _xi, _omega, out) => {
      out[0] = 0;
      out[1] = 0;
    };
  }
  return (xr, xi, omega, out) => acCurrent(xr, xi, omega, at, out);
}

/** A short text naming a probe, for reports and messages. */
export function describeProbe(probe: Probe): string {
  return probeLabel(probe);
}
