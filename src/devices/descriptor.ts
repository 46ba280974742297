/**
 * What the library knows about one kind of element, in one object: its terminals, the unknowns it
 * adds, how it conducts at DC, its parameters, its JSON fields, its report and table columns, and
 * the factory of its compiled device. The builder's checks, the JSON reader, the topology checks,
 * the element currents, the reports and the tables all read these descriptors, so a kind is
 * described once (see DEVELOPERS.md, "Adding a device kind").
 */
import type { ValueRange } from '../errors/quiescent-error.js';
import type { Unit } from '../values/units.js';
import type { Value } from '../values/value.js';
import type { Device } from './device.js';
import type { ParameterTable } from './parameters.js';
import type { ElementKind, RecordOf } from './records.js';

/** One terminal of a kind: the record field that holds its node, and what it is, in words. */
export interface TerminalSpec<R> {
  /** The record field holding the node name. */
  readonly field: keyof R & string;
  /** What the terminal is, for docs and messages (`'collector'`, `'positive output'`). */
  readonly role: string;
}

/** The unit and range of one value field of a record (a resistance, a gain, a source's DC value). */
export interface ValueSpec {
  /** The unit, `'none'` for a pure number. */
  readonly unit: Unit | 'none';
  /** The admissible range. */
  readonly range: ValueRange;
}

/** The fields of a record that hold a number. */
export type NumberFields<R> = { [F in keyof R]: R[F] extends number ? F : never }[keyof R] & string;

/** The JSON type of one document field. */
export type FieldType = 'string' | 'number' | 'boolean' | 'ac' | 'object' | 'polarity';

/** One numeric column of a device's operating-point table: the report field, its heading and unit. */
export interface ReportColumn {
  /** The field of the device report (its name in results and JSON). */
  readonly field: string;
  /** The typeset heading (`r_π`, `C_μ`, `g_m`). */
  readonly header: string;
  /** The unit the values are printed in. */
  readonly unit: Unit;
}

/** How a kind with an operating report (diodes, transistors) shows it. */
export interface ReportSpec {
  /** The title of its operating-point table. */
  readonly title: string;
  /** Whether the table has a region column. */
  readonly withRegion: boolean;
  /** The numeric columns, in print order. */
  readonly columns: readonly ReportColumn[];
}

/**
 * The builder calls a document replays, as the circuit builder implements them (a type-level test
 * assigns a circuit to it, so the two cannot drift apart).
 */
export interface ElementBuilder {
  /** Adds a resistor. */
  resistor(name: string, a: string, b: string, resistance: Value, options?: object): unknown;
  /** Adds a capacitor. */
  capacitor(name: string, a: string, b: string, capacitance: Value): unknown;
  /** Adds an inductor. */
  inductor(name: string, a: string, b: string, inductance: Value): unknown;
  /** Adds a voltage source. */
  voltageSource(name: string, plus: string, minus: string, spec?: object): unknown;
  /** Adds a current source. */
  currentSource(name: string, from: string, to: string, spec?: object): unknown;
  /** Adds a voltage-controlled voltage source. */
  vcvs(
    name: string,
    out: readonly [string, string],
    control: readonly [string, string],
    gain: Value,
  ): unknown;
  /** Adds a voltage-controlled current source. */
  vccs(name: string, out: readonly [string, string], control: readonly [string, string], gm: Value): unknown;
  /** Adds a current-controlled voltage source. */
  ccvs(name: string, out: readonly [string, string], control: string, transresistance: Value): unknown;
  /** Adds a current-controlled current source. */
  cccs(name: string, out: readonly [string, string], control: string, gain: Value): unknown;
  /** Adds a loop probe. */
  loopProbe(name: string, from: string, to: string): unknown;
  /** Adds an op-amp. */
  opAmp(name: string, terminals: never, options?: never): unknown;
  /** Adds a diode. */
  diode(name: string, anode: string, cathode: string, model?: never): unknown;
  /** Adds a bipolar transistor. */
  bjt(name: string, terminals: never, model: never): unknown;
  /** Adds a MOSFET. */
  mosfet(name: string, terminals: never, model: never): unknown;
}

/** Everything the library knows about elements of kind `K`. Every part is required. */
export interface KindDescriptor<K extends ElementKind> {
  /** The kind name, as in records and documents. */
  readonly kind: K;
  /** The kind in words with its article, for messages (`'a resistor'`, `'an op-amp'`). */
  readonly noun: string;
  /** The terminals in order; their record fields hold node names. */
  readonly terminals: readonly TerminalSpec<RecordOf<K>>[];
  /** Labels of the internal nodes a device of this kind may add (named `element#label` in messages). */
  readonly internalNodes: readonly string[];
  /** Whether the element's current is an unknown of the equations, so it can control a ccvs or cccs. */
  readonly currentUnknown: boolean;
  /** The record field naming a controlling element whose current unknown this kind reads, or null. */
  readonly controlField: (keyof RecordOf<K> & string) | null;
  /** Pairs of nodes joined by a DC-conducting path inside one element (for the floating-node check). */
  dcPaths(record: RecordOf<K>): readonly (readonly [string, string])[];
  /** The branch whose voltage the element imposes (for the voltage-loop check), or undefined. */
  voltageBranch(record: RecordOf<K>): readonly [string, string] | undefined;
  /** Every number field of the record with its unit and range; the builder checks values by these. */
  readonly values: { readonly [F in NumberFields<RecordOf<K>>]: ValueSpec };
  /** The model parameter table (units, defaults, ranges), or null for a kind with none. */
  readonly parameters: ParameterTable<string> | null;
  /** The record field holding the given model parameters (`'model'`, `'options'`), or null. */
  readonly parameterField: (keyof RecordOf<K> & string) | null;
  /** The fields of its JSON document besides `kind` and `name`, with their types; optional ones end in `?`. */
  readonly json: Readonly<Record<string, FieldType>>;
  /**
   * Where the builder's argument paths sit in the document, for kinds whose builder takes its
   * nodes differently (`out[0]` of a controlled source is the document's `outPlus`).
   */
  readonly documentPaths: Readonly<Record<string, readonly string[]>>;
  /** Replays one checked document entry through the builder. */
  replay(builder: ElementBuilder, name: string, fields: Readonly<Record<string, unknown>>): void;
  /**
   * The direction the element's current is counted in, in words (`'a → b'`, `'out of n'`), or
   * undefined for an element with no single current (a transistor).
   */
  currentDirection(record: RecordOf<K>): string | undefined;
  /** The operating report's table, or null for a kind without a report. */
  readonly report: ReportSpec | null;
  /**
   * Whether the small-signal stamp is exactly G + jωC with G and C independent of ω and an AC
   * excitation independent of ω, so an AC analysis may stamp it once for every frequency.
   */
  readonly frequencyAffine: boolean;
  /**
   * Whether its junction probes read in the mirrored sense (a pnp transistor, a p-channel MOSFET),
   * so the forward bias is the negated probe voltage.
   */
  mirrored(record: RecordOf<K>): boolean;
  /** The compiled device of a record. */
  create(record: RecordOf<K>): Device;
}

/** Every kind's descriptor, one per kind: a kind left out is a compile error. */
export type KindRegistry = { readonly [K in ElementKind]: KindDescriptor<K> };

/** A descriptor whose `create` and readers take any record (the registry's entries, seen by kind). */
export type AnyDescriptor = KindDescriptor<ElementKind>;
