/**
 * Cautions about a solved operating point: answers that satisfy the equations but that a careful
 * engineer would question. Each is data (a code, the element or node, the figure that triggered it)
 * plus a sentence. The thresholds are documented in docs/cautions.md.
 */
import { type ElementRecord, GROUND, terminalsOf } from '../circuit/elements.js';
import type { Conditions } from '../devices/device.js';
import { EXP_LIMIT } from '../devices/junction.js';
import { isIdealOpAmp, OP_AMP_PARAMETERS } from '../devices/op-amp/op-amp-model.js';
import { withDefaults } from '../devices/parameters.js';
import type { CompiledSystem } from '../mna/system.js';
import { forwardBias } from './junction-bias.js';
import { loadJacobianAt, NewtonWorkspace, prepareWorkspace } from './newton.js';

/** What a caution is about. */
export type CautionCode =
  | 'junction-beyond-exponential'
  | 'reverse-beyond-breakdown'
  | 'single-connection'
  | 'positive-feedback'
  | 'amplifier-inputs-apart'
  | 'amplifier-limited';

/** One caution about an operating point: data for programs, a sentence for people. */
export interface Caution {
  /** What the caution is about. */
  readonly code: CautionCode;
  /** The element concerned, when there is one. */
  readonly element?: string;
  /** The node concerned, when there is one. */
  readonly node?: string;
  /**
   * The figure that triggered the caution: the junction's v/(n·Vt) for `junction-beyond-exponential`,
   * its reverse voltage in V for `reverse-beyond-breakdown`, the fraction of the output fed back to the
   * inputs for `positive-feedback`, the input difference in V for `amplifier-inputs-apart`, the output
   * voltage in V for `amplifier-limited`.
   */
  readonly value?: number;
  /** The caution in words. */
  readonly message: string;
}

/**
 * A reverse bias no single junction survives, in V. The highest-voltage single silicon and silicon
 * carbide junctions made block some kilovolts to about 10–20 kV (high-voltage rectifier stacks reach
 * more by putting many junctions in series, each below its own limit); 10 kV across one junction
 * of a model without breakdown almost always means a current forced backwards into it.
 */
export const REVERSE_BREAKDOWN_LIMIT = 10e3;

/**
 * Input difference of a finite-gain op-amp above which it is taken to be saturated or without
 * working feedback, in V: with feedback, an amplifier of useful gain holds its inputs within
 * millivolts.
 */
export const AMPLIFIER_INPUT_LIMIT = 10e-3;

/** Every caution about the solution x of `system` at `conditions`. */
export function cautionsOf(system: CompiledSystem, x: Float64Array, conditions: Conditions): Caution[] {
  const out: Caution[] = [];
  junctionCautions(system, x, conditions, out);
  connectionCautions(system.records, out);
  amplifierCautions(system, x, conditions, out);
  return out;
}

function junctionCautions(system: CompiledSystem, x: Float64Array, conditions: Conditions, out: Caution[]) {
  for (const device of system.devices) {
    for (const probe of device.junctions?.(x, conditions) ?? []) {
      if (probe.junction === 'channel') continue;
      // Channels were skipped above, so of the mirrored devices only a pnp reaches here.
      const bias = forwardBias(device.record, probe, x);
      const exponent = bias / probe.scale;
      if (exponent > EXP_LIMIT) {
        out.push({
          code: 'junction-beyond-exponential',
          element: device.name,
          value: exponent,
          message:
            `${probe.junction} junction of '${device.name}' at ${exponent.toFixed(0)}·n·Vt, beyond the ` +
            `exponential's limit of ${EXP_LIMIT}·n·Vt: its current follows the linear continuation, not the Shockley law`,
        });
      } else if (-bias > REVERSE_BREAKDOWN_LIMIT) {
        out.push({
          code: 'reverse-beyond-breakdown',
          element: device.name,
          value: -bias,
          message:
            `${probe.junction} junction of '${device.name}' is reverse-biased by ${(-bias).toPrecision(3)} V, beyond ` +
            `any physical breakdown (${REVERSE_BREAKDOWN_LIMIT} V): the model has no breakdown, so a current forced ` +
            'backwards into it shows up as this voltage; a real part would break down or be destroyed',
        });
      }
    }
  }
}

