/**
 * Element records: the plain data a circuit is made of. Values are numbers in SI units, already
 * checked; device models keep only the parameters the user gave (defaults are applied when an
 * analysis compiles the circuit), so that a JSON document says no more than the user did. Each
 * record is defined in its kind's folder under src/devices/; this module gathers them.
 */
export type { BjtRecord } from '../devices/bjt/record.js';
export type { CapacitorRecord } from '../devices/capacitor/record.js';
export type {
  CccsRecord,
  CcvsRecord,
  VccsRecord,
  VcvsRecord,
} from '../devices/controlled-sources/records.js';
export type { CurrentSourceRecord } from '../devices/current-source/record.js';
export type { DiodeRecord } from '../devices/diode/record.js';
export type { AcExcitation } from '../devices/excitation.js';
export type { InductorRecord } from '../devices/inductor/record.js';
export type { LoopProbeRecord } from '../devices/loop-probe/record.js';
export type { MosfetRecord } from '../devices/mosfet/record.js';
export type { OpAmpRecord } from '../devices/op-amp/record.js';
export type { GivenParameters } from '../devices/parameters.js';
export type { ElementKind, ElementRecord, RecordOf } from '../devices/records.js';
export { hasCurrentUnknown, terminalsOf } from '../devices/registry.js';
export type { ResistorRecord } from '../devices/resistor/record.js';
export type { VoltageSourceRecord } from '../devices/voltage-source/record.js';
export { GROUND } from '../values/ground.js';
