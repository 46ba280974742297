/**
 * The circuit builder. Each method checks its own arguments at once and appends one element record;
 * checks that need the whole circuit run when an analysis starts (see topology.ts).
 */
import { BJT_PARAMETERS, type BjtModel } from '../devices/bjt/bjt-model.js';
import type { ValueSpec } from '../devices/descriptor.js';
import { DIODE_PARAMETERS, type DiodeModel } from '../devices/diode/diode-model.js';
import { MOSFET_PARAMETERS, type MosfetModel } from '../devices/mosfet/mosfet-model.js';
import { checkOpAmpOptions, OP_AMP_PARAMETERS, type OpAmpOptions } from '../devices/op-amp/op-amp-model.js';
import { type ParameterTable, parseParameters } from '../devices/parameters.js';
import { KINDS } from '../devices/registry.js';
import { duplicateName, invalidCircuit, invalidValue, unknownElement } from '../errors/messages.js';
import { describeGiven } from '../errors/wording.js';
import type { Unit } from '../values/index.js';
import { checkMagnitude } from '../values/magnitude.js';
import { readValue } from '../values/parse.js';
import type { Value } from '../values/value.js';
import { type AcExcitation, type ElementRecord, terminalsOf } from './elements.js';
import { type CircuitDocument, circuitFromJson, circuitToJson } from './json.js';

/** The excitation of an independent source: its DC value and its AC phasor (peak magnitude, phase in degrees). */
export interface SourceSpec {
  /** DC value, V or A (default 0). */
  dc?: Value;
  /** AC peak magnitude, or magnitude with phase in degrees (default 0: no AC signal). */
  ac?:
    | Value
    | {
        /** Peak magnitude, V or A. */
        magnitude: Value;
        /** Phase in degrees (default 0). */
        phase?: number;
      };
}

/** Options of {@link Circuit.resistor}. */
export interface ResistorOptions {
  /** When true the resistor carries no thermal noise in a noise analysis (default false). */
  readonly noiseless?: boolean;
}

/** Terminals of an op-amp. */
export interface OpAmpTerminals {
  /** The non-inverting input node. */
  plus: string;
  /** The inverting input node. */
  minus: string;
  /** The output node. */
  output: string;
}
/** Terminals of a bipolar transistor. */
export interface BjtTerminals {
  /** The collector node. */
  collector: string;
  /** The base node. */
  base: string;
  /** The emitter node. */
  emitter: string;
}
/** Terminals of a MOSFET; `body` defaults to `source`. */
export interface MosfetTerminals {
  /** The drain node. */
  drain: string;
  /** The gate node. */
  gate: string;
  /** The source node. */
  source: string;
  /** The body (bulk) node; defaults to `source`. */
  body?: string;
}

/**
 * A circuit under construction. Every method returns the circuit, so calls chain.
 *
 * @example
 * ```ts
 * const c = new Circuit()
 *   .voltageSource('supply', 'in', GROUND, { dc: 5 })
 *   .resistor('R1', 'in', 'out', '1k')
 *   .diode('D1', 'out', GROUND);
 * ```
 */
export class Circuit {
  #elements: ElementRecord[] = [];
  #byName = new Map<string, ElementRecord>();
  #revision = 0;
  /** Behind accessors: no own property for a copy or a comparison of circuits to meet. */
  #analysisCache: unknown = undefined;
  readonly #modelsByContent = new Map<ParameterTable<string>, Map<string, object>>();

  /**
   * @internal Where the analyses keep what they built from this circuit (its prepared system and the
   * revision it was built at), opaque here. A field rather than a WeakMap keyed on the circuit: with
   * the map, a ten-element circuit built and solved once cost about 20 µs more (of about 100 µs),
   * the collector's work on the map's entries.
   */
  get analysisCache(): unknown {
    return this.#analysisCache;
  }
  /** @internal See the getter. */
  set analysisCache(value: unknown) {
    this.#analysisCache = value;
  }
  /**
   * A counter that grows with every change, so that caches built from the circuit (compiled
   * equations, say) can tell whether they are stale.
   */
  get revision(): number {
    return this.#revision;
  }

