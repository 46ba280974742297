/**
 * Element records: the plain data a circuit is made of. Values are numbers in SI units, already
 * checked; device models keep only the parameters the user gave (defaults are applied when an
 * analysis compiles the circuit), so that a JSON document says no more than the user did.
 */
import type { BjtModel } from '../devices/bjt-model.js';
import type { DiodeModel } from '../devices/diode-model.js';
import type { MosfetModel } from '../devices/mosfet-model.js';
import type { OpAmpOptions } from '../devices/op-amp-model.js';

/** The reference node. Every circuit must connect something to it. */
export const GROUND = 'gnd';

/** Numeric parameters of a model, as given. */
export type GivenParameters<M> = { readonly [K in Exclude<keyof M, 'polarity'>]?: number };

/** An AC excitation: peak magnitude and phase in degrees. */
export interface AcExcitation {
  /** Peak magnitude, in V for a voltage source or A for a current source. */
  readonly magnitude: number;
  /** Phase in degrees. */
  readonly phase: number;
}

/** A resistor between nodes `a` and `b`. */
export interface ResistorRecord {
  /** Always `'resistor'`; narrows an {@link ElementRecord}. */
  readonly kind: 'resistor';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The first node; positive current flows from `a` through the element to `b`. */
  readonly a: string;
  /** The second node. */
  readonly b: string;
  /** Resistance in Ω (> 0). */
  readonly resistance: number;
  /** Present and true when the resistor was built without thermal noise (see docs/noise.md). */
  readonly noiseless?: true;
}
/** A capacitor between nodes `a` and `b`. */
export interface CapacitorRecord {
  /** Always `'capacitor'`; narrows an {@link ElementRecord}. */
  readonly kind: 'capacitor';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The first node; positive current flows from `a` through the element to `b`. */
  readonly a: string;
  /** The second node. */
  readonly b: string;
  /** Capacitance in F (≥ 0). */
  readonly capacitance: number;
}
/** An inductor between nodes `a` and `b`. */
export interface InductorRecord {
  /** Always `'inductor'`; narrows an {@link ElementRecord}. */
  readonly kind: 'inductor';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The first node; positive current flows from `a` through the element to `b`. */
  readonly a: string;
  /** The second node. */
  readonly b: string;
  /** Inductance in H (≥ 0). */
  readonly inductance: number;
}
/** An independent voltage source. */
export interface VoltageSourceRecord {
  /** Always `'voltage-source'`; narrows an {@link ElementRecord}. */
  readonly kind: 'voltage-source';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The positive node; the source current flows from `plus` through the source to `minus`. */
  readonly plus: string;
  /** The negative node. */
  readonly minus: string;
  /** The DC value, in V. */
  readonly dc: number;
  /** The AC excitation (peak magnitude and phase in degrees); magnitude 0 for none. */
  readonly ac: AcExcitation;
}
/** An independent current source; positive current flows from `from` through the source into `to`. */
export interface CurrentSourceRecord {
  /** Always `'current-source'`; narrows an {@link ElementRecord}. */
  readonly kind: 'current-source';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The node the source current is drawn from; it flows through the source into `to`. */
  readonly from: string;
  /** The node the source current enters. */
  readonly to: string;
  /** The DC value, in A, flowing from `from` into `to`. */
  readonly dc: number;
  /** The AC excitation (peak magnitude and phase in degrees); magnitude 0 for none. */
  readonly ac: AcExcitation;
}
/** A voltage-controlled voltage source. */
export interface VcvsRecord {
  /** Always `'vcvs'`; narrows an {@link ElementRecord}. */
  readonly kind: 'vcvs';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The positive output node. */
  readonly outPlus: string;
  /** The negative output node. */
  readonly outMinus: string;
  /** The positive controlling node. */
  readonly controlPlus: string;
  /** The negative controlling node. */
  readonly controlMinus: string;
  /** Voltage gain: v(out) = gain · v(control). */
  readonly gain: number;
}
/** A voltage-controlled current source. */
export interface VccsRecord {
  /** Always `'vccs'`; narrows an {@link ElementRecord}. */
  readonly kind: 'vccs';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The output node the current is drawn from. */
  readonly outFrom: string;
  /** The output node the current is delivered into. */
  readonly outTo: string;
  /** The positive controlling node. */
  readonly controlPlus: string;
  /** The negative controlling node. */
  readonly controlMinus: string;
  /** Transconductance in S: gm·v(control) flows from `outFrom` through the source into `outTo`. */
  readonly transconductance: number;
}
/** A current-controlled voltage source. */
export interface CcvsRecord {
  /** Always `'ccvs'`; narrows an {@link ElementRecord}. */
  readonly kind: 'ccvs';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The positive output node. */
  readonly outPlus: string;
  /** The negative output node. */
  readonly outMinus: string;
  /** The element whose current controls the source (a voltage source, inductor, vcvs, ccvs or loop probe). */
  readonly control: string;
  /** Transresistance in Ω: v(out) = transresistance · i(control). */
  readonly transresistance: number;
}
/** A current-controlled current source. */
export interface CccsRecord {
  /** Always `'cccs'`; narrows an {@link ElementRecord}. */
  readonly kind: 'cccs';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The output node the current is drawn from. */
  readonly outFrom: string;
  /** The output node the current is delivered into. */
  readonly outTo: string;
  /** The element whose current controls the source (a voltage source, inductor, vcvs, ccvs or loop probe). */
  readonly control: string;
  /** Current gain: the output current is gain · i(control). */
  readonly gain: number;
}
/** A loop probe: a 0 V element in series with a feedback loop, where the loop gain is measured. */
export interface LoopProbeRecord {
  /** Always `'loop-probe'`; narrows an {@link ElementRecord}. */
  readonly kind: 'loop-probe';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The node on the side that drives the loop (an amplifier's output); the current flows from here. */
  readonly from: string;
  /** The node on the side the loop feeds; the current flows into it. */
  readonly to: string;
}
/** An op-amp; `options` is undefined for an ideal one. */
export interface OpAmpRecord {
  /** Always `'op-amp'`; narrows an {@link ElementRecord}. */
  readonly kind: 'op-amp';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The non-inverting input node. */
  readonly plus: string;
  /** The inverting input node. */
  readonly minus: string;
  /** The output node. */
  readonly output: string;
  /** The options as given (numbers in SI units), or undefined for an ideal op-amp. */
  readonly options: GivenParameters<OpAmpOptions> | undefined;
}
/** A junction diode. */
export interface DiodeRecord {
  /** Always `'diode'`; narrows an {@link ElementRecord}. */
  readonly kind: 'diode';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The anode node. */
  readonly anode: string;
  /** The cathode node. */
  readonly cathode: string;
  /** The model parameters as given, in SI units; defaults are applied when an analysis compiles the circuit. */
  readonly model: GivenParameters<DiodeModel>;
}
/** A bipolar junction transistor. */
export interface BjtRecord {
  /** Always `'bjt'`; narrows an {@link ElementRecord}. */
  readonly kind: 'bjt';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The collector node. */
  readonly collector: string;
  /** The base node. */
  readonly base: string;
  /** The emitter node. */
  readonly emitter: string;
  /** `'npn'` or `'pnp'`. */
  readonly polarity: 'npn' | 'pnp';
  /** The model parameters as given, in SI units; defaults are applied when an analysis compiles the circuit. */
  readonly model: GivenParameters<BjtModel>;
}
/** A MOSFET; `body` equals `source` unless given. */
export interface MosfetRecord {
  /** Always `'mosfet'`; narrows an {@link ElementRecord}. */
  readonly kind: 'mosfet';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The drain node. */
  readonly drain: string;
  /** The gate node. */
  readonly gate: string;
  /** The source node. */
  readonly source: string;
  /** The body (bulk) node. */
  readonly body: string;
  /** `'nmos'` or `'pmos'`. */
  readonly polarity: 'nmos' | 'pmos';
  /** The model parameters as given, in SI units; defaults are applied when an analysis compiles the circuit. */
  readonly model: GivenParameters<MosfetModel>;
}

/** Any element of a circuit. */
export type ElementRecord =
  | ResistorRecord
  | CapacitorRecord
  | InductorRecord
  | VoltageSourceRecord
  | CurrentSourceRecord
  | VcvsRecord
  | VccsRecord
  | CcvsRecord
  | CccsRecord
  | LoopProbeRecord
  | OpAmpRecord
  | DiodeRecord
  | BjtRecord
  | MosfetRecord;

/** The kind names of the elements. */
export type ElementKind = ElementRecord['kind'];

/** The nodes an element touches, in terminal order, with each terminal's role. */
export function terminalsOf(e: ElementRecord): readonly (readonly [role: string, node: string])[] {
  switch (e.kind) {
    case 'resistor':
    case 'capacitor':
    case 'inductor':
      return [
        ['a', e.a],
        ['b', e.b],
      ];
    case 'voltage-source':
      return [
        ['plus', e.plus],
        ['minus', e.minus],
      ];
    case 'current-source':
      return [
        ['from', e.from],
        ['to', e.to],
      ];
    case 'vcvs':
      return [
        ['outPlus', e.outPlus],
        ['outMinus', e.outMinus],
        ['controlPlus', e.controlPlus],
        ['controlMinus', e.controlMinus],
      ];
    case 'vccs':
      return [
        ['outFrom', e.outFrom],
        ['outTo', e.outTo],
        ['controlPlus', e.controlPlus],
        ['controlMinus', e.controlMinus],
      ];
    case 'ccvs':
      return [
        ['outPlus', e.outPlus],
        ['outMinus', e.outMinus],
      ];
    case 'cccs':
      return [
        ['outFrom', e.outFrom],
        ['outTo', e.outTo],
      ];
    case 'loop-probe':
      return [
        ['from', e.from],
        ['to', e.to],
      ];
    case 'op-amp':
      return [
        ['plus', e.plus],
        ['minus', e.minus],
        ['output', e.output],
      ];
    case 'diode':
      return [
        ['anode', e.anode],
        ['cathode', e.cathode],
      ];
    case 'bjt':
      return [
        ['collector', e.collector],
        ['base', e.base],
        ['emitter', e.emitter],
      ];
    case 'mosfet':
      return [
        ['drain', e.drain],
        ['gate', e.gate],
        ['source', e.source],
        ['body', e.body],
      ];
  }
}

/** Whether an element's current is an unknown of the equations (so it can control a ccvs or cccs). */
export function hasCurrentUnknown(e: ElementRecord): boolean {
  return (
    e.kind === 'voltage-source' ||
    e.kind === 'inductor' ||
    e.kind === 'vcvs' ||
    e.kind === 'ccvs' ||
    e.kind === 'loop-probe'
  );
}
