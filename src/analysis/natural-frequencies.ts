/**
 * Poles and zeros of the linearized circuit. The poles are the finite s where det(G + s·C) = 0: every
 * natural frequency of the circuit, seen from a port or not. The zeros of the transfer from an
 * independent source to an output are the finite s where that system, bordered by the source's column
 * and the output's row, is singular. Each root is listed as often as its multiplicity.
 *
 * Up to {@link DENSE_LIMIT} unknowns every root is found densely; `near` and `limit` ask for the
 * `limit` roots nearest j·2π·near at any size, by shift and invert on the sparse LU above it.
 */
import { invalidValue } from '../errors/messages.js';
import { QuiescentError } from '../errors/quiescent-error.js';
import type { Probe } from './ac-analysis.js';
import type { OperatingPoint } from './operating-point.js';
import { borderedPencil, circuitPencil, type Pencil } from './pencil.js';
import { denseRoots, type RootValue } from './pencil-roots-dense.js';
import { sparseRootsNear } from './pencil-roots-sparse.js';

/** The largest number of unknowns solved densely (every root); above it `near` and `limit` are required. */
export const DENSE_LIMIT = 1000;

/**
 * A pole or zero s, in the units of frequency: s/(2π) in Hz.
 *
 * - `frequency` = |s|/(2π);
 * - `dampingRatio` = −Re s/|s| (1 for a real root in the left half-plane, 0 on the imaginary axis,
 *   negative in the right half-plane);
 * - `q` = 1/(2·dampingRatio): 0.5 for a real root, Infinity on the imaginary axis, negative in the
 *   right half-plane. At s = 0, dampingRatio is 1 and q 0.5 (a real root).
 */
export interface Root {
  /** Re s/(2π), in Hz (negative in the left half-plane). */
  readonly real: number;
  /** Im s/(2π), in Hz. */
  readonly imaginary: number;
  /** |s|/(2π), in Hz. */
  readonly frequency: number;
  /** The quality factor 1/(2·dampingRatio). */
  readonly q: number;
  /** −Re s/|s|. */
  readonly dampingRatio: number;
}

/** Options of {@link poles}. */
export interface PolesOptions {
  /** How many roots (those nearest `near`); default every root. Required above the dense size. */
  readonly limit?: number;
  /** The frequency in Hz whose point j·2π·near of the s-plane the roots are nearest; default 0. Required above the dense size. */
  readonly near?: number;
}

/** Options of {@link zeros}. */
export interface ZerosOptions extends PolesOptions {
  /** Where the transfer's output is read (a node, a node pair or an element current). */
  readonly output: Probe;
  /** The independent voltage or current source that drives the transfer. */
  readonly input: string;
}

/** Relative tolerance within which two roots have the same frequency (and then the same real part). */
const SAME = 1e-9;

/** A root in Hz, from s in rad/s. */
export function rootOf(s: RootValue): Root {
  const magnitude = Math.hypot(s.re, s.im);
  const dampingRatio = magnitude === 0 ? 1 : -s.re / magnitude;
  return {
    real: s.re / (2 * Math.PI),
    imaginary: s.im / (2 * Math.PI),
    frequency: magnitude / (2 * Math.PI),
    q: dampingRatio === 0 ? Number.POSITIVE_INFINITY : 1 / (2 * dampingRatio),
    dampingRatio,
  };
}

/** By frequency; equal frequencies by decreasing real part; a conjugate pair with its positive imaginary part first. */
function compareRoots(a: Root, b: Root): number {
  const f = Math.max(a.frequency, b.frequency);
  if (Math.abs(a.frequency - b.frequency) > SAME * f) return a.frequency - b.frequency;
  if (Math.abs(a.real - b.real) > SAME * f) return b.real - a.real;
  return b.imaginary - a.imaginary;
}