  /** The element records, in the order they were added (a copy). */
  get elements(): readonly ElementRecord[] {
    return this.#elements.slice();
  }

  /** The element record of that name, or undefined. */
  element(name: string): ElementRecord | undefined {
    return this.#byName.get(name);
  }

  /** The names of all nodes, ground included if used, in order of first appearance. */
  get nodes(): readonly string[] {
    const seen = new Set<string>();
    for (const e of this.#elements) {
      for (const [, node] of terminalsOf(e)) seen.add(node);
    }
    return [...seen];
  }

  /**
   * Add a resistor of `resistance` Ω (> 0) between nodes `a` and `b`. With `{ noiseless: true }` it
   * carries no thermal noise in a noise analysis (an idealized part, or one modelled elsewhere).
   */
  resistor(name: string, a: string, b: string, resistance: Value, options?: ResistorOptions): this {
    const path = this.#start(name);
    const noiseless = noiselessOption(options, [...path, 'options']);
    return this.#add({
      kind: 'resistor',
      name,
      a: node(a, [...path, 'a']),
      b: node(b, [...path, 'b']),
      resistance: checked(KINDS.resistor.values.resistance, resistance, [...path, 'resistance']),
      ...(noiseless ? { noiseless: true as const } : {}),
    });
  }

  /** Add a capacitor of `capacitance` F (≥ 0) between nodes `a` and `b`. */
  capacitor(name: string, a: string, b: string, capacitance: Value): this {
    const path = this.#start(name);
    return this.#add({
      kind: 'capacitor',
      name,
      a: node(a, [...path, 'a']),
      b: node(b, [...path, 'b']),
      capacitance: checked(KINDS.capacitor.values.capacitance, capacitance, [...path, 'capacitance']),
    });
  }

  /** Add an inductor of `inductance` H (≥ 0; a short at DC) between nodes `a` and `b`. */
  inductor(name: string, a: string, b: string, inductance: Value): this {
    const path = this.#start(name);
    return this.#add({
      kind: 'inductor',
      name,
      a: node(a, [...path, 'a']),
      b: node(b, [...path, 'b']),
      inductance: checked(KINDS.inductor.values.inductance, inductance, [...path, 'inductance']),
    });
  }

  /**
   * Add an independent voltage source: v(plus) − v(minus) = dc, and the AC phasor `ac`. Its
   * current flows from `plus` through the source to `minus`.
   */
  voltageSource(name: string, plus: string, minus: string, spec: SourceSpec = {}): this {
    const path = this.#start(name);
    const { dc, ac } = sourceSpec(spec, KINDS['voltage-source'].values.dc, path);
    return this.#add({
      kind: 'voltage-source',
      name,
      plus: node(plus, [...path, 'plus']),
      minus: node(minus, [...path, 'minus']),
      dc,
      ac,
    });
  }

  /** Add an independent current source; its positive value flows from `from`, through the source, into `to`. */
  currentSource(name: string, from: string, to: string, spec: SourceSpec = {}): this {
    const path = this.#start(name);
    const { dc, ac } = sourceSpec(spec, KINDS['current-source'].values.dc, path);
    return this.#add({
      kind: 'current-source',
      name,
      from: node(from, [...path, 'from']),
      to: node(to, [...path, 'to']),
      dc,
      ac,
    });
  }

  /** Add a voltage-controlled voltage source: v(outPlus) − v(outMinus) = gain·(v(ctrlPlus) − v(ctrlMinus)). */
  vcvs(name: string, out: readonly [string, string], control: readonly [string, string], gain: Value): this {
    const path = this.#start(name);
    const [outPlus, outMinus] = pair(out, [...path, 'out']);
    const [controlPlus, controlMinus] = pair(control, [...path, 'control']);
    return this.#add({
      kind: 'vcvs',
      name,
      outPlus,
      outMinus,
      controlPlus,
      controlMinus,
      gain: checked(KINDS.vcvs.values.gain, gain, [...path, 'gain']),
    });
  }

  /** Add a voltage-controlled current source: gm·(v(ctrlPlus) − v(ctrlMinus)) flows from outFrom through the source into outTo. */
  vccs(
    name: string,
    out: readonly [string, string],
    control: readonly [string, string],
    transconductance: Value,
  ): this {
    const path = this.#start(name);
    const [outFrom, outTo] = pair(out, [...path, 'out']);
    const [controlPlus, controlMinus] = pair(control, [...path, 'control']);
    return this.#add({
      kind: 'vccs',
      name,
      outFrom,
      outTo,
      controlPlus,
      controlMinus,
      transconductance: checked(KINDS.vccs.values.transconductance, transconductance, [
        ...path,
        'transconductance',
      ]),
    });
  }

  /**
   * Add a current-controlled voltage source: v(outPlus) − v(outMinus) = r·i(control), where the
   * controlling element is a voltage source, inductor, vcvs, ccvs or loop probe (checked when an analysis starts).
   */
  ccvs(name: string, out: readonly [string, string], control: string, transresistance: Value): this {
    const path = this.#start(name);
    const [outPlus, outMinus] = pair(out, [...path, 'out']);
    return this.#add({
      kind: 'ccvs',
      name,
      outPlus,
      outMinus,
      control: elementName(control, [...path, 'control']),
      transresistance: checked(KINDS.ccvs.values.transresistance, transresistance, [
        ...path,
        'transresistance',
      ]),
    });
  }

  /** Add a current-controlled current source: gain·i(control) flows from outFrom through the source into outTo. */
  cccs(name: string, out: readonly [string, string], control: string, gain: Value): this {
    const path = this.#start(name);
    const [outFrom, outTo] = pair(out, [...path, 'out']);
    return this.#add({
      kind: 'cccs',
      name,
      outFrom,
      outTo,
      control: elementName(control, [...path, 'control']),
      gain: checked(KINDS.cccs.values.gain, gain, [...path, 'gain']),
    });
  }

  /**
   * Add a loop probe: a 0 V element in series with a feedback loop (a short at DC and in AC, with no
   * excitation of its own), where `loopGain` measures the loop gain. `from` faces the side that
   * drives the loop (an amplifier's output), `to` the side it feeds; its current flows from `from`
   * to `to`, and it can sense the current of a ccvs or cccs.
   */
  loopProbe(name: string, from: string, to: string): this {
    const path = this.#start(name);
    return this.#add({
      kind: 'loop-probe',
      name,
      from: node(from, [...path, 'from']),
      to: node(to, [...path, 'to']),
    });
  }

  /**
   * Add an op-amp: ideal unless `openLoopGain`, `gainBandwidth`, `outputResistance`, `outputHigh` or
   * `outputLow` is given (then single-pole with output limits); input offset and bias currents apply to either.
   */
  opAmp(name: string, terminals: OpAmpTerminals, options?: OpAmpOptions): this {
    const path = this.#start(name);
    const t = terminalObject(terminals, ['plus', 'minus', 'output'], path);
    return this.#add({
      kind: 'op-amp',
      name,
      plus: t.plus,
      minus: t.minus,
      output: t.output,
      options:
        options === undefined
          ? undefined
          : checkOpAmpOptions(parseParameters(OP_AMP_PARAMETERS, options, [...path, 'options'], 'op-amp'), [
              ...path,
              'options',
            ]),
    });
  }

  /** Add a junction diode from `anode` to `cathode`. */
  diode(name: string, anode: string, cathode: string, model: DiodeModel = {}): this {
    const path = this.#start(name);
    return this.#add({
      kind: 'diode',
      name,
      anode: node(anode, [...path, 'anode']),
      cathode: node(cathode, [...path, 'cathode']),
      model: this.#parseModel(DIODE_PARAMETERS, model, [...path, 'model'], 'diode'),
    });
  }

  /** Add a bipolar transistor; `model.polarity` is `'npn'` or `'pnp'`. */
  bjt(name: string, terminals: BjtTerminals, model: BjtModel): this {
    const path = this.#start(name);
    const t = terminalObject(terminals, ['collector', 'base', 'emitter'], path);
    const polarity = polarityOf(model, ['npn', 'pnp'], [...path, 'model']);
    return this.#add({
      kind: 'bjt',
      name,
      collector: t.collector,
      base: t.base,
      emitter: t.emitter,
      polarity,
      model: this.#parseModel(BJT_PARAMETERS, model, [...path, 'model'], 'bipolar transistor', ['polarity']),
    });
  }

  /** Add a MOSFET; `model.polarity` is `'nmos'` or `'pmos'`; the body defaults to the source. */
  mosfet(name: string, terminals: MosfetTerminals, model: MosfetModel): this {
    const path = this.#start(name);
    const t = terminalObject(terminals, ['drain', 'gate', 'source'], path, ['body']);
    const polarity = polarityOf(model, ['nmos', 'pmos'], [...path, 'model']);
    return this.#add({
      kind: 'mosfet',
      name,
      drain: t.drain,
      gate: t.gate,
      source: t.source,
      body: t.body ?? t.source,
      polarity,
      model: this.#parseModel(MOSFET_PARAMETERS, model, [...path, 'model'], 'MOSFET', ['polarity']),
    });
  }

  /**
   * Remove the element `name`. Nodes only it touched disappear with it; an element that still names
   * it (a current-controlled source) is reported when an analysis starts.
   *
   * @throws QuiescentError `unknown-element` when the circuit has no element of that name
   */
  remove(name: string): this {
    const index = this.#indexOf(name, ['remove']);
    this.#elements.splice(index, 1);
    this.#byName.delete(name);
    this.#revision++;
    return this;
  }

  /**
   * Replace the element `name` with what `add` adds, in its place in the element order. `add`
   * receives this circuit and calls its builder methods; the new element may keep the old name.
   *
   * @example
   * ```ts
   * const c = new Circuit().voltageSource('supply', 'in', GROUND, { dc: 5 }).resistor('load', 'in', GROUND, '1k');
   * c.replace('load', (circuit) => circuit.resistor('load', 'in', GROUND, '2k'));
   * ```
   * @throws QuiescentError `unknown-element` when the circuit has no element of that name; any error
   *   of the builder call, in which case the circuit is left as it was
   */
  replace(name: string, add: (circuit: this) => unknown): this {
    const index = this.#indexOf(name, ['replace']);
    const old = this.#elements[index]!;
    const before = this.#elements.length;
    this.#elements.splice(index, 1);
    this.#byName.delete(name);
    try {
      add(this);
    } catch (error) {
      for (const added of this.#elements.splice(before - 1)) this.#byName.delete(added.name);
      this.#elements.splice(index, 0, old);
      this.#byName.set(name, old);
      throw error;
    }
    const added = this.#elements.splice(before - 1);
    this.#elements.splice(index, 0, ...added);
    this.#revision++;
    return this;
  }

  /**
   * A copy of the circuit without the elements named (an open-circuited load, say); this circuit is
   * unchanged. With no names, a plain copy.
   *
   * @throws QuiescentError `unknown-element` when a name is not an element of the circuit
   */
  without(...names: string[]): Circuit {
    for (const [i, name] of names.entries()) this.#indexOf(name, ['without', i]);
    const copy = new Circuit();
    for (const record of this.#elements) if (!names.includes(record.name)) copy.#add(record);
    return copy;
  }

  /** The circuit as a plain JSON document (see {@link CircuitDocument}). */
  toJSON(): CircuitDocument {
    return circuitToJson(this.#elements);
  }

  /** Rebuild a circuit from a document made by {@link Circuit.toJSON}; bad documents throw `invalid-circuit`. */
  static fromJSON(json: unknown): Circuit {
    const circuit = new Circuit();
    circuitFromJson(json, circuit);
    return circuit;
  }

  #start(name: unknown): string[] {
    if (typeof name !== 'string' || name.length === 0) {
      throw invalidCircuit(['name'], { kind: 'not-a-name', what: 'element', got: describeGiven(name) });
    }
    if (this.#byName.has(name)) throw duplicateName(name);
    return [name];
  }

  #indexOf(name: unknown, path: readonly (string | number)[]): number {
    const index = typeof name === 'string' ? this.#elements.findIndex((e) => e.name === name) : -1;
    if (index < 0) throw unknownElement(String(name), undefined, path);
    return index;
  }

  /**
   * {@link parseParameters}, returning this circuit's one frozen copy of the parsed model (equal
   * models: the same table, keys in the same order, the same values).
   */
  #parseModel<K extends string>(
    table: ParameterTable<K>,
    given: unknown,
    path: readonly (string | number)[],
    kindName: string,
    skip: readonly string[] = [],
  ): Partial<Record<K, number>> {
    const parsed = parseParameters(table, given, path, kindName, skip);
    let byContent = this.#modelsByContent.get(table);
    if (byContent === undefined) {
      byContent = new Map();
      this.#modelsByContent.set(table, byContent);
    }
    // A number's shortest decimal form names it exactly (0 and −0 alike, which no model tells apart).
    let key = '';
    for (const name in parsed) key += `${name}=${parsed[name]};`;
    const known = byContent.get(key);
    if (known !== undefined) return known as Partial<Record<K, number>>;
    byContent.set(key, Object.freeze(parsed));
    return parsed;
  }

  #add(record: ElementRecord): this {
    // Records are shared with callers (elements, element()); freezing their nested objects too keeps
    // every value as checked.
    for (const value of Object.values(record)) if (typeof value === 'object') Object.freeze(value);
    this.#elements.push(Object.freeze(record));
    this.#byName.set(record.name, record);
    this.#revision++;
    return this;
  }
}

