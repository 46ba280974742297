/**
 * The arithmetic shared by the distortion estimate, the linearity report's output figures and the
 * two-tone intermodulation: every device's nonlinear currents (Device.nonlinearCurrents) gathered once,
 * and the multilinear forms of their exact derivatives evaluated on phasors.
 *
 * A nonlinear current expands about the bias as
 *   i = Σ f_a·v_a + ½ Σ f_ab·v_a·v_b + ⅙ Σ f_abc·v_a·v_b·v_c + …
 * so every injected current of the method of nonlinear currents is a sum of the forms
 *   Q(X, Y) = Σ_ab f_ab·X_a·Y_b   and   K(X, Y, Z) = Σ_abc f_abc·X_a·Y_b·Z_c
 * on control phasors X, Y, Z (conjugated where a negative frequency takes part). The callers write the
 * coefficients beside each use, derived at the top of distortion.ts and intermodulation.ts.
 */
import type { ElementKind } from '../circuit/elements.js';
import type { JunctionProbe, NonlinearCurrent } from '../devices/device.js';
import { addCurrent } from '../devices/stamp.js';
import type { OperatingPoint } from './operating-point.js';

/** A device (or one junction of it) that has nonlinear currents: the unit whose share is reported. */
export interface NonlinearDevice {
  /** The element name. */
  readonly device: string;
  /** The element kind. */
  readonly kind: ElementKind;
  /** The junction of the device's first current (of its only one when grouped by junction). */
  readonly junction: JunctionProbe['junction'];
}

/** Every nonlinear current of a circuit at its operating point, each tagged with its device. */
export interface NonlinearCurrents {
  /** The devices, in circuit order. */
  readonly devices: readonly NonlinearDevice[];
  /** The currents, in circuit order. */
  readonly currents: readonly NonlinearCurrent[];
  /** The index in `devices` of each current's device. */
  readonly owner: Int32Array;
  /** The largest number of controls of any current. */
  readonly maxControls: number;
}

/**
 * Gather every device's nonlinear currents at the operating point (after preparing the devices),
 * grouped by device, or by device and junction when `byJunction`.
 */
export function gatherNonlinearCurrents(op: OperatingPoint, byJunction = false): NonlinearCurrents {
  const devices: NonlinearDevice[] = [];
  const currents: NonlinearCurrent[] = [];
  const owners: number[] = [];
  for (const device of op.system.devices) {
    const first = devices.length;
    for (const current of device.nonlinearCurrents?.(op.x, op.conditions) ?? []) {
      let group = first;
      while (group < devices.length && byJunction && devices[group]!.junction !== current.junction) group++;
      if (group === devices.length) {
        devices.push({ device: device.name, kind: device.record.kind, junction: current.junction });
      }
      currents.push(current);
      owners.push(group);
    }
  }
  const maxControls = currents.reduce((most, c) => Math.max(most, c.controls.length), 0);
  return { devices, currents, owner: Int32Array.from(owners), maxControls };
}

/** The control phasors of one current, read from a solution: X_a = x[plus] − x[minus], conjugated on request. */
export class ControlPhasors {
  readonly re: Float64Array;
  readonly im: Float64Array;

  constructor(size: number) {
    this.re = new Float64Array(size);
    this.im = new Float64Array(size);
  }

  /** Fill from solution (xr, xi); `conjugate` gives X̄_a. Returns this. */
  read(current: NonlinearCurrent, xr: Float64Array, xi: Float64Array, conjugate = false): this {
    const controls = current.controls;
    const sign = conjugate ? -1 : 1;
    for (let a = 0; a < controls.length; a++) {
      const { plus, minus } = controls[a]!;
      this.re[a] = xr[plus]! - xr[minus]!;
      this.im[a] = sign * (xi[plus]! - xi[minus]!);
    }
    return this;
  }
}

/** Q(X, Y) = Σ_ab f_ab·X_a·Y_b, written to out[0] (real), out[1] (imaginary). */
export function quadratic(
  current: NonlinearCurrent,
  x: ControlPhasors,
  y: ControlPhasors,
  out: Float64Array,
): void {
  const m = current.controls.length;
  const f2 = current.second;
  let re = 0;
  let im = 0;
  for (let a = 0; a < m; a++) {
    const xr = x.re[a]!;
    const xi = x.im[a]!;
    for (let b = 0; b < m; b++) {
      const f = f2[a * m + b]!;
      if (f === 0) continue;
      re += f * (xr * y.re[b]! - xi * y.im[b]!);
      im += f * (xr * y.im[b]! + xi * y.re[b]!);
    }
  }
  out[0] = re;
  out[1] = im;
}

/** K(X, Y, Z) = Σ_abc f_abc·X_a·Y_b·Z_c, written to out[0], out[1]. */
export function cubic(
  current: NonlinearCurrent,
  x: ControlPhasors,
  y: ControlPhasors,
  z: ControlPhasors,
  out: Float64Array,
): void {
  const m = current.controls.length;
  const f3 = current.third;
  let re = 0;
  let im = 0;
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) {
      const pr = x.re[a]! * y.re[b]! - x.im[a]! * y.im[b]!;
      const pi = x.re[a]! * y.im[b]! + x.im[a]! * y.re[b]!;
      for (let c = 0; c < m; c++) {
        const f = f3[(a * m + b) * m + c]!;
        if (f === 0) continue;
        re += f * (pr * z.re[c]! - pi * z.im[c]!);
        im += f * (pr * z.im[c]! + pi * z.re[c]!);
      }
    }
  }
  out[0] = re;
  out[1] = im;
}

/**
 * Write the injected currents (re[i], im[i] for current i) into an excitation of length n+1, zeroed
 * first: all of them (`device` < 0) or only those of one device.
 */
export function injectCurrents(
  set: NonlinearCurrents,
  currentRe: Float64Array,
  currentIm: Float64Array,
  device: number,
  re: Float64Array,
  im: Float64Array,
): void {
  re.fill(0);
  im.fill(0);
  const { currents, owner } = set;
  for (let i = 0; i < currents.length; i++) {
    if (device >= 0 && owner[i] !== device) continue;
    const { from, to } = currents[i]!;
    addCurrent(re, from, to, currentRe[i]!);
    addCurrent(im, from, to, currentIm[i]!);
  }
}
