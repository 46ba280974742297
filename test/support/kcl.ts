/**
 * Kirchhoff's current law checked from outside the solver: every element's terminal currents, read
 * through the public API (`op.current`, `op.device`), are summed at each node. The solver's own
 * residual is never consulted, so this catches a wrong stamp as well as a loose convergence test.
 */
import type { Circuit, OperatingPoint } from '../../src/index.js';
import { GROUND } from '../../src/index.js';

/** The currents leaving each terminal node of one element, as [node, current] pairs. */
function terminalCurrents(circuit: Circuit, op: OperatingPoint, name: string): [string, number][] {
  const e = circuit.element(name);
  if (e === undefined) throw new Error(`no element ${name}`);
  switch (e.kind) {
    case 'resistor':
    case 'capacitor':
    case 'inductor': {
      const i = op.current(name);
      return [
        [e.a, i],
        [e.b, -i],
      ];
    }
    case 'voltage-source': {
      const i = op.current(name);
      return [
        [e.plus, i],
        [e.minus, -i],
      ];
    }
    case 'current-source':
    case 'loop-probe': {
      const i = op.current(name);
      return [
        [e.from, i],
        [e.to, -i],
      ];
    }
    case 'vcvs':
    case 'ccvs': {
      const i = op.current(name);
      return [
        [e.outPlus, i],
        [e.outMinus, -i],
      ];
    }
    case 'vccs':
    case 'cccs': {
      const i = op.current(name);
      return [
        [e.outFrom, i],
        [e.outTo, -i],
      ];
    }
    case 'op-amp':
      // The output current returns through ground (the op-amp's supply).
      return [
        [e.output, -op.current(name)],
        [GROUND, op.current(name)],
      ];
    case 'diode': {
      const i = op.diode(name).current;
      return [
        [e.anode, i],
        [e.cathode, -i],
      ];
    }
    case 'bjt': {
      const r = op.bjt(name);
      // ic and ib flow into the terminals (leave the nodes) for npn, out of them for pnp.
      const s = e.polarity === 'npn' ? 1 : -1;
      return [
        [e.collector, s * r.ic],
        [e.base, s * r.ib],
        [e.emitter, -s * r.ie],
      ];
    }
    case 'mosfet': {
      const r = op.mosfet(name);
      const s = e.polarity === 'nmos' ? 1 : -1;
      return [
        [e.drain, s * r.id],
        [e.source, -s * r.id],
      ];
    }
  }
}

/** The worst KCL imbalance of a node, relative to the largest current at that node. */
export interface KclCheck {
  /** The node with the largest imbalance relative to its currents. */
  readonly node: string;
  /** The sum of currents leaving that node, in A. */
  readonly imbalance: number;
  /** The largest single current at that node, in A. */
  readonly scale: number;
}

/**
 * Sum the currents leaving every node except ground and return the worst node, judged by
 * |Σi| − relative·max|i|. Source: Kirchhoff's current law (Kirchhoff, 1845).
 */
export function worstKcl(circuit: Circuit, op: OperatingPoint, relative = 1e-9): KclCheck {
  const sums = new Map<string, number>();
  const scales = new Map<string, number>();
  for (const e of circuit.elements) {
    for (const [node, i] of terminalCurrents(circuit, op, e.name)) {
      sums.set(node, (sums.get(node) ?? 0) + i);
      scales.set(node, Math.max(scales.get(node) ?? 0, Math.abs(i)));
    }
  }
  let worst: KclCheck = { node: '', imbalance: 0, scale: 0 };
  let worstExcess = Number.NEGATIVE_INFINITY;
  for (const [node, sum] of sums) {
    if (node === GROUND) continue;
    const scale = scales.get(node) ?? 0;
    const excess = Math.abs(sum) - relative * scale;
    if (excess > worstExcess || Number.isNaN(sum)) {
      worstExcess = Number.isNaN(sum) ? Number.POSITIVE_INFINITY : excess;
      worst = { node, imbalance: sum, scale };
    }
  }
  return worst;
}

/**
 * Whether KCL holds at every node within `relative`·(largest current there) + `absolute` amperes.
 */
export function kclHolds(circuit: Circuit, op: OperatingPoint, relative = 1e-9, absolute = 1e-12): boolean {
  const w = worstKcl(circuit, op, relative);
  return Math.abs(w.imbalance) <= relative * w.scale + absolute;
}