/** The `noiseless` flag of a resistor's options, checked. */
function noiselessOption(options: unknown, path: readonly (string | number)[]): boolean {
  if (options === undefined) return false;
  if (options === null || typeof options !== 'object' || Array.isArray(options)) {
    throw invalidCircuit(path, { kind: 'not-an-object', what: 'options', keys: ['noiseless'] });
  }
  for (const key of Object.keys(options)) {
    if (key !== 'noiseless')
      throw invalidCircuit([...path, key], { kind: 'unknown-key', what: 'option', known: ['noiseless'] });
  }
  const flag = (options as { noiseless?: unknown }).noiseless;
  if (flag !== undefined && typeof flag !== 'boolean') {
    throw invalidCircuit([...path, 'noiseless'], { kind: 'wrong-type', expected: 'boolean' });
  }
  return flag === true;
}

function node(x: unknown, path: readonly (string | number)[]): string {
  if (typeof x !== 'string' || x.length === 0) {
    throw invalidCircuit(path, { kind: 'not-a-name', what: 'node', got: describeGiven(x) });
  }
  return x;
}

function elementName(x: unknown, path: readonly (string | number)[]): string {
  if (typeof x !== 'string' || x.length === 0) {
    throw invalidCircuit(path, { kind: 'not-a-name', what: 'controlling element', got: describeGiven(x) });
  }
  return x;
}