function checkOptions(options: PolesOptions, pencil: Pencil): { limit: number | undefined; near: number } {
  const { limit, near } = options;
  if (limit !== undefined && !(Number.isInteger(limit) && limit > 0)) {
    throw invalidValue(['limit'], limit, 'a positive whole number of roots');
  }
  if (near !== undefined && !(typeof near === 'number' && Number.isFinite(near) && near >= 0)) {
    throw invalidValue(['near'], near, 'a frequency in Hz, finite and ≥ 0');
  }
  if (pencil.n > DENSE_LIMIT && (limit === undefined || near === undefined)) {
    throw invalidValue(
      [limit === undefined ? 'limit' : 'near'],
      limit === undefined ? limit : near,
      `given: the circuit has ${pencil.n} unknowns, above the ${DENSE_LIMIT} solved densely, so name how many roots (limit) near which frequency (near)`,
    );
  }
  return { limit, near: near ?? 0 };
}

/** The roots of a pencil, per the options, as sorted {@link Root}s. */
function rootsOf(pencil: Pencil, options: PolesOptions, singular: () => QuiescentError): Root[] {
  const { limit, near } = checkOptions(options, pencil);
  const omega0 = 2 * Math.PI * near;
  let values: RootValue[];
  if (pencil.n > DENSE_LIMIT) {
    values = sparseRootsNear(pencil, omega0, limit!, singular);
  } else {
    values = denseRoots(pencil, singular);
    if (limit !== undefined && limit < values.length) {
      const distance = (r: RootValue) => Math.hypot(r.re, Math.abs(r.im) - omega0);
      values.sort((a, b) => distance(a) - distance(b) || b.im - a.im);
      let count = limit;
      if (values[count - 1]!.im > 0) count++;
      values = values.slice(0, count);
    }
  }
  return values.map(rootOf).sort(compareRoots);
}

/**
 * The poles of the circuit linearized at `op`: every finite s with det(G + s·C) = 0, in Hz (s/(2π)),
 * with frequency, Q and damping ratio. Sorted by frequency; a conjugate pair adjacent, the positive
 * imaginary part first; each listed as often as its multiplicity.
 *
 * @param op - the operating point to linearize at
 * @param options - `limit` and `near`: the `limit` poles nearest j·2π·near (required above 1,000 unknowns)
 * @returns the poles (empty for a circuit without capacitance or inductance)
 * @throws QuiescentError `invalid-value` for bad options; `invalid-circuit` for a device whose
 *   small-signal model is not of the form G + jωC; `singular` when the equations are singular at
 *   every frequency
 *
 * @example
 * ```ts no-run
 * const p = poles(op);
 * p.filter((pole) => pole.real > 0); // right half-plane: the circuit is unstable
 * ```
 */
export function poles(op: OperatingPoint, options: PolesOptions = {}): Root[] {
  const pencil = circuitPencil(op);
  return rootsOf(
    pencil,
    options ?? {},
    () =>
      new QuiescentError(
        { code: 'singular', elements: [], nodes: [], reason: 'matrix' },
        'the small-signal equations are singular at every frequency, so the circuit has no defined poles',
      ),
  );
}

/**
 * The zeros of the transfer from the independent source `input` to `output`: every finite s where
 * the circuit's equations, bordered by the source's column and the output's row, are singular. A zero
 * at the origin is real = imaginary = 0; a zero cancelled by a pole is still listed. Other
 * independent sources are off.
 *
 * @param op - the operating point to linearize at
 * @param options - `output` (a {@link Probe}), `input` (a source's name), and `limit`/`near` as {@link poles}
 * @returns the zeros, sorted as the poles
 * @throws QuiescentError `invalid-value` for an input that is not an independent source, an
 *   unreadable output, or a transfer that is zero at every frequency
 */
export function zeros(op: OperatingPoint, options: ZerosOptions): Root[] {
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the output and the input');
  }
  const pencil = borderedPencil(op, options.output, options.input);
  return rootsOf(pencil, options, () =>
    invalidValue(
      ['output'],
      options.output,
      `a probe the source '${options.input}' reaches (the transfer is zero at every frequency)`,
    ),
  );
}
