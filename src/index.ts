/**
 * quiescent: circuit math in TypeScript. Build a circuit, find its DC operating point, linearize every
 * nonlinear part there, solve the small-signal AC response, and say how far from linear each junction runs.
 *
 * @packageDocumentation
 */

export { OperatingPoint, operatingPoint } from './analysis/operating-point.js';
export { DEFAULT_TEMPERATURE, type OperatingPointOptions } from './analysis/options.js';
export type {
  BjtRegion,
  BjtReport,
  DeviceReport,
  DiodeReport,
  MosfetRegion,
  MosfetReport,
} from './analysis/reports.js';
export {
  type BjtTerminals,
  Circuit,
  type MosfetTerminals,
  type OpAmpTerminals,
  type SourceSpec,
} from './circuit/circuit.js';
export {
  type AcExcitation,
  type BjtRecord,
  type CapacitorRecord,
  type CccsRecord,
  type CcvsRecord,
  type CurrentSourceRecord,
  type DiodeRecord,
  type ElementKind,
  type ElementRecord,
  type GivenParameters,
  GROUND,
  type InductorRecord,
  type MosfetRecord,
  type OpAmpRecord,
  type ResistorRecord,
  type VccsRecord,
  type VcvsRecord,
  type VoltageSourceRecord,
} from './circuit/elements.js';
export { type CircuitDocument, DOCUMENT_FORMAT, DOCUMENT_VERSION } from './circuit/json.js';
export type { BjtModel } from './devices/bjt-model.js';
export type { DiodeModel } from './devices/diode-model.js';
export { BOLTZMANN, ELEMENTARY_CHARGE, thermalVoltage } from './devices/junction.js';
export type { MosfetModel } from './devices/mosfet-model.js';
export type { OpAmpOptions } from './devices/op-amp-model.js';
export {
  type DetailsOf,
  type ErrorCode,
  type ErrorDetails,
  QuiescentError,
  type ResidualEntry,
  type StrategyAttempt,
} from './errors/quiescent-error.js';
export {
  type FormatOptions,
  formatValue,
  parseValue,
  quantityName,
  type Unit,
  type Value,
} from './values/index.js';