function pair(x: unknown, path: readonly (string | number)[]): [string, string] {
  if (!Array.isArray(x) || x.length !== 2) {
    throw invalidCircuit(path, { kind: 'not-a-pair' });
  }
  return [node(x[0], [...path, 0]), node(x[1], [...path, 1])];
}

function terminalObject<K extends string, O extends string = never>(
  x: unknown,
  required: readonly K[],
  path: readonly (string | number)[],
  optional: readonly O[] = [],
): Record<K, string> & Partial<Record<O, string>> {
  if (x === null || typeof x !== 'object' || Array.isArray(x)) {
    throw invalidCircuit(path, { kind: 'not-an-object', what: 'terminals', keys: required });
  }
  const obj = x as Record<string, unknown>;
  for (const key of Object.keys(obj)) {
    if (!(required as readonly string[]).includes(key) && !(optional as readonly string[]).includes(key)) {
      throw invalidCircuit([...path, key], {
        kind: 'unknown-key',
        what: 'terminal',
        known: [...required, ...optional],
      });
    }
  }
  const out: Record<string, string> = {};
  for (const key of required) out[key] = node(obj[key], [...path, key]);
  for (const key of optional) if (obj[key] !== undefined) out[key] = node(obj[key], [...path, key]);
  return out as Record<K, string> & Partial<Record<O, string>>;
}

