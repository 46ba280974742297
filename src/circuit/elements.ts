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
  readonly magnitude: number;
  readonly phase: number;
}

/** A resistor between nodes `a` and `b`. */
export interface ResistorRecord {
  readonly kind: 'resistor';
  readonly name: string;
  readonly a: string;
  readonly b: string;
  readonly resistance: number;
}
/** A capacitor between nodes `a` and `b`. */
export interface CapacitorRecord {
  readonly kind: 'capacitor';
  readonly name: string;
  readonly a: string;
  readonly b: string;
  readonly capacitance: number;
}
/** An inductor between nodes `a` and `b`. */
export interface InductorRecord {
  readonly kind: 'inductor';
  readonly name: string;
  readonly a: string;
  readonly b: string;
  readonly inductance: number;
}
/** An independent voltage source. */
export interface VoltageSourceRecord {
  readonly kind: 'voltage-source';
  readonly name: string;
  readonly plus: string;
  readonly minus: string;
  readonly dc: number;
  readonly ac: AcExcitation;
}
/** An independent current source; positive current flows from `from` through the source into `to`. */
export interface CurrentSourceRecord {
  readonly kind: 'current-source';
  readonly name: string;
  readonly from: string;
  readonly to: string;
  readonly dc: number;
  readonly ac: AcExcitation;
}
/** A voltage-controlled voltage source. */
export interface VcvsRecord {
  readonly kind: 'vcvs';
  readonly name: string;
  readonly outPlus: string;
  readonly outMinus: string;
  readonly controlPlus: string;
  readonly controlMinus: string;
  readonly gain: number;
}
/** A voltage-controlled current source. */
export interface VccsRecord {
  readonly kind: 'vccs';
  readonly name: string;
  readonly outFrom: string;
  readonly outTo: string;
  readonly controlPlus: string;
  readonly controlMinus: string;
  readonly transconductance: number;
}
/** A current-controlled voltage source. */
export interface CcvsRecord {
  readonly kind: 'ccvs';
  readonly name: string;
  readonly outPlus: string;
  readonly outMinus: string;
  readonly control: string;
  readonly transresistance: number;
}
/** A current-controlled current source. */
export interface CccsRecord {
  readonly kind: 'cccs';
  readonly name: string;
  readonly outFrom: string;
  readonly outTo: string;
  readonly control: string;
  readonly gain: number;
}
/** An op-amp; `options` is undefined for an ideal one. */
export interface OpAmpRecord {
  readonly kind: 'op-amp';
  readonly name: string;
  readonly plus: string;
  readonly minus: string;
  readonly output: string;
  readonly options: GivenParameters<OpAmpOptions> | undefined;
}
/** A junction diode. */
export interface DiodeRecord {
  readonly kind: 'diode';
  readonly name: string;
  readonly anode: string;
  readonly cathode: string;
  readonly model: GivenParameters<DiodeModel>;
}
/** A bipolar junction transistor. */
export interface BjtRecord {
  readonly kind: 'bjt';
  readonly name: string;
  readonly collector: string;
  readonly base: string;
  readonly emitter: string;
  readonly polarity: 'npn' | 'pnp';
  readonly model: GivenParameters<BjtModel>;
}
/** A MOSFET; `body` equals `source` unless given. */
export interface MosfetRecord {
  readonly kind: 'mosfet';
  readonly name: string;
  readonly drain: string;
  readonly gate: string;
  readonly source: string;
  readonly body: string;
  readonly polarity: 'nmos' | 'pmos';
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
  return e.kind === 'voltage-source' || e.kind === 'inductor' || e.kind === 'vcvs' || e.kind === 'ccvs';
}