/** Nodes that only one element terminal touches: usually a misspelt node name. */
function connectionCautions(records: readonly ElementRecord[], out: Caution[]) {
  const count = new Map<string, number>();
  for (const record of records) {
    for (const [, node] of terminalsOf(record)) {
      if (node !== GROUND) count.set(node, (count.get(node) ?? 0) + 1);
    }
  }
  const names = [...count.keys()];
  for (const [node, n] of count) {
    if (n !== 1) continue;
    const owner = records.find((r) => terminalsOf(r).some(([, t]) => t === node))!;
    const near = names.filter((other) => other !== node && closeNames(node, other));
    const hint = near.length > 0 ? `; did you mean '${near[0]}'?` : '';
    out.push({
      code: 'single-connection',
      node,
      element: owner.name,
      message: `node '${node}' has a single connection (to '${owner.name}'), so nothing flows through it${hint}`,
    });
  }
}

/** Whether two names differ by at most one insertion, deletion, substitution or swap of neighbours. */
function closeNames(a: string, b: string): boolean {
  if (Math.abs(a.length - b.length) > 1) return false;
  const la = a.length;
  const lb = b.length;
  // Optimal string alignment distance with rows of length lb + 1.
  let before = new Array<number>(lb + 1).fill(0);
  let previous = Array.from({ length: lb + 1 }, (_, j) => j);
  for (let i = 1; i <= la; i++) {
    const row = new Array<number>(lb + 1).fill(0);
    row[0] = i;
    for (let j = 1; j <= lb; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let d = Math.min(previous[j]! + 1, row[j - 1]! + 1, previous[j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1])
        d = Math.min(d, before[j - 2]! + 1);
      row[j] = d;
    }
    before = previous;
    previous = row;
  }
  return previous[lb]! <= 1;
}

/**
 * Op-amps in positive feedback at DC, and finite-gain op-amps whose inputs are far apart. The DC
 * feedback of an op-amp is f = ∂(v₊ − v₋)/∂v_out with its own equation replaced by a forced output
 * voltage. With w = J⁻¹·e_r (r the op-amp's row of the Jacobian J at the solution) the Sherman–Morrison
 * formula gives f = (w₊ − w₋)/w_out, since J_r·w = 1: one solve per op-amp on one factorization.
 * f > 0 means a rise of the output raises its own input difference: the balance found is one a real
 * amplifier runs away from, to an output limit.
 */
function amplifierCautions(system: CompiledSystem, x: Float64Array, conditions: Conditions, out: Caution[]) {
  const amplifiers = system.records.filter((r) => r.kind === 'op-amp');
  if (amplifiers.length === 0) return;
  const ws = new NewtonWorkspace(system);
  prepareWorkspace(ws, conditions);
  if (!loadJacobianAt(ws, x)) return;
  const w = new Float64Array(system.n + 1);
  for (const record of amplifiers) {
    if (record.kind !== 'op-amp') continue;
    const ideal = isIdealOpAmp(record.options);
    // The limiter's slope below one half: the output no longer follows the inputs.
    const report = system.deviceByName.get(record.name)?.report?.(x, conditions);
    if (report !== undefined && (report.region === 'limited-high' || report.region === 'limited-low')) {
      const limit = report.region === 'limited-high' ? 'upper' : 'lower';
      out.push({
        code: 'amplifier-limited',
        element: record.name,
        value: report.outputVoltage as number,
        message: `op-amp '${record.name}' is held at its ${limit} output limit (${report.region}): its output no longer follows its inputs`,
      });
    }
    const plus = system.nodeIndex.get(record.plus)!;
    const minus = system.nodeIndex.get(record.minus)!;
    const output = system.nodeIndex.get(record.output)!;
    const row = system.branchIndex.get(record.name)!;
    const difference = x[plus]! - x[minus]!;
    if (!ideal && Math.abs(difference) > AMPLIFIER_INPUT_LIMIT) {
      out.push({
        code: 'amplifier-inputs-apart',
        element: record.name,
        value: difference,
        message:
          `the inputs of op-amp '${record.name}' are ${difference.toPrecision(3)} V apart: with working feedback an ` +
          'amplifier holds them within millivolts, so a real one would be at an output limit here',
      });
    }
    w.fill(0);
    w[row] = 1;
    ws.solver.solve(w);
    w[system.n] = 0;
    const feedback = (w[plus]! - w[minus]!) / w[output]!;
    // An ideal op-amp runs away on any positive feedback; a finite gain A only when A·f > 1.
    const gain = ideal
      ? Number.POSITIVE_INFINITY
      : withDefaults(OP_AMP_PARAMETERS, record.options ?? {}).openLoopGain;
    if (Number.isFinite(feedback) && feedback > 0 && gain * feedback > 1) {
      out.push({
        code: 'positive-feedback',
        element: record.name,
        value: feedback,
        message:
          `op-amp '${record.name}' is in positive feedback at DC (a fraction ${feedback.toPrecision(3)} of its output ` +
          'returns to its inputs in phase): the balance found is unstable, and a real amplifier would run to an output limit',
      });
    }
  }
}