function polarityOf<P extends string>(
  model: unknown,
  allowed: readonly P[],
  path: readonly (string | number)[],
): P {
  if (model === null || typeof model !== 'object') {
    throw invalidCircuit(path, { kind: 'not-an-object', what: 'model', keys: allowed });
  }
  const p = (model as { polarity?: unknown }).polarity;
  if (typeof p !== 'string' || !(allowed as readonly string[]).includes(p)) {
    throw invalidCircuit([...path, 'polarity'], {
      kind: 'not-one-of',
      what: 'polarity',
      allowed,
      got: describeGiven(p),
    });
  }
  return p as P;
}

function finite(v: unknown, unit: Unit | 'none', path: readonly (string | number)[]): number {
  if (typeof v !== 'number' && typeof v !== 'string') throw invalidValue(path, v, { range: 'any', unit });
  // −0 becomes 0: JSON cannot carry the sign of zero, and a round trip must give the same record.
  const x = readValue(v, unit, path) || 0;
  checkMagnitude(x, path, v);
  return x;
}

/** A value read in its unit and held to its range, as the kind's descriptor gives them. */
function checked(spec: ValueSpec, v: unknown, path: readonly (string | number)[]): number {
  const x = finite(v, spec.unit, path);
  const ok = spec.range === 'positive' ? x > 0 : spec.range === 'non-negative' ? x >= 0 : true;
  if (!ok) throw invalidValue(path, v, { range: spec.range, unit: spec.unit });
  return x;
}

