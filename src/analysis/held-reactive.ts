/**
 * The circuit as the large-signal check sees it in mid-band: every capacitor holds the voltage it has
 * at the operating point and every inductor the current, as large coupling, bypass and choke elements
 * do over a period of the signal. A capacitor becomes a voltage source at its operating-point voltage,
 * an inductor a current source at its operating-point current, both under their own names (so a probe
 * `{ element }` still reads them) and without AC excitation.
 *
 * Two exceptions keep the equations regular:
 * - a capacitor whose two nodes are already joined by voltage-defined branches (voltage sources,
 *   controlled-voltage and op-amp outputs, capacitors held before it) would close a loop of voltage
 *   sources; its voltage is fixed already (supply decoupling), so it stays open;
 * - an inductor whose two nodes are joined by nothing else that conducts DC would, as a current
 *   source, close a cut set of current sources; it stays a short. An inductor that controls a
 *   current-controlled source stays a short too, since a current source carries no current unknown.
 */
import { type ElementRecord, GROUND } from '../circuit/elements.js';
import type { OperatingPoint } from './operating-point.js';

/** Node names numbered on first sight, joined in a disjoint-set forest. */
class NodeSets {
  readonly #index = new Map<string, number>();
  readonly #parent: number[] = [];

  #id(node: string): number {
    let k = this.#index.get(node);
    if (k === undefined) {
      k = this.#parent.length;
      this.#index.set(node, k);
      this.#parent.push(k);
    }
    return k;
  }

  #root(k: number): number {
    const p = this.#parent;
    while (p[k] !== k) {
      p[k] = p[p[k]!]!;
      k = p[k]!;
    }
    return k;
  }

  /** Whether a and b are already joined. */
  joined(a: string, b: string): boolean {
    return this.#root(this.#id(a)) === this.#root(this.#id(b));
  }

  /** Join a and b. */
  join(a: string, b: string): void {
    this.#parent[this.#root(this.#id(a))] = this.#root(this.#id(b));
  }
}

/** The pair of nodes whose voltage an element imposes, if it imposes one (inductors excepted). */
function imposedVoltage(e: ElementRecord): readonly [string, string] | undefined {
  switch (e.kind) {
    case 'voltage-source':
      return [e.plus, e.minus];
    case 'vcvs':
    case 'ccvs':
      return [e.outPlus, e.outMinus];
    case 'op-amp':
      return [e.output, GROUND];
    default:
      return undefined;
  }
}

/** Node pairs joined by a DC-conducting path inside an element that is neither capacitor nor inductor. */
function conducting(e: ElementRecord): readonly (readonly [string, string])[] {
  switch (e.kind) {
    case 'resistor':
      return [[e.a, e.b]];
    case 'diode':
      return [[e.anode, e.cathode]];
    case 'bjt':
      return [
        [e.base, e.emitter],
        [e.base, e.collector],
      ];
    case 'mosfet':
      return [
        [e.drain, e.source],
        [e.body, e.source],
      ];
    default: {
      const pair = imposedVoltage(e);
      return pair === undefined ? [] : [pair];
    }
  }
}

/** What became of each reactive element. */
export interface HeldReactive {
  /** The element records of the held circuit, in the original order. */
  readonly records: readonly ElementRecord[];
  /** Capacitors and inductors held at their operating-point voltage or current. */
  readonly held: readonly string[];
  /** Capacitors left open and inductors left shorted, by the exceptions above. */
  readonly kept: readonly string[];
}

/**
 * The records of the circuit with its reactive elements held at the operating point `op`.
 *
 * @param records - the circuit's element records
 * @param op - its operating point (the values held)
 */
export function holdReactive(records: readonly ElementRecord[], op: OperatingPoint): HeldReactive {
  const voltages = new NodeSets();
  for (const e of records) {
    const pair = imposedVoltage(e);
    if (pair !== undefined) voltages.join(pair[0], pair[1]);
  }
  const holdCapacitor = new Set<string>();
  for (const e of records) {
    if (e.kind !== 'capacitor' || voltages.joined(e.a, e.b)) continue;
    voltages.join(e.a, e.b);
    holdCapacitor.add(e.name);
  }
  const sensing = new Set<string>();
  for (const e of records) if (e.kind === 'ccvs' || e.kind === 'cccs') sensing.add(e.control);
  const paths = new NodeSets();
  for (const e of records) {
    if (e.kind === 'capacitor') {
      if (holdCapacitor.has(e.name)) paths.join(e.a, e.b);
    } else {
      for (const [a, b] of conducting(e)) paths.join(a, b);
    }
  }
  const holdInductor = new Set<string>();
  for (const e of records) {
    if (e.kind !== 'inductor') continue;
    if (!sensing.has(e.name) && paths.joined(e.a, e.b)) holdInductor.add(e.name);
    else paths.join(e.a, e.b);
  }
  const held: string[] = [];
  const kept: string[] = [];
  const heldRecords = records.map((e): ElementRecord => {
    if (e.kind === 'capacitor') {
      if (!holdCapacitor.has(e.name)) {
        kept.push(e.name);
        return e;
      }
      held.push(e.name);
      const dc = op.voltage(e.a, e.b);
      return {
        kind: 'voltage-source',
        name: e.name,
        plus: e.a,
        minus: e.b,
        dc,
        ac: { magnitude: 0, phase: 0 },
      };
    }
    if (e.kind === 'inductor') {
      if (!holdInductor.has(e.name)) {
        kept.push(e.name);
        return e;
      }
      held.push(e.name);
      const dc = op.current(e.name);
      return { kind: 'current-source', name: e.name, from: e.a, to: e.b, dc, ac: { magnitude: 0, phase: 0 } };
    }
    return e;
  });
  return { records: heldRecords, held, kept };
}
