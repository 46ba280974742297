/**
 * The small-signal MNA matrix of a chain of capacitor-coupled common-emitter stages on one supply,
 * built from the hybrid-π model (base resistance rπ = β/gm, transconductance gm = Ic/Vt, output
 * resistance ro = V_A/Ic, Cπ = C_jE + τF·gm, Cμ; Ebers & Moll 1954, Giacoletto 1969; textbook
 * small-signal practice) and the usual divider bias estimate Ie = (Vth − 0.7)/(RE + Rth/(β + 1))
 * (common practice, no source). Every stage is coupled from the collector before it, biased by a
 * divider from the supply node, with a collector resistor to the supply and an emitter resistor
 * (bypassed by a capacitor, or not) to ground. The supply and the input are voltage sources, each
 * with its branch row (a zero diagonal); the supply is an AC short, so its node is tied to every
 * stage and its branch row holds a lone 1: the dense row that a wrong pivot drags into U.
 *
 * Unknowns: 0 supply node, 1 input node, 2 source node (after the signal resistor), then b, c, e of
 * each stage, then the branch currents of the supply and of the input.
 */
import { compressPattern } from '../../src/linalg/csc.js';
import type { CscPattern } from '../../src/linalg/types.js';

/** Component values of every stage of the chain. */
export interface StageChainValues {
  readonly stages: number;
  readonly couplingFarads: number;
  /** Emitter bypass capacitor; 0 for none. */
  readonly bypassFarads: number;
  readonly collectorOhms: number;
  readonly emitterOhms: number;
  readonly beta: number;
  readonly earlyVolts: number;
}

/** A chain's pattern and a function that writes its values at a frequency. */
export interface StageChain {
  readonly pattern: CscPattern;
  /** Write the admittance matrix at `hertz` into (Ax, Az), each of length nnz. */
  assemble(hertz: number, Ax: Float64Array, Az: Float64Array): void;
  readonly nnz: number;
}

const SUPPLY = 12;
const BIAS_TOP = 68e3;
const BIAS_BOTTOM = 12e3;
const SIGNAL_OHMS = 600;
const THERMAL_VOLTS = 0.02585;
const JUNCTION_FARADS = 8e-12;
const FEEDBACK_FARADS = 3e-12;
const TRANSIT_SECONDS = 4e-10;

/** Build the chain; values are fixed per stage, the frequency is chosen at assembly. */
export function stageChain(v: StageChainValues): StageChain {
  const n = 3 + 3 * v.stages + 2;
  const supplyBranch = n - 2;
  const inputBranch = n - 1;
  // Divider bias (Thevenin equivalent of the divider) and the small-signal parameters.
  const vth = (SUPPLY * BIAS_BOTTOM) / (BIAS_TOP + BIAS_BOTTOM);
  const rth = (BIAS_TOP * BIAS_BOTTOM) / (BIAS_TOP + BIAS_BOTTOM);
  const ie = (vth - 0.7) / (v.emitterOhms + rth / (v.beta + 1));
  const ic = (ie * v.beta) / (v.beta + 1);
  const gm = ic / THERMAL_VOLTS;
  const gpi = gm / v.beta;
  const go = ic / v.earlyVolts;
  const cpi = JUNCTION_FARADS + TRANSIT_SECONDS * gm;

  type Stamp = { i: number; j: number; g: number; c: number };
  const stamps: Stamp[] = [];
  const add = (i: number, j: number, g: number, c: number): void => {
    if (i >= 0 && j >= 0) stamps.push({ i, j, g, c });
  };
  const admittance = (a: number, b: number, g: number, c: number): void => {
    add(a, a, g, c);
    add(b, b, g, c);
    add(a, b, -g, -c);
    add(b, a, -g, -c);
  };
  const GND = -1;
  admittance(1, 2, 1 / SIGNAL_OHMS, 0);
  for (let k = 0; k < v.stages; k++) {
    const b = 3 + 3 * k;
    const c = b + 1;
    const e = b + 2;
    const from = k === 0 ? 2 : c - 3;
    admittance(from, b, 0, v.couplingFarads);
    admittance(0, b, 1 / BIAS_TOP, 0);
    admittance(b, GND, 1 / BIAS_BOTTOM, 0);
    admittance(0, c, 1 / v.collectorOhms, 0);
    admittance(e, GND, 1 / v.emitterOhms, v.bypassFarads);
    admittance(b, e, gpi, cpi);
    admittance(b, c, 0, FEEDBACK_FARADS);
    admittance(c, e, go, 0);
    // gm·v(b, e) flows from collector to emitter.
    add(c, b, gm, 0);
    add(c, e, -gm, 0);
    add(e, b, -gm, 0);
    add(e, e, gm, 0);
  }
  for (const [node, branch] of [
    [0, supplyBranch],
    [1, inputBranch],
  ] as const) {
    add(node, branch, 1, 0);
    add(branch, node, 1, 0);
  }
  const { pattern, slots } = compressPattern(
    n,
    stamps.map((s) => s.i),
    stamps.map((s) => s.j),
  );
  const nnz = pattern.Ap[n]!;
  return {
    pattern,
    nnz,
    assemble(hertz: number, Ax: Float64Array, Az: Float64Array): void {
      const omega = 2 * Math.PI * hertz;
      Ax.fill(0, 0, nnz);
      Az.fill(0, 0, nnz);
      stamps.forEach((s, t) => {
        Ax[slots[t]!]! += s.g;
        Az[slots[t]!]! += omega * s.c;
      });
    },
  };
}
