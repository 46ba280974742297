/**
 * The impedance looking into a pair of nodes with every independent source set to zero (voltage
 * sources shorted, current sources opened), found by driving 1 A into the port: the textbook output
 * impedance of a stage, or the input impedance of a port that no source drives.
 */
import { Complex } from 'complex.js';
import { GROUND } from '../circuit/elements.js';
import { invalidValue } from '../errors/messages.js';
import type { AcAnalysisOptions } from './ac-analysis.js';
import { AcWorkspace } from './ac-workspace.js';
import { requireInstance, requireOptions } from './arguments.js';
import { checkFrequencies } from './frequency-grid.js';
import { nodeAt, OperatingPoint } from './operating-point.js';

/** A port: two nodes; the impedance is (v(plus) − v(minus)) per ampere driven into `plus`. */
export interface Port {
  /** The node the test current is driven into. */
  readonly plus: string;
  /** Default ground. */
  readonly minus?: string;
}

/**
 * The small-signal impedance of `port` at each frequency, in Ω, with every independent source zeroed.
 *
 * @throws QuiescentError `unknown-node`, `invalid-value` (frequencies, or plus = minus), `singular`
 *   (for example a port with no path between its nodes at some frequency)
 *
 * @example
 * ```ts
 * portImpedance(op, { plus: 'out' }, { frequencies: [1e3] })[0].abs(); // output impedance at 1 kHz, Ω
 * ```
 */
export function portImpedance(op: OperatingPoint, port: Port, options: AcAnalysisOptions): Complex[] {
  requireInstance(op, OperatingPoint, 'op', 'an OperatingPoint (the result of operatingPoint(circuit))');
  requireOptions(port, 'port', false);
  requireOptions(options, 'options', false);
  const frequencies = checkFrequencies(options?.frequencies);
  const system = op.system;
  const plus = nodeAt(system, port?.plus);
  const minus = nodeAt(system, port.minus ?? GROUND);
  if (plus === minus)
    throw invalidValue(['port', 'minus'], port.minus ?? GROUND, `a node other than plus ('${port.plus}')`);
  const workspace = new AcWorkspace(op);
  const n = system.n;
  const xr = new Float64Array(n + 1);
  const xi = new Float64Array(n + 1);
  const out: Complex[] = [];
  for (const f of frequencies) {
    workspace.factorAt(f);
    xr.fill(0);
    xi.fill(0);
    xr[plus] = 1;
    xr[minus] = -1;
    xr[n] = 0;
    workspace.solve(xr, xi);
    out.push(new Complex(xr[plus]! - xr[minus]!, xi[plus]! - xi[minus]!));
  }
  return out;
}
