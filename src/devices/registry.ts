/** The registry of element kinds: one line per kind, and the lookups the rest of the library uses. */
import { BJT } from './bjt/descriptor.js';
import { CAPACITOR } from './capacitor/descriptor.js';
import { CCCS } from './controlled-sources/cccs.js';
import { CCVS } from './controlled-sources/ccvs.js';
import { VCCS } from './controlled-sources/vccs.js';
import { VCVS } from './controlled-sources/vcvs.js';
import { CURRENT_SOURCE } from './current-source/descriptor.js';
import type { AnyDescriptor, KindRegistry } from './descriptor.js';
import type { Device } from './device.js';
import { DIODE } from './diode/descriptor.js';
import { INDUCTOR } from './inductor/descriptor.js';
import { LOOP_PROBE } from './loop-probe/descriptor.js';
import { MOSFET } from './mosfet/descriptor.js';
import { OP_AMP } from './op-amp/descriptor.js';
import type { ElementKind, ElementRecord } from './records.js';
import { RESISTOR } from './resistor/descriptor.js';
import { VOLTAGE_SOURCE } from './voltage-source/descriptor.js';

/** Every element kind's descriptor, keyed by kind. */
export const KINDS: KindRegistry = {
  resistor: RESISTOR,
  capacitor: CAPACITOR,
  inductor: INDUCTOR,
  'voltage-source': VOLTAGE_SOURCE,
  'current-source': CURRENT_SOURCE,
  vcvs: VCVS,
  vccs: VCCS,
  ccvs: CCVS,
  cccs: CCCS,
  'loop-probe': LOOP_PROBE,
  'op-amp': OP_AMP,
  diode: DIODE,
  bjt: BJT,
  mosfet: MOSFET,
};

/** The kind names, in registry order. */
export const ELEMENT_KINDS = Object.keys(KINDS) as readonly ElementKind[];

/** Whether `kind` names an element kind. */
export function isElementKind(kind: unknown): kind is ElementKind {
  return typeof kind === 'string' && Object.hasOwn(KINDS, kind);
}

/** The descriptor of a record's kind, with its readers typed for any record. */
export function descriptorOf(record: ElementRecord): AnyDescriptor {
  return KINDS[record.kind] as unknown as AnyDescriptor;
}

/** The descriptor of a kind, with its readers typed for any record. */
export function descriptorOfKind(kind: ElementKind): AnyDescriptor {
  return KINDS[kind] as unknown as AnyDescriptor;
}

/** Build the compiled device of an element record. */
export function createDevice(record: ElementRecord): Device {
  return descriptorOf(record).create(record);
}

/** Each kind's terminal fields, listed once. */
const TERMINAL_FIELDS = Object.fromEntries(
  ELEMENT_KINDS.map((kind) => [kind, KINDS[kind].terminals.map((t) => t.field as string)]),
) as unknown as Readonly<Record<ElementKind, readonly string[]>>;

/**
 * The record fields holding an element's nodes, in terminal order: the same list for every element
 * of a kind, so that passes over many elements read nodes without building a list per element.
 */
export function terminalFields(record: ElementRecord): readonly string[] {
  return TERMINAL_FIELDS[record.kind];
}

/** The nodes an element touches, in terminal order, with each terminal's record field. */
export function terminalsOf(record: ElementRecord): readonly (readonly [role: string, node: string])[] {
  const fields = record as unknown as Readonly<Record<string, string>>;
  return descriptorOf(record).terminals.map((t) => [t.field, fields[t.field]!] as const);
}

/** Whether an element's current is an unknown of the equations (so it can control a ccvs or cccs). */
export function hasCurrentUnknown(record: ElementRecord): boolean {
  return descriptorOf(record).currentUnknown;
}
