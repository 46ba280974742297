/** Any element record, and the record of one kind. */
import type { BjtRecord } from './bjt/record.js';
import type { CapacitorRecord } from './capacitor/record.js';
import type { CccsRecord, CcvsRecord, VccsRecord, VcvsRecord } from './controlled-sources/records.js';
import type { CurrentSourceRecord } from './current-source/record.js';
import type { DiodeRecord } from './diode/record.js';
import type { InductorRecord } from './inductor/record.js';
import type { LoopProbeRecord } from './loop-probe/record.js';
import type { MosfetRecord } from './mosfet/record.js';
import type { OpAmpRecord } from './op-amp/record.js';
import type { ResistorRecord } from './resistor/record.js';
import type { VoltageSourceRecord } from './voltage-source/record.js';

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

/** The record of kind `K`. */
export type RecordOf<K extends ElementKind> = Extract<ElementRecord, { readonly kind: K }>;