function sourceSpec(
  spec: unknown,
  value: ValueSpec,
  path: readonly string[],
): { dc: number; ac: AcExcitation } {
  if (spec === null || typeof spec !== 'object' || Array.isArray(spec)) {
    throw invalidCircuit(path, { kind: 'not-an-object', what: 'source' });
  }
  const s = spec as Record<string, unknown>;
  for (const key of Object.keys(s)) {
    if (key !== 'dc' && key !== 'ac')
      throw invalidCircuit([...path, key], {
        kind: 'unknown-key',
        what: 'source setting',
        known: ['dc', 'ac'],
      });
  }
  const dc = s.dc === undefined ? 0 : checked(value, s.dc, [...path, 'dc']);
  const magnitude = { unit: value.unit, range: 'non-negative' } as const;
  let ac: AcExcitation = { magnitude: 0, phase: 0 };
  if (s.ac !== undefined) {
    if (typeof s.ac === 'number' || typeof s.ac === 'string') {
      ac = { magnitude: checked(magnitude, s.ac, [...path, 'ac']), phase: 0 };
    } else if (s.ac !== null && typeof s.ac === 'object' && !Array.isArray(s.ac)) {
      const a = s.ac as Record<string, unknown>;
      for (const key of Object.keys(a)) {
        if (key !== 'magnitude' && key !== 'phase') {
          throw invalidCircuit([...path, 'ac', key], {
            kind: 'unknown-key',
            what: 'AC setting',
            known: ['magnitude', 'phase'],
          });
        }
      }
      const peak = checked(magnitude, a.magnitude, [...path, 'ac', 'magnitude']);
      const phase = a.phase === undefined ? 0 : a.phase;
      if (typeof phase !== 'number' || !Number.isFinite(phase)) {
        throw invalidValue([...path, 'ac', 'phase'], phase, 'a finite phase in degrees');
      }
      ac = { magnitude: peak, phase: phase || 0 };
    } else {
      throw invalidCircuit([...path, 'ac'], { kind: 'not-an-object', what: 'ac' });
    }
  }
  return { dc, ac };
}
